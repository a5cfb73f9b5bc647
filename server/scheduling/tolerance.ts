// Tolerance rules (PRODUCT.md, "The computation Keelson owns", point 3): configured per company,
// matched to a routine by interval kind and size, each giving a window before the due point and a
// grace after it.
//
// Conventions, after the IACS booklet "Classification Societies – What, Why and How?" (seen:
// anniversary 15 April, 3 months either side → the survey may be done from 16 January to 15 July,
// overdue after 15 July):
// - The due point of a calendar due day is the end of that ship's day (ship-date.ts).
// - A window of N days or months is the period of that length ending with the due day: it opens at
//   the start of the day after "due day − N" (15 Apr − 3 months = 15 Jan → opens 16 Jan 00:00).
// - A grace of N is the period of that length after the due day: it ends at the end of the day
//   "due day + N" (15 Apr + 3 months → 15 Jul 23:59:59.999).
// - Months are calendar months with date-fns clamping at month ends: 31 May − 3 months is 28 Feb
//   (29 Feb in a leap year), so the window opens 1 March; 30 Nov + 3 months is 28 Feb (29 Feb).
// - A window of 0 opens at the due point itself; a grace of 0 ends there.
// - Hours windows are plain subtraction and addition on the counter's hours.
import { AppError, type FieldError } from "@/server/http/problem";
import { round1 } from "@/server/readings/rules";
import type { CalendarFrequency, CalendarRule } from "./calendar-rule";
import { addShipDays, addShipMonths, endOfShipDate, shipDateOf, startOfShipDate } from "./ship-date";

export type ToleranceKind = "hours" | "calendar";
export type ToleranceUnit = "days" | "months" | "hours" | "percent";
export type ToleranceSpan = { value: number; unit: ToleranceUnit };

export type ToleranceRule = {
  id: string;
  name: string;
  kind: ToleranceKind;
  /** Interval sizes the rule covers, both ends included: hours for kind hours, days for kind calendar. */
  minInterval: number;
  maxInterval: number;
  windowBefore: ToleranceSpan;
  graceAfter: ToleranceSpan;
  /** Hours rules: the most hours a percent window or grace may come to. */
  capHours?: number;
  /** Anchored routines completed inside the window keep their anniversary (due-point.ts). */
  keepsAnniversary: boolean;
  /**
   * Class-survey style: the whole range from the window's opening to the grace's end counts as on
   * time — a survey item done two months after its anniversary is not late (HSSC, IMO Res.
   * A.1104(29) 4.2.1: annual surveys within 3 months before or after each anniversary date) — and
   * the day after it is out of tolerance. Without it the grace is `late`.
   */
  graceOnTime?: boolean;
};

export type ToleranceMatch = { rule: ToleranceRule; basis: "override" | "matched" | "fallback" };

export type CalendarWindow = {
  opensAt: Date;
  dueAt: Date;
  graceEndsAt: Date;
  /** The rule's graceOnTime: the grace is still `window-open`, never `late`. */
  graceOnTime?: boolean;
};
export type HoursWindow = { opensAtHours: number; dueHours: number; graceEndsHours: number };

/** The routine's limits as matching needs them. */
export type RoutineLimits = {
  intervalHours?: number | null;
  calendarRule?: CalendarRule | null;
  /** Company rules chosen on the routine; each overrides matching for its own kind. */
  overrideRuleIds?: readonly string[];
};

/** A mean Gregorian month (365.25 / 12 ≈ 30.44 days), for sizing calendar rules only. */
export const DAYS_PER_MONTH = 365.25 / 12;
const DAYS_PER_PERIOD: Record<CalendarFrequency, number> = {
  DAILY: 1,
  WEEKLY: 7,
  MONTHLY: DAYS_PER_MONTH,
  YEARLY: 365.25,
};

/**
 * A calendar rule's interval size in days, for matching: the period FREQ × INTERVAL (day 1,
 * week 7, month 30.44, year 365.25), rounded to whole days so that whole-day ranges leave no
 * gaps (12 months → 365, 5 years → 1826). BY parts do not change it: "every week on Monday
 * and Thursday" is a 7-day rule.
 */
export function calendarIntervalDays(rule: CalendarRule): number {
  return Math.round(DAYS_PER_PERIOD[rule.frequency] * rule.interval);
}

/**
 * When no company rule covers a routine, Keelson allows no slack: the window opens at the due
 * point and there is no grace, so the work order goes out of tolerance as soon as it is past due
 * and the match says "fallback", for the page to ask the administrator for a rule. Quietly
 * lending a routine some slack would hide a gap in the company's rules. The calendar fallback
 * keeps the anniversary so that the routine's own anchored setting still decides.
 */
export const FALLBACK_TOLERANCE: Record<ToleranceKind, ToleranceRule> = {
  hours: {
    id: "fallback-hours",
    name: "No tolerance rule (strict)",
    kind: "hours",
    minInterval: 0,
    maxInterval: Number.MAX_VALUE,
    windowBefore: { value: 0, unit: "hours" },
    graceAfter: { value: 0, unit: "hours" },
    keepsAnniversary: false,
  },
  calendar: {
    id: "fallback-calendar",
    name: "No tolerance rule (strict)",
    kind: "calendar",
    minInterval: 0,
    maxInterval: Number.MAX_VALUE,
    windowBefore: { value: 0, unit: "days" },
    graceAfter: { value: 0, unit: "days" },
    keepsAnniversary: true,
  },
};

const UNITS_OF_KIND: Record<ToleranceKind, readonly ToleranceUnit[]> = {
  hours: ["hours", "percent"],
  calendar: ["days", "months", "percent"],
};

/** What is wrong with a rule as a company configures it (empty when nothing is). */
export function toleranceRuleProblems(rule: ToleranceRule): FieldError[] {
  const problems: FieldError[] = [];
  const sizeUnit = rule.kind === "hours" ? "hours" : "days";
  if (rule.name.trim() === "") problems.push({ field: "name", message: "Give the rule a name." });
  if (!Number.isFinite(rule.minInterval) || rule.minInterval < 0) {
    problems.push({ field: "minInterval", message: `The smallest interval is 0 ${sizeUnit} or more.` });
  }
  if (!(rule.maxInterval >= rule.minInterval)) {
    problems.push({ field: "maxInterval", message: "The largest interval cannot be below the smallest." });
  }
  for (const field of ["windowBefore", "graceAfter"] as const) {
    const span = rule[field];
    if (!UNITS_OF_KIND[rule.kind].includes(span.unit)) {
      problems.push({
        field: `${field}.unit`,
        message: `A ${rule.kind} rule takes ${UNITS_OF_KIND[rule.kind].join(", ")}.`,
      });
    } else if (!Number.isFinite(span.value) || span.value < 0) {
      problems.push({ field: `${field}.value`, message: "Give 0 or more." });
    } else if (span.unit === "percent" && span.value > 100) {
      problems.push({ field: `${field}.value`, message: "A percentage of the interval goes up to 100." });
    } else if ((span.unit === "days" || span.unit === "months") && !Number.isInteger(span.value)) {
      problems.push({ field: `${field}.value`, message: `Give whole ${span.unit}.` });
    }
  }
  if (rule.capHours !== undefined && (rule.kind !== "hours" || !(rule.capHours > 0))) {
    problems.push({ field: "capHours", message: "A cap is a number of hours above 0, on an hours rule." });
  }
  return problems;
}

/**
 * The rule that decides a routine's window and grace for one kind of limit, or null when the
 * routine has no limit of that kind. An override of that kind wins; otherwise the company rule
 * of that kind whose range holds the interval size, the narrowest range first (the most specific
 * rule), then the lowest id so the choice never depends on the order rows come in.
 */
export function matchToleranceRule(
  rules: readonly ToleranceRule[],
  routine: RoutineLimits,
  kind: ToleranceKind,
): ToleranceMatch | null {
  const size =
    kind === "hours"
      ? (routine.intervalHours ?? null)
      : routine.calendarRule
        ? calendarIntervalDays(routine.calendarRule)
        : null;
  if (size === null) return null;
  const overrides = new Set(routine.overrideRuleIds ?? []);
  const override = rules.find((r) => r.kind === kind && overrides.has(r.id));
  if (override) return { rule: override, basis: "override" };
  const best = rules
    .filter((r) => r.kind === kind && r.minInterval <= size && size <= r.maxInterval)
    .sort(
      (a, b) =>
        a.maxInterval - a.minInterval - (b.maxInterval - b.minInterval) || (a.id < b.id ? -1 : a.id > b.id ? 1 : 0),
    )[0];
  return best ? { rule: best, basis: "matched" } : { rule: FALLBACK_TOLERANCE[kind], basis: "fallback" };
}

function unitError(rule: ToleranceRule, span: ToleranceSpan): AppError {
  return new AppError("invalid-input", `Tolerance rule "${rule.name}": a ${rule.kind} rule cannot use ${span.unit}.`, [
    { field: "unit", message: `A ${rule.kind} rule takes ${UNITS_OF_KIND[rule.kind].join(", ")}.` },
  ]);
}

/** Moves a ship's day by a span: back for a window (sign −1), on for a grace (sign +1). */
function spanEnd(
  day: Date,
  span: ToleranceSpan,
  sign: 1 | -1,
  rule: ToleranceRule,
  intervalDays: number | undefined,
): Date {
  if (span.unit === "months") return addShipMonths(day, sign * span.value);
  if (span.unit === "days") return addShipDays(day, sign * span.value);
  if (span.unit === "percent" && intervalDays !== undefined) {
    return addShipDays(day, sign * Math.round((span.value / 100) * intervalDays));
  }
  if (span.unit === "percent")
    throw new AppError("internal", `Tolerance rule "${rule.name}" is a percentage: the interval in days is needed.`);
  throw unitError(rule, span);
}

/**
 * The window and grace around a calendar due point (any instant on the due ship's day).
 * `intervalDays` is needed for percent spans (calendarIntervalDays of the routine's rule).
 */
export function calendarWindow(
  due: Date,
  rule: ToleranceRule,
  timeZone: string,
  intervalDays?: number,
): CalendarWindow {
  const dueDay = shipDateOf(due, timeZone);
  const dueAt = endOfShipDate(dueDay, timeZone);
  const lastDayBefore = spanEnd(dueDay, rule.windowBefore, -1, rule, intervalDays);
  const opensAt = lastDayBefore < dueDay ? startOfShipDate(addShipDays(lastDayBefore, 1), timeZone) : dueAt;
  const graceEndsAt = endOfShipDate(spanEnd(dueDay, rule.graceAfter, 1, rule, intervalDays), timeZone);
  return { opensAt, dueAt, graceEndsAt, ...(rule.graceOnTime ? { graceOnTime: true } : {}) };
}

function spanHours(span: ToleranceSpan, intervalHours: number, rule: ToleranceRule): number {
  if (span.unit === "hours") return span.value;
  if (span.unit !== "percent") throw unitError(rule, span);
  const hours = (span.value / 100) * intervalHours;
  return rule.capHours === undefined ? hours : Math.min(hours, rule.capHours);
}

/** The window and grace around an hours due point, in counter hours (tenths). */
export function hoursWindow(dueHours: number, intervalHours: number, rule: ToleranceRule): HoursWindow {
  return {
    opensAtHours: round1(dueHours - spanHours(rule.windowBefore, intervalHours, rule)),
    dueHours: round1(dueHours),
    graceEndsHours: round1(dueHours + spanHours(rule.graceAfter, intervalHours, rule)),
  };
}
