// One routine's open work order as the worker writes it: due point, windows and state, from the
// routine, the company's tolerance rules, the last completion and the counter. Pure.
import { parseCalendarRule, type CalendarRule } from "./calendar-rule";
import { computeDuePoint, type CounterPoint, type DuePoint, nextAnchoredDue } from "./due-point";
import {
  calendarIntervalDays,
  calendarWindow,
  type CalendarWindow,
  hoursWindow,
  type HoursWindow,
  matchToleranceRule,
  type ToleranceRule,
} from "./tolerance";
import { endOfShipDate, shipDateFromKey } from "./ship-date";
import { type ToleranceState, workOrderState } from "./work-order-state";

export type PlannedRoutine = {
  intervalHours: number | null;
  calendarRule: string | null;
  anchored: boolean;
  /** "YYYY-MM-DD": the first anniversary of an anchored routine. */
  anchorDate: string | null;
  baseline: CounterPoint | null;
  toleranceRuleId: string | null;
};

/** The last approved completion, with what its work order aimed at (anchored routines need it). */
export type LastCompletion = CounterPoint & { previousCalendarDue: Date | null };

export type WorkOrderPlan = DuePoint & {
  calendarWindow: CalendarWindow | null;
  hoursWindow: HoursWindow | null;
  state: ToleranceState | "deferred";
  /** The rule ids that decided the windows, for the explanation shown to people. */
  rules: { hours: string | null; calendar: string | null };
};

export type PlanInput = {
  routine: PlannedRoutine;
  rules: readonly ToleranceRule[];
  last: LastCompletion | null;
  counter: { totalHours: number; readAt: Date; hoursPerDay: number } | null;
  now: Date;
  timeZone: string;
};

/** "YYYY-MM-DD" → the end of that ship's day in the vessel's zone (the due instant of a day). */
function anchorFromString(day: string, timeZone: string): Date {
  return endOfShipDate(shipDateFromKey(day), timeZone);
}

export function planWorkOrder(input: PlanInput): WorkOrderPlan {
  const { routine, rules, last, counter, now, timeZone } = input;
  const calendarRule: CalendarRule | null = routine.calendarRule ? parseCalendarRule(routine.calendarRule) : null;
  const limits = {
    intervalHours: routine.intervalHours,
    calendarRule,
    overrideRuleIds: routine.toleranceRuleId ? [routine.toleranceRuleId] : [],
  };
  const calendarMatch = calendarRule ? matchToleranceRule(rules, limits, "calendar") : null;
  const hoursMatch = routine.intervalHours ? matchToleranceRule(rules, limits, "hours") : null;
  const anchored = routine.anchored && (calendarMatch?.rule.keepsAnniversary ?? true);

  let anchorDate = routine.anchorDate ? anchorFromString(routine.anchorDate, timeZone) : null;
  if (anchored && calendarRule && calendarMatch && last?.previousCalendarDue) {
    const intervalDays = calendarIntervalDays(calendarRule);
    const window = calendarWindow(last.previousCalendarDue, calendarMatch.rule, timeZone, intervalDays);
    anchorDate =
      nextAnchoredDue({
        previousDue: last.previousCalendarDue,
        completedAt: last.at,
        window,
        period: calendarRule,
        timeZone,
        keepsAnniversary: calendarMatch.rule.keepsAnniversary,
      }).nextDue ?? anchorDate;
  }

  const due = computeDuePoint({
    intervalHours: routine.intervalHours,
    calendarRule,
    anchored,
    lastDone: last,
    baseline: routine.baseline,
    anchorDate,
    counter,
    now,
    timeZone,
  });

  const calWindow =
    due.calendarDue && calendarMatch && calendarRule
      ? calendarWindow(due.calendarDue, calendarMatch.rule, timeZone, calendarIntervalDays(calendarRule))
      : null;
  const hrsWindow =
    due.dueHours !== null && hoursMatch && routine.intervalHours
      ? hoursWindow(due.dueHours, routine.intervalHours, hoursMatch.rule)
      : null;
  const state = workOrderState({
    now,
    currentHours: counter?.totalHours ?? null,
    calendar: calWindow,
    hours: hrsWindow,
  });
  return {
    ...due,
    calendarWindow: calWindow,
    hoursWindow: hrsWindow,
    state,
    rules: { hours: hoursMatch?.rule.id ?? null, calendar: calendarMatch?.rule.id ?? null },
  };
}
