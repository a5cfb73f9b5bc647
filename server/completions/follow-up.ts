// The corrective work order that follows a measurement out of the maker's limits (written under
// the vessel's work-order lock, server/work-orders/lock.ts).
import "server-only";
import { and, eq, isNull, ne, sql } from "drizzle-orm";
import type { Tx } from "@/db/client";
import { vessel, workOrder, workOrderStateChange } from "@/db/schema";
import { workOrderNumber } from "@/server/scheduling/work-order-diff";

/** Days a follow-up has before it is due: a week, long enough to get parts, short enough to matter. */
export const FOLLOW_UP_DAYS = 7;

export function followUpTitle(measurementNames: readonly string[], componentCode: string): string {
  return `Follow-up: ${measurementNames.join(", ")} out of limits on ${componentCode}`;
}

type FollowUp = {
  companyId: string;
  vesselId: string;
  componentId: string;
  componentCode: string;
  doneAt: Date;
  outOfLimits: readonly string[];
  rank: string;
  critical: boolean;
  classRelated: boolean;
  needsEngineStop: boolean;
  now: Date;
};

/**
 * Creates one corrective work order for the values out of limits, unless the same follow-up is
 * still open (a completion resubmitted after correction must not raise it twice). Call it under
 * lockVesselWorkOrders. Returns the new work order's number, or null when none was created.
 */
export async function createFollowUp(tx: Tx, f: FollowUp): Promise<string | null> {
  if (f.outOfLimits.length === 0) return null;
  const title = followUpTitle(f.outOfLimits, f.componentCode);
  const [open] = await tx
    .select({ id: workOrder.id })
    .from(workOrder)
    .where(
      and(
        eq(workOrder.companyId, f.companyId),
        eq(workOrder.vesselId, f.vesselId),
        eq(workOrder.componentId, f.componentId),
        eq(workOrder.kind, "corrective"),
        isNull(workOrder.routineId),
        eq(workOrder.title, title),
        ne(workOrder.state, "done"),
      ),
    )
    .limit(1);
  if (open) return null;

  const [seq] = await tx
    .update(vessel)
    .set({ workOrderSeq: sql`${vessel.workOrderSeq} + 1` })
    .where(and(eq(vessel.companyId, f.companyId), eq(vessel.id, f.vesselId)))
    .returning({ code: vessel.code, sequence: vessel.workOrderSeq });
  if (!seq) throw new Error(`vessel ${f.vesselId} vanished while its completion was recorded`);
  const number = workOrderNumber(seq.code, seq.sequence);
  const dueDate = new Date(f.doneAt.getTime() + FOLLOW_UP_DAYS * 86_400_000);
  const [created] = await tx
    .insert(workOrder)
    .values({
      companyId: f.companyId,
      vesselId: f.vesselId,
      routineId: null,
      componentId: f.componentId,
      number,
      occurrence: 1,
      kind: "corrective",
      title,
      state: "window-open",
      stateChangedAt: f.now,
      dueDate,
      calendarDue: dueDate,
      governing: "calendar",
      rank: f.rank,
      critical: f.critical,
      classRelated: f.classRelated,
      needsEngineStop: f.needsEngineStop,
      computedAt: f.now,
    })
    .returning({ id: workOrder.id });
  await tx.insert(workOrderStateChange).values({
    companyId: f.companyId,
    workOrderId: created!.id,
    fromState: null,
    toState: "window-open",
    changedAt: f.now,
  });
  return number;
}
