// Which RFC 5545 recurrence rules Keelson accepts for a routine, and why a rule is refused, in
// words a chief engineer can act on. Two kinds of check:
// - RFC 5545 section 3.3.10 (seen): FREQ required, UNTIL and COUNT not together, each part at
//   most once, numeric BYDAY only with MONTHLY or YEARLY, BYMONTHDAY not with WEEKLY, value ranges.
// - Keelson's own: maintenance falls due on whole ship's days (no HOURLY, no BYHOUR), and a rule
//   must be sure to fall due again from any start date. rrule 2.8.1 only stops looking when it
//   finds a date or reaches the year 9999: a rule with no date ahead (30 February; "every 12
//   months in June" started in February) kept it busy for 0.2 s (YEARLY) to 8 s (DAILY) per query.
//   So every part that can empty a period is accepted only where each period, or each run of a
//   few periods, is certain to hold a date.

export type CalendarFrequency = "DAILY" | "WEEKLY" | "MONTHLY" | "YEARLY";
export type WeekdayCode = "MO" | "TU" | "WE" | "TH" | "FR" | "SA" | "SU";
export const WEEKDAY_CODES: readonly WeekdayCode[] = ["MO", "TU", "WE", "TH", "FR", "SA", "SU"];

export type ByDay = { ordinal: number | null; weekday: WeekdayCode };

const FREQUENCIES: readonly CalendarFrequency[] = ["DAILY", "WEEKLY", "MONTHLY", "YEARLY"];
const RFC_PARTS = new Set([
  "FREQ",
  "UNTIL",
  "COUNT",
  "INTERVAL",
  "BYSECOND",
  "BYMINUTE",
  "BYHOUR",
  "BYDAY",
  "BYMONTHDAY",
  "BYYEARDAY",
  "BYWEEKNO",
  "BYMONTH",
  "BYSETPOS",
  "WKST",
]);
const REFUSED_PARTS: Record<string, string> = {
  BYHOUR: "Maintenance falls due on whole ship's days: BYHOUR is not used.",
  BYMINUTE: "Maintenance falls due on whole ship's days: BYMINUTE is not used.",
  BYSECOND: "Maintenance falls due on whole ship's days: BYSECOND is not used.",
  BYYEARDAY: "BYYEARDAY is not supported: give the month and day with BYMONTH and BYMONTHDAY.",
  BYWEEKNO: "BYWEEKNO is not supported: use FREQ=WEEKLY with INTERVAL, or BYMONTH with BYDAY.",
};
/** Days a month can have; February counts 29 because leap years come. */
const MONTH_DAYS = [31, 29, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];

/** Splits "FREQ=WEEKLY;BYDAY=MO" into its parts, or says why it cannot. */
export function ruleParts(body: string): Map<string, string> | string {
  const parts = new Map<string, string>();
  for (const segment of body.split(";")) {
    if (segment === "") continue;
    const match = /^([A-Z]+)=([^=]+)$/.exec(segment);
    if (!match) return `"${segment}" is not NAME=VALUE.`;
    const [, name = "", value = ""] = match;
    if (!RFC_PARTS.has(name)) return `${name} is not a rule part of RFC 5545 (section 3.3.10).`;
    if (parts.has(name)) return `${name} is given twice; each rule part may appear once (RFC 5545, 3.3.10).`;
    parts.set(name, value);
  }
  return parts;
}

function integers(value: string): number[] | null {
  const list = value.split(",").map((v) => (/^[+-]?\d{1,4}$/.test(v) ? Number(v) : Number.NaN));
  return list.some((n) => !Number.isInteger(n)) ? null : list;
}

export function byDayList(value: string): ByDay[] | null {
  const list: ByDay[] = [];
  for (const item of value.split(",")) {
    const match = /^([+-]?\d{1,2})?(MO|TU|WE|TH|FR|SA|SU)$/.exec(item);
    if (!match) return null;
    const ordinal = match[1] === undefined ? null : Number(match[1]);
    if (ordinal === 0) return null;
    list.push({ ordinal, weekday: match[2] as WeekdayCode });
  }
  return list;
}

/** A positive whole number, or null. */
function positive(value: string | undefined): number | null {
  if (value === undefined || !/^\d{1,6}$/.test(value)) return null;
  const n = Number(value);
  return n >= 1 ? n : null;
}

/** Why these parts are not a rule Keelson can schedule by, or null when they are. */
export function grammarProblem(parts: Map<string, string>): string | null {
  for (const name of parts.keys()) {
    const refused = REFUSED_PARTS[name];
    if (refused) return refused;
  }
  const freq = parts.get("FREQ");
  if (freq === undefined) return "FREQ is required (RFC 5545, 3.3.10), for example FREQ=MONTHLY;INTERVAL=3.";
  if (["HOURLY", "MINUTELY", "SECONDLY"].includes(freq)) {
    return `Maintenance falls due on whole ship's days: FREQ=${freq} is not used; give short intervals in running hours.`;
  }
  if (!FREQUENCIES.includes(freq as CalendarFrequency)) return "FREQ must be DAILY, WEEKLY, MONTHLY or YEARLY.";
  const frequency = freq as CalendarFrequency;

  if (parts.has("UNTIL") && parts.has("COUNT")) {
    return "UNTIL and COUNT cannot both be given (RFC 5545, 3.3.10): the rule ends on a date or after a number of times.";
  }
  const intervalText = parts.get("INTERVAL");
  const interval = intervalText === undefined ? 1 : positive(intervalText);
  if (interval === null) return "INTERVAL must be a whole number of 1 or more.";
  if (parts.has("COUNT") && positive(parts.get("COUNT")) === null) return "COUNT must be a whole number of 1 or more.";
  const until = parts.get("UNTIL");
  if (until !== undefined && !/^\d{8}(T\d{6}Z?)?$/.test(until)) {
    return "UNTIL must be a date (19971224) or a UTC date and time (19971224T000000Z).";
  }
  const wkst = parts.get("WKST");
  if (wkst !== undefined && !WEEKDAY_CODES.includes(wkst as WeekdayCode))
    return "WKST must be a weekday: MO, TU, WE, TH, FR, SA or SU.";

  const byDayText = parts.get("BYDAY");
  const byDay = byDayText === undefined ? null : byDayList(byDayText);
  if (byDayText !== undefined && byDay === null) {
    return "BYDAY takes weekdays (MO,TU,WE,TH,FR,SA,SU), optionally with a position such as 1FR or -1MO.";
  }
  const monthDaysText = parts.get("BYMONTHDAY");
  const monthDays = monthDaysText === undefined ? null : integers(monthDaysText);
  if (monthDaysText !== undefined && (monthDays === null || monthDays.some((d) => d === 0 || Math.abs(d) > 31))) {
    return "BYMONTHDAY takes days 1 to 31, or -1 (the last day) to -31.";
  }
  const monthsText = parts.get("BYMONTH");
  const months = monthsText === undefined ? null : integers(monthsText);
  if (monthsText !== undefined && (months === null || months.some((m) => m < 1 || m > 12)))
    return "BYMONTH takes months 1 to 12.";

  return (
    byDayProblem(frequency, interval, byDay, months !== null) ??
    monthDayProblem(frequency, interval, monthDays, months, byDay) ??
    monthProblem(frequency, interval, months, monthDays, byDay) ??
    setPosProblem(frequency, parts.get("BYSETPOS"), byDay, monthDays)
  );
}

function byDayProblem(
  freq: CalendarFrequency,
  interval: number,
  byDay: ByDay[] | null,
  hasMonths: boolean,
): string | null {
  if (byDay === null) return null;
  const ordinals = byDay.map((d) => d.ordinal).filter((n): n is number => n !== null);
  // rrule 2.8.1 gives no date at all for a mix such as BYDAY=MO,-1SU (found by a property test).
  if (ordinals.length > 0 && ordinals.length < byDay.length) {
    return "BYDAY takes weekdays all with a position (1FR,-1MO) or all without (MO,FR), not a mix.";
  }
  if (ordinals.length > 0 && (freq === "DAILY" || freq === "WEEKLY")) {
    return "A position in BYDAY (such as 1FR) needs FREQ=MONTHLY or FREQ=YEARLY (RFC 5545, 3.3.10).";
  }
  // Within a month a weekday comes 4 or 5 times; within a year, 52 or 53 times.
  const most = freq === "YEARLY" && !hasMonths ? 53 : 5;
  if (ordinals.some((n) => Math.abs(n) > most))
    return `A position in BYDAY goes from 1 to ${most} (or -1 to -${most}).`;
  if (freq === "DAILY" && interval > 1) {
    return "FREQ=DAILY with BYDAY needs INTERVAL=1: every second day can keep missing the weekday. Use FREQ=WEEKLY with INTERVAL.";
  }
  const rareOnly = ordinals.length === byDay.length && ordinals.every((n) => Math.abs(n) === most);
  if (rareOnly && interval > 1)
    return `A ${most}th weekday does not come in every period: with it, INTERVAL must be 1.`;
  return null;
}

function monthDayProblem(
  freq: CalendarFrequency,
  interval: number,
  monthDays: number[] | null,
  months: number[] | null,
  byDay: ByDay[] | null,
): string | null {
  if (monthDays === null) return null;
  if (freq === "WEEKLY") return "BYMONTHDAY cannot be used with FREQ=WEEKLY (RFC 5545, 3.3.10).";
  if (freq === "DAILY") return "For a day of the month, use FREQ=MONTHLY with BYMONTHDAY.";
  if (byDay !== null) {
    if (byDay.some((d) => d.ordinal !== null))
      return "A position in BYDAY (such as 1FR) cannot be combined with BYMONTHDAY.";
    if (interval > 1) return "BYDAY together with BYMONTHDAY (such as Friday the 13th) needs INTERVAL=1.";
  }
  if (freq === "MONTHLY" && interval > 1 && monthDays.every((d) => Math.abs(d) > 28)) {
    return "Days 29 to 31 are missing from some months: with only those days, INTERVAL must be 1.";
  }
  if (months !== null) {
    const fits = months.flatMap((m) =>
      monthDays.filter((d) => Math.abs(d) <= (MONTH_DAYS[m - 1] ?? 31)).map((d) => [m, d]),
    );
    if (fits.length === 0)
      return "No month in BYMONTH has the days in BYMONTHDAY (such as 30 February), so the rule never falls due.";
    if (fits.every(([m, d]) => m === 2 && Math.abs(d ?? 0) === 29) && interval > 1) {
      return "29 February comes only in leap years: with it alone, INTERVAL must be 1.";
    }
  }
  return null;
}

function monthProblem(
  freq: CalendarFrequency,
  interval: number,
  months: number[] | null,
  monthDays: number[] | null,
  byDay: ByDay[] | null,
): string | null {
  if (months === null) return null;
  if (freq === "DAILY" || freq === "WEEKLY") return "For given months, use FREQ=MONTHLY or FREQ=YEARLY with BYMONTH.";
  if (freq === "MONTHLY" && interval > 1)
    return "FREQ=MONTHLY with INTERVAL above 1 can keep missing the months in BYMONTH: use FREQ=YEARLY with BYMONTH.";
  // Without a day, the start date's day of month is used, which some months lack (31 June).
  if (monthDays === null && byDay === null) return "With BYMONTH, say the day too: BYMONTHDAY=15 or BYDAY=1MO.";
  return null;
}

function setPosProblem(
  freq: CalendarFrequency,
  setPosText: string | undefined,
  byDay: ByDay[] | null,
  monthDays: number[] | null,
): string | null {
  if (setPosText === undefined) return null;
  if (freq !== "MONTHLY" || byDay === null || monthDays !== null || byDay.some((d) => d.ordinal !== null)) {
    return "BYSETPOS is accepted with FREQ=MONTHLY and plain weekdays in BYDAY, for example the last weekday of the month: BYDAY=MO,TU,WE,TH,FR;BYSETPOS=-1.";
  }
  // Each listed weekday comes at least 4 times a month, so positions up to 4 × their number exist.
  const most = 4 * new Set(byDay.map((d) => d.weekday)).size;
  const positions = integers(setPosText);
  if (positions === null || positions.some((p) => p === 0 || Math.abs(p) > most)) {
    return `BYSETPOS goes from 1 to ${most} (or -1 to -${most}) for these weekdays.`;
  }
  return null;
}
