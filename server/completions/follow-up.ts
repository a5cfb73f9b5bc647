// The corrective work order that follows a measurement out of the maker's limits (written under
// the vessel's work-order lock, server/work-orders/lock.ts).
import "server-only";
import { and, eq, isNull, ne } from "drizzle-orm";
import type { Tx } from "@/db/client";
import { workOrder, workOrderStateChange } from "@/db/schema";
import { nextWorkOrderNumber } from "@/server/work-orders/number";
import { insertDefect } from "@/server/defects/queries";

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
  /** Who recorded the values: the defect's reporter. */
  reportedBy?: string | null;
  /** The values and limits, in words, for the defect's details. */
  measured?: string;
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

  const { number, vesselCode } = await nextWorkOrderNumber(tx, f.companyId, f.vesselId);
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
  // One kind of unplanned work: the follow-up is a defect report, planned a week ahead.
  await insertDefect(tx, {
    companyId: f.companyId,
    vesselId: f.vesselId,
    vesselCode,
    componentId: f.componentId,
    workOrderId: created!.id,
    title: `${f.outOfLimits.join(", ")} out of limits`,
    description: f.measured ?? "",
    foundAt: f.doneAt,
    reportedBy: f.reportedBy ?? null,
    source: "measurement",
    affectsCritical: f.critical,
    affectsSafety: false,
    affectsClass: f.classRelated,
    needsEngineStop: f.needsEngineStop,
    plannedAt: f.now,
  });
  return number;
}
