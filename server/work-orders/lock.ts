// The lock every writer of a vessel's work orders takes — the worker's recompute, completions,
// decisions, planned days, port-stay packages — so numbers, states and plans never collide.
import "server-only";
import { and, eq, sql } from "drizzle-orm";
import type { Tx } from "@/db/client";
import { workOrder } from "@/db/schema";
import type { Access, VesselRef } from "@/server/auth/access";
import { AppError } from "@/server/http/problem";

/** One writer of a vessel's work orders at a time, until the transaction ends. */
export async function lockVesselWorkOrders(tx: Tx, vesselId: string): Promise<void> {
  await tx.execute(sql`select pg_advisory_xact_lock(hashtextextended(${`recompute:${vesselId}`}, 0))`);
}

export function noSuchWorkOrder(): AppError {
  return new AppError("not-found", "There is no such work order on this vessel.");
}

/**
 * Takes the vessel's lock, then the work order's row (FOR UPDATE), of this company and vessel
 * only; anything else — another vessel's id, a malformed id — is not found.
 */
export async function lockWorkOrder(tx: Tx, access: Access, vessel: VesselRef, workOrderId: string) {
  await lockVesselWorkOrders(tx, vessel.id);
  const [row] = await tx
    .select()
    .from(workOrder)
    .where(
      and(eq(workOrder.companyId, access.company.id), eq(workOrder.vesselId, vessel.id), eq(workOrder.id, workOrderId)),
    )
    .for("update");
  if (!row) throw noSuchWorkOrder();
  return row;
}
