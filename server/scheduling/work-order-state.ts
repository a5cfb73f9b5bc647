// The state of an open work order against its tolerance windows (PRODUCT.md, "Names":
// scheduled → window-open → late → out-of-tolerance). `done` is set by the completion, not here.
//
// Boundaries are inclusive of the due point and of the grace's end: work due on 15 April is
// window-open all of 15 April, and an hours limit of 14,100 h is still late at exactly 14,100 h
// (out of tolerance past it).
import { TOLERANCE_STATES, type ToleranceState, type WorkOrderState } from "@/db/schema/work-order-states";
import type { CalendarWindow, HoursWindow } from "./tolerance";

export { TOLERANCE_STATES, type ToleranceState, type WorkOrderState };

export function toleranceRank(state: ToleranceState): number {
  return TOLERANCE_STATES.indexOf(state);
}

export function calendarState(now: Date, window: CalendarWindow): ToleranceState {
  const state = calendarLimitState(now, window);
  return state === "late" && window.graceOnTime ? "window-open" : state;
}

/** The calendar state before a class-style rule counts its grace on time: past due is `late`. */
function calendarLimitState(now: Date, window: CalendarWindow): ToleranceState {
  if (now < window.opensAt) return "scheduled";
  if (now <= window.dueAt) return "window-open";
  if (now <= window.graceEndsAt) return "late";
  return "out-of-tolerance";
}

export function hoursState(currentHours: number, window: HoursWindow): ToleranceState {
  if (currentHours < window.opensAtHours) return "scheduled";
  if (currentHours <= window.dueHours) return "window-open";
  if (currentHours <= window.graceEndsHours) return "late";
  return "out-of-tolerance";
}

export type WorkOrderStateInput = {
  now: Date;
  /** The counter's latest total; null when it has no reading yet (the hours limit is then not judged). */
  currentHours: number | null;
  calendar?: CalendarWindow | null;
  hours?: HoursWindow | null;
  /**
   * An approved deferral is in force. Pass the windows of the deferred-to due point: the work
   * order shows `deferred` until that new due point passes; then the tolerance rules apply to
   * it as to any limit — `late` inside its grace, `out-of-tolerance` past it, so that
   * escalation still fires.
   */
  deferred?: boolean;
};

/**
 * The state of an open work order. With both an hours and a calendar limit ("whichever
 * first"), the limit further along decides.
 */
export function workOrderState(input: WorkOrderStateInput): ToleranceState | "deferred" {
  const states: ToleranceState[] = [];
  // Past due, before any grace counts as on time: a deferral shows only until its new due point.
  const pastDue: ToleranceState[] = [];
  if (input.calendar) {
    // A date agreed in a deferral is a hard limit: past it the work is late even under a rule that
    // counts its grace on time (that is class's window around the anniversary, spent by the deferral).
    states.push(input.deferred ? calendarLimitState(input.now, input.calendar) : calendarState(input.now, input.calendar));
    pastDue.push(calendarLimitState(input.now, input.calendar));
  }
  if (input.hours && input.currentHours !== null) {
    const state = hoursState(input.currentHours, input.hours);
    states.push(state);
    pastDue.push(state);
  }
  const furthest = (list: ToleranceState[]) =>
    list.reduce<ToleranceState>((a, b) => (toleranceRank(b) > toleranceRank(a) ? b : a), "scheduled");
  if (input.deferred && toleranceRank(furthest(pastDue)) <= toleranceRank("window-open")) return "deferred";
  return furthest(states);
}

/** Escalation fires once, on the change into out-of-tolerance (a new work order counts as a change). */
export function escalationNeeded(previous: WorkOrderState | null, next: WorkOrderState): boolean {
  return next === "out-of-tolerance" && previous !== "out-of-tolerance";
}
