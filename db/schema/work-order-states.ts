// The states of a work order, as plain values: the `work_order_state` enum is built from them
// (work-orders.ts), and pure rules and client components import them without drizzle.

/** In the order a work order passes through them when nothing is done (PRODUCT.md, "Names"). */
export const TOLERANCE_STATES = ["scheduled", "window-open", "late", "out-of-tolerance"] as const;
export type ToleranceState = (typeof TOLERANCE_STATES)[number];

/** The enum's values, in the order the migrations created them. */
export const WORK_ORDER_STATES = [...TOLERANCE_STATES, "deferred", "done"] as const;
export type WorkOrderState = (typeof WORK_ORDER_STATES)[number];
export type OpenState = Exclude<WorkOrderState, "done">;

/**
 * Open states, most urgent first: the Backlog's default order, the Calendar's within a day and
 * the work package's within a tier. Deferred work has an agreed new limit, so it comes after work
 * whose window is open.
 */
export const OPEN_STATES_BY_URGENCY = [
  "out-of-tolerance",
  "late",
  "window-open",
  "deferred",
  "scheduled",
] as const satisfies readonly OpenState[];

/** Every state most urgent first, done last. */
export const STATES_BY_URGENCY = [...OPEN_STATES_BY_URGENCY, "done"] as const satisfies readonly WorkOrderState[];

/** Past the due point: the fleet's overdue list. */
export const OVERDUE_STATES = ["out-of-tolerance", "late"] as const satisfies readonly OpenState[];

/** The states that ask for attention: a digest reports a change into one of them. */
export const ATTENTION_STATES = ["window-open", "late", "out-of-tolerance"] as const satisfies readonly OpenState[];

export function asksAttention(state: WorkOrderState): boolean {
  return (ATTENTION_STATES as readonly WorkOrderState[]).includes(state);
}

/** 0 for the most urgent state, done last. */
export function urgencyRank(state: WorkOrderState): number {
  return STATES_BY_URGENCY.indexOf(state);
}
