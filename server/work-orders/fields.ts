// A work order's columns by what they hold, each group named once: the writer writes them
// (server/scheduling/work-order-writer.ts) and the lists and pages show them (workOrderView).
// Plain values and types only, so contracts that client components import can use them.
import type { workOrder } from "@/db/schema";

export type WorkOrderRow = typeof workOrder.$inferSelect;
export type WorkOrderField = keyof WorkOrderRow;

/** How every list names a work order. */
export const HEADING_FIELDS = ["id", "number", "title", "state"] as const satisfies readonly WorkOrderField[];

/** The due point and its tolerance windows, as the worker last computed them. */
export const DUE_FIELDS = [
  "dueDate",
  "dueHours",
  "projectedDate",
  "calendarDue",
  "governing",
  "windowOpensAt",
  "graceEndsAt",
  "windowOpensHours",
  "graceEndsHours",
  "remainingHours",
  "remainingDays",
] as const satisfies readonly WorkOrderField[];

/** The ship's days the work may be planned on, and when it goes out of tolerance (the worker's). */
export const PLAN_RANGE_FIELDS = [
  "planFrom",
  "planUntil",
  "outOfToleranceAt",
] as const satisfies readonly WorkOrderField[];

/** Who does the job and what it asks for, copied from its routine. */
export const JOB_FIELDS = [
  "rank",
  "team",
  "elapsedHours",
  "estimatedManHours",
  "needsPort",
  "needsEngineStop",
  "portEvent",
  "portEventHours",
  "critical",
  "classRelated",
] as const satisfies readonly WorkOrderField[];

/** Everything the worker writes on each run, beside the state. */
export const WRITTEN_FIELDS = [
  "componentId",
  "counterId",
  "title",
  ...DUE_FIELDS,
  ...PLAN_RANGE_FIELDS,
  ...JOB_FIELDS,
] as const satisfies readonly WorkOrderField[];
export type WrittenFields = Pick<WorkOrderRow, (typeof WRITTEN_FIELDS)[number]>;
