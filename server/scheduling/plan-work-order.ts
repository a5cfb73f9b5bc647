// One routine's open work order as the worker writes it: due point, windows and state, from the
// routine, the company's tolerance rules, the last completion and the counter. Pure.
import { parseCalendarRule, type CalendarRule } from "./calendar-rule";
import { computeDuePoint, type CounterPoint, type DuePoint, nextAnchoredDue } from "./due-point";
import { shipDayKey } from "@/server/format/ship-day";
import { round1 } from "@/server/readings/rules";
import {
  calendarIntervalDays,
  calendarWindow,
  type CalendarWindow,
  FALLBACK_TOLERANCE,
  hoursWindow,
  type HoursWindow,
  matchToleranceRule,
  type ToleranceRule,
} from "./tolerance";
import { addShipDays, endOfShipDate, shipDateFromKey, shipDateOf, shipDaysBetween, startOfShipDate } from "./ship-date";
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

/** The new limit of an approved deferral: a date, running hours, or both. */
export type DeferredLimit = { dueDate: Date | null; dueHours: number | null };

/** Where the work may be planned and when it goes out of tolerance (hours projected). */
export type PlanRange = {
  /** First ship's day ("YYYY-MM-DD") a window is open; null when no window can be dated. */
  planFrom: string | null;
  /** Last ship's day inside the earlier grace; null when no grace end can be dated. */
  planUntil: string | null;
  outOfToleranceAt: Date | null;
};

export type WorkOrderPlan = DuePoint &
  PlanRange & {
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
  counter: {
    totalHours: number;
    readAt: Date;
    hoursPerDay: number;
    passedAt?: (hours: number) => Date | null;
  } | null;
  now: Date;
  timeZone: string;
  /** An approved deferral in force: its limits replace the routine's. */
  deferral?: DeferredLimit | null;
};

type CounterNow = NonNullable<PlanInput["counter"]>;

/** When the counter reaches `hours` at its running rate; null at a rate of 0 or with no counter. */
export function projectHours(hours: number, counter: CounterNow | null): Date | null {
  // Hours already passed are dated by the readings, so the date stays as new readings arrive.
  const passed = counter && hours <= counter.totalHours ? (counter.passedAt?.(hours) ?? null) : null;
  if (passed) return passed;
  if (!counter || !(counter.hoursPerDay > 0)) return null;
  return new Date(counter.readAt.getTime() + ((hours - counter.totalHours) / counter.hoursPerDay) * 86_400_000);
}

const earliest = (dates: (Date | null)[]): Date | null =>
  dates.reduce<Date | null>((a, b) => (b && (!a || b < a) ? b : a), null);

/**
 * The ship's days a work order may be planned on: from the first window to open to the end of
 * the first grace to end ("whichever first": past the earlier grace the work is out of
 * tolerance). Hours limits are dated by the running rate.
 */
export function planRange(
  windows: { calendar: CalendarWindow | null; hours: HoursWindow | null },
  counter: CounterNow | null,
  timeZone: string,
): PlanRange {
  const { calendar, hours } = windows;
  const opens = earliest([calendar?.opensAt ?? null, hours ? projectHours(hours.opensAtHours, counter) : null]);
  const outOfToleranceAt = earliest([
    calendar?.graceEndsAt ?? null,
    hours ? projectHours(hours.graceEndsHours, counter) : null,
  ]);
  const day = (d: Date | null) => (d ? shipDayKey(d.getTime(), timeZone) : null);
  return { planFrom: day(opens), planUntil: day(outOfToleranceAt), outOfToleranceAt };
}

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
  const rulesUsed = { hours: hoursMatch?.rule.id ?? null, calendar: calendarMatch?.rule.id ?? null };
  if (input.deferral) {
    const routineWindows = { calendar: calWindow, hours: hrsWindow };
    return deferredPlan(
      input.deferral,
      due,
      { calendarMatch, hoursMatch, calendarRule },
      routineWindows,
      input,
      rulesUsed,
    );
  }
  const state = workOrderState({
    now,
    currentHours: counter?.totalHours ?? null,
    calendar: calWindow,
    hours: hrsWindow,
  });
  return {
    ...due,
    ...planRange({ calendar: calWindow, hours: hrsWindow }, counter, timeZone),
    calendarWindow: calWindow,
    hoursWindow: hrsWindow,
    state,
    rules: rulesUsed,
  };
}

/**
 * A work order under an approved deferral. Each limit the deferral names replaces the routine's
 * limit of that kind; a limit it does not name stays in force (deferring the hours of a
 * whichever-first job leaves its calendar limit as it was — the request said nothing about it).
 * The routine's tolerance rules apply to the new limits: `deferred` until the new due point, then
 * `late` in its grace and `out-of-tolerance` past it. A date on a routine without a calendar rule
 * has no calendar tolerance to borrow, so it gets none (the strict fallback). The computed due
 * point stays as it was; the remaining figures count to the new limits.
 */
function deferredPlan(
  deferral: DeferredLimit,
  due: DuePoint,
  matched: {
    calendarMatch: ReturnType<typeof matchToleranceRule>;
    hoursMatch: ReturnType<typeof matchToleranceRule>;
    calendarRule: CalendarRule | null;
  },
  routineWindows: { calendar: CalendarWindow | null; hours: HoursWindow | null },
  input: PlanInput,
  rules: WorkOrderPlan["rules"],
): WorkOrderPlan {
  const { counter, now, timeZone, routine } = input;
  const calendar = deferral.dueDate
    ? calendarWindow(
        deferral.dueDate,
        matched.calendarMatch?.rule ?? FALLBACK_TOLERANCE.calendar,
        timeZone,
        matched.calendarRule ? calendarIntervalDays(matched.calendarRule) : undefined,
      )
    : routineWindows.calendar;
  const hours =
    deferral.dueHours !== null && routine.intervalHours
      ? hoursWindow(deferral.dueHours, routine.intervalHours, matched.hoursMatch?.rule ?? FALLBACK_TOLERANCE.hours)
      : routineWindows.hours;
  const state = workOrderState({
    now,
    currentHours: counter?.totalHours ?? null,
    calendar,
    hours,
    deferred: true,
  });
  const limitDate = earliest([calendar?.dueAt ?? null, hours ? projectHours(hours.dueHours, counter) : null]);
  return {
    ...due,
    ...planRange({ calendar, hours }, counter, timeZone),
    remainingHours: hours && counter ? round1(hours.dueHours - counter.totalHours) : due.remainingHours,
    remainingDays: limitDate
      ? shipDaysBetween(shipDateOf(now, timeZone), shipDateOf(limitDate, timeZone))
      : due.remainingDays,
    calendarWindow: calendar,
    hoursWindow: hours,
    state,
    rules,
  };
}

/**
 * Days of grace a corrective follow-up has past its due day before it is out of tolerance.
 * Keelson's own choice (no published figure): a week, as long as the time it was given.
 */
export const CORRECTIVE_GRACE_DAYS = 7;

export type CorrectiveInput = {
  /** The follow-up's due instant, set when it was raised. */
  dueDate: Date;
  raisedAt: Date;
  deferral?: DeferredLimit | null;
  now: Date;
  timeZone: string;
};

/**
 * A corrective work order (raised by a measurement out of limits): open from the day it was
 * raised, due on its due day, late for CORRECTIVE_GRACE_DAYS more, then out of tolerance. An
 * approved deferral's date takes the due day's place, with the same grace.
 */
export function planCorrective(
  input: CorrectiveInput,
): Pick<WorkOrderPlan, "state" | "calendarWindow" | "remainingDays" | keyof PlanRange> {
  const { now, timeZone } = input;
  const dueDay = shipDateOf(input.deferral?.dueDate ?? input.dueDate, timeZone);
  const window: CalendarWindow = {
    opensAt: startOfShipDate(shipDateOf(input.raisedAt, timeZone), timeZone),
    dueAt: endOfShipDate(dueDay, timeZone),
    graceEndsAt: endOfShipDate(addShipDays(dueDay, CORRECTIVE_GRACE_DAYS), timeZone),
  };
  if (window.opensAt > window.dueAt) window.opensAt = startOfShipDate(dueDay, timeZone);
  return {
    state: workOrderState({ now, currentHours: null, calendar: window, deferred: Boolean(input.deferral?.dueDate) }),
    calendarWindow: window,
    remainingDays: shipDaysBetween(shipDateOf(now, timeZone), dueDay),
    ...planRange({ calendar: window, hours: null }, null, timeZone),
  };
}
