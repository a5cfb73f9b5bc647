// Calendar rules of routines: RFC 5545 RRULE strings (section 3.3.10), evaluated with the `rrule`
// package on whole ship's days (see ship-date.ts for the floating-date convention).
//
// Conventions:
// - A rule is stored without DTSTART: the start comes from the routine (its last completion for a
//   floating routine, its anniversary for an anchored one) and is passed in.
// - An occurrence is a ship's day; its due instant is the end of that day (endOfShipDate).
// - UNTIL: a date (19971224) is the last ship's day that may fall due; a UTC date-time
//   (19971224T000000Z, RFC 5545's form when DTSTART has a zone) is turned into the ship's day it
//   falls on in the vessel's zone. Occurrences count from the start of their day, so a day is in
//   when it starts at or before UNTIL, as RFC 5545 makes UNTIL inclusive.
// - A plain "every N months / years" (FREQ=MONTHLY or YEARLY with no BY part) keeps the start's
//   day of month, or the month's last day when the month is shorter: from 30 Nov, 3 months on is
//   28 Feb. RFC 5545 (and rrule) would skip a month without that day instead (from 31 Jan,
//   FREQ=MONTHLY gives 31 Mar, never February; from 29 Feb, FREQ=YEARLY waits four years), which
//   for maintenance would silently double the interval. Rules with BY parts follow RFC 5545.
import * as rruleModule from "rrule";
import type { Options } from "rrule";
import { invalidInput } from "@/server/http/problem";
import { grammarProblem, ruleParts, type CalendarFrequency } from "./calendar-rule-grammar";
import { addShipMonths, endOfShipDate, shipDateFromKey, shipDateOf, shipDaysBetween } from "./ship-date";

export type { CalendarFrequency, WeekdayCode } from "./calendar-rule-grammar";

// rrule 2.8.1's `main` is a CommonJS bundle: plain Node (the worker runs under tsx) offers it as
// the default export only, while bundlers and vitest give the named exports.
const rrule: typeof rruleModule =
  "RRule" in rruleModule && typeof rruleModule.RRule === "function"
    ? rruleModule
    : (rruleModule as unknown as { default: typeof rruleModule }).default;
const { RRule } = rrule;

export type RuleUntil = { kind: "day"; day: Date } | { kind: "instant"; at: Date };

export type CalendarRule = {
  /** As stored: upper case, without the "RRULE:" prefix, e.g. "FREQ=MONTHLY;INTERVAL=3". */
  readonly text: string;
  readonly frequency: CalendarFrequency;
  readonly interval: number;
  readonly count: number | null;
  readonly until: RuleUntil | null;
  /** The rule's parts by name, e.g. BYDAY → "MO,FR". */
  readonly parts: ReadonlyMap<string, string>;
  /** rrule's options without DTSTART, COUNT and UNTIL, which Keelson applies itself. */
  readonly options: Partial<Options>;
};

const PLAIN_PARTS = new Set(["FREQ", "INTERVAL", "COUNT", "UNTIL", "WKST"]);

function normalise(text: string): string {
  return text
    .trim()
    .toUpperCase()
    .replace(/^RRULE:/, "");
}

/** Why the text is not a calendar rule Keelson can schedule by, or null when it is. */
export function calendarRuleProblem(text: string): string | null {
  const result = tryParse(text);
  return typeof result === "string" ? result : null;
}

/** Parses and checks an RRULE; throws a 422 AppError on the `calendarRule` field when it is not valid. */
export function parseCalendarRule(text: string): CalendarRule {
  const result = tryParse(text);
  if (typeof result === "string") throw invalidInput([{ field: "calendarRule", message: result }]);
  return result;
}

function tryParse(text: string): CalendarRule | string {
  const body = normalise(text);
  if (body === "") return "Enter a calendar rule, for example FREQ=MONTHLY;INTERVAL=3.";
  if (/[\n:]|DTSTART/.test(body)) return "Give the rule alone (FREQ=…;…): the start date comes from the routine.";
  const parts = ruleParts(body);
  if (typeof parts === "string") return parts;
  const problem = grammarProblem(parts);
  if (problem) return problem;
  let options: Partial<Options>;
  try {
    options = RRule.parseString(body);
  } catch (error) {
    return `The rule could not be read: ${error instanceof Error ? error.message : String(error)}.`;
  }
  const { dtstart: _dtstart, until: _until, count: _count, tzid: _tzid, ...rest } = options;
  const untilText = parts.get("UNTIL");
  const countText = parts.get("COUNT");
  return {
    text: body,
    frequency: parts.get("FREQ") as CalendarFrequency,
    interval: Number(parts.get("INTERVAL") ?? "1"),
    count: countText === undefined ? null : Number(countText),
    until: untilText === undefined ? null : readUntil(untilText),
    parts,
    options: rest,
  };
}

function readUntil(value: string): RuleUntil {
  const day = shipDateFromKey(`${value.slice(0, 4)}-${value.slice(4, 6)}-${value.slice(6, 8)}`);
  if (!value.endsWith("Z")) return { kind: "day", day };
  const at = new Date(
    Date.UTC(
      day.getUTCFullYear(),
      day.getUTCMonth(),
      day.getUTCDate(),
      Number(value.slice(9, 11)),
      Number(value.slice(11, 13)),
      Number(value.slice(13, 15)),
    ),
  );
  return { kind: "instant", at };
}

function asRule(rule: CalendarRule | string): CalendarRule {
  return typeof rule === "string" ? parseCalendarRule(rule) : rule;
}

/** True for "every N months / years" with no BY part: stepped with month-end clamping. */
export function isPlainMonthRule(rule: CalendarRule): boolean {
  return (
    (rule.frequency === "MONTHLY" || rule.frequency === "YEARLY") &&
    [...rule.parts.keys()].every((k) => PLAIN_PARTS.has(k))
  );
}

type Series = {
  rule: CalendarRule;
  start: Date;
  lastDay: Date | null;
};

function series(rule: CalendarRule, dtstart: Date, timeZone: string): Series {
  const until = rule.until;
  const lastDay = until === null ? null : until.kind === "day" ? until.day : shipDateOf(until.at, timeZone);
  return { rule, start: shipDateOf(dtstart, timeZone), lastDay };
}

function rruleOf(s: Series): InstanceType<typeof RRule> {
  return new RRule({ ...s.rule.options, dtstart: s.start, until: s.lastDay, count: s.rule.count, tzid: null });
}

const monthStep = (rule: CalendarRule) => rule.interval * (rule.frequency === "YEARLY" ? 12 : 1);

/** The k-th day of a plain month rule (k = 0 is the start), or null past COUNT or UNTIL. */
function plainDay(s: Series, k: number): Date | null {
  if (s.rule.count !== null && k >= s.rule.count) return null;
  const day = addShipMonths(s.start, k * monthStep(s.rule));
  return s.lastDay !== null && day > s.lastDay ? null : day;
}

/** The first k whose day might be on or after `day` (a safe under-estimate). */
function plainIndexNear(s: Series, day: Date): number {
  const months = (day.getUTCFullYear() - s.start.getUTCFullYear()) * 12 + day.getUTCMonth() - s.start.getUTCMonth();
  return Math.max(0, Math.floor(months / monthStep(s.rule)) - 1);
}

function firstDayAfter(s: Series, afterDay: Date): Date | null {
  if (!isPlainMonthRule(s.rule)) return rruleOf(s).after(afterDay, false);
  for (let k = plainIndexNear(s, afterDay); ; k += 1) {
    const day = plainDay(s, k);
    if (day === null || day > afterDay) return day;
  }
}

/**
 * The due instant (end of the ship's day) of the rule's first occurrence on a ship's day after
 * the day `after` falls on, counting the series from the day `dtstart` falls on (which is itself
 * an occurrence when it matches, RFC 5545 3.8.5.3). Null when the rule has ended.
 */
export function nextOccurrenceAfter(
  rule: CalendarRule | string,
  dtstart: Date,
  after: Date,
  timeZone: string,
): Date | null {
  const s = series(asRule(rule), dtstart, timeZone);
  const day = firstDayAfter(s, shipDateOf(after, timeZone));
  return day === null ? null : endOfShipDate(day, timeZone);
}

/** Due instants of the occurrences on the ship's days from `from`'s day to `to`'s day, both included. */
export function occurrencesBetween(
  rule: CalendarRule | string,
  dtstart: Date,
  from: Date,
  to: Date,
  timeZone: string,
): Date[] {
  const s = series(asRule(rule), dtstart, timeZone);
  const fromDay = shipDateOf(from, timeZone);
  const toDay = shipDateOf(to, timeZone);
  let days: Date[];
  if (isPlainMonthRule(s.rule)) {
    days = [];
    for (let k = plainIndexNear(s, fromDay); ; k += 1) {
      const day = plainDay(s, k);
      if (day === null || day > toDay) break;
      if (shipDaysBetween(fromDay, day) >= 0) days.push(day);
    }
  } else {
    days = rruleOf(s).between(fromDay, toDay, true);
  }
  return days.map((day) => endOfShipDate(day, timeZone));
}
