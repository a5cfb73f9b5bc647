// The next work order number of a vessel (WO-<code>-<sequence>), for work raised outside the
// worker's recompute: follow-ups and defect reports. Call it under lockVesselWorkOrders.
import "server-only";
import { and, eq, sql } from "drizzle-orm";
import type { Tx } from "@/db/client";
import { vessel } from "@/db/schema";
import { workOrderNumber } from "@/server/scheduling/work-order-diff";

export async function nextWorkOrderNumber(tx: Tx, companyId: string, vesselId: string): Promise<{ number: string; vesselCode: string }> {
  const [seq] = await tx
    .update(vessel)
    .set({ workOrderSeq: sql`${vessel.workOrderSeq} + 1` })
    .where(and(eq(vessel.companyId, companyId), eq(vessel.id, vesselId)))
    .returning({ code: vessel.code, sequence: vessel.workOrderSeq });
  if (!seq) throw new Error(`vessel ${vesselId} vanished while work was raised on it`);
  return { number: workOrderNumber(seq.code, seq.sequence), vesselCode: seq.code };
}
