// Calendar rules in plain words, and the routine form's friendly fields ("every 3 months",
// "every week on Monday") to and from the stored RRULE.
import { invalidInput } from "@/server/http/problem";
import { parseCalendarRule, type CalendarRule } from "./calendar-rule";
import { byDayList, WEEKDAY_CODES, type ByDay, type WeekdayCode } from "./calendar-rule-grammar";

export type CalendarUnit = "day" | "week" | "month" | "year";

export type CalendarRuleForm = { every: number; unit: CalendarUnit; weekdays?: WeekdayCode[] };

const FREQ_OF_UNIT: Record<CalendarUnit, string> = { day: "DAILY", week: "WEEKLY", month: "MONTHLY", year: "YEARLY" };
const UNIT_OF_FREQ: Record<string, CalendarUnit> = { DAILY: "day", WEEKLY: "week", MONTHLY: "month", YEARLY: "year" };
const WEEKDAY_NAMES: Record<WeekdayCode, string> = {
  MO: "Monday",
  TU: "Tuesday",
  WE: "Wednesday",
  TH: "Thursday",
  FR: "Friday",
  SA: "Saturday",
  SU: "Sunday",
};
const MONTH_NAMES = [
  "January",
  "February",
  "March",
  "April",
  "May",
  "June",
  "July",
  "August",
  "September",
  "October",
  "November",
  "December",
];
const POSITIONS = ["first", "second", "third", "fourth", "fifth"];
const SHORT_MONTHS = ["Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"];
/** The longest "every" the form offers (common practice: no routine repeats rarer than this). */
export const MOST_EVERY = 999;

/** "a", "a and b", "a, b and c" */
function wordList(items: string[]): string {
  if (items.length <= 1) return items.join("");
  return `${items.slice(0, -1).join(", ")} and ${items.at(-1)}`;
}

function sortedWeekdays(days: readonly WeekdayCode[]): WeekdayCode[] {
  return WEEKDAY_CODES.filter((code) => days.includes(code));
}

/** The form's fields as a stored RRULE; throws a 422 AppError naming the field when they do not fit. */
export function calendarRuleFromForm(form: CalendarRuleForm): string {
  if (!Number.isInteger(form.every) || form.every < 1 || form.every > MOST_EVERY) {
    throw invalidInput([
      { field: "every", message: `Repeat every 1 to ${MOST_EVERY} ${form.unit}s, in whole numbers.` },
    ]);
  }
  const weekdays = sortedWeekdays(form.weekdays ?? []);
  if (weekdays.length > 0 && form.unit !== "week") {
    throw invalidInput([{ field: "weekdays", message: "Weekdays go with a rule that repeats by weeks." }]);
  }
  const parts = [`FREQ=${FREQ_OF_UNIT[form.unit]}`];
  if (form.every > 1) parts.push(`INTERVAL=${form.every}`);
  if (weekdays.length > 0) parts.push(`BYDAY=${weekdays.join(",")}`);
  return parts.join(";");
}

/** The form's fields for a stored rule, or null when the rule says more than the form can show. */
export function formFromCalendarRule(rule: CalendarRule | string): CalendarRuleForm | null {
  const r = typeof rule === "string" ? parseCalendarRule(rule) : rule;
  const unit = UNIT_OF_FREQ[r.frequency];
  if (!unit) return null;
  for (const [name, value] of r.parts) {
    if (name === "FREQ" || name === "INTERVAL") continue;
    // The week start only changes weekly rules with an interval and weekdays; MO is the default.
    if (name === "WKST" && value === "MO") continue;
    if (name === "BYDAY" && unit === "week") continue;
    return null;
  }
  const byDay = r.parts.get("BYDAY");
  if (byDay === undefined) return { every: r.interval, unit };
  const days = byDayList(byDay);
  if (days === null || days.some((d) => d.ordinal !== null)) return null;
  return { every: r.interval, unit, weekdays: sortedWeekdays(days.map((d) => d.weekday)) };
}

function positionWords(ordinal: number): string {
  if (ordinal === -1) return "last";
  if (ordinal === -2) return "second-last";
  if (ordinal < 0) return `${-ordinal}th from last`;
  return POSITIONS[ordinal - 1] ?? `${ordinal}th`;
}

function monthDayWords(day: number): string {
  if (day === -1) return "the last day";
  if (day === -2) return "the second-last day";
  if (day < 0) return `the ${-day}th day from the end`;
  return `day ${day}`;
}

/** "Monday and Friday" in a week; "every Monday", "the first Friday" in a month or year. */
function byDayWords(days: ByDay[], inWeek: boolean): string {
  if (days.every((d) => d.ordinal === null)) {
    const names = sortedWeekdays(days.map((d) => d.weekday)).map((w) => WEEKDAY_NAMES[w]);
    return inWeek ? wordList(names) : `every ${wordList(names)}`;
  }
  return wordList(
    days.map((d) => `${d.ordinal === null ? "every" : `the ${positionWords(d.ordinal)}`} ${WEEKDAY_NAMES[d.weekday]}`),
  );
}

function untilWords(r: CalendarRule): string {
  if (r.until === null) return r.count === null ? "" : `, ${r.count} ${r.count === 1 ? "time" : "times"}`;
  const day = r.until.kind === "day" ? r.until.day : r.until.at;
  const when = `${day.getUTCDate()} ${SHORT_MONTHS[day.getUTCMonth()]} ${day.getUTCFullYear()}`;
  return r.until.kind === "day" ? `, until ${when}` : `, until ${when} (UTC)`;
}

/** The rule in plain words: "every 3 months", "every 2 weeks on Monday and Friday". */
export function describeCalendarRule(rule: CalendarRule | string): string {
  const r = typeof rule === "string" ? parseCalendarRule(rule) : rule;
  const unit = UNIT_OF_FREQ[r.frequency] ?? "day";
  const head = r.interval === 1 ? `every ${unit}` : `every ${r.interval} ${unit}s`;
  const byDay = r.parts.has("BYDAY") ? byDayList(r.parts.get("BYDAY") ?? "") : null;
  const monthDays = r.parts.get("BYMONTHDAY")?.split(",").map(Number) ?? null;
  const months =
    r.parts
      .get("BYMONTH")
      ?.split(",")
      .map((m) => MONTH_NAMES[Number(m) - 1] ?? m) ?? null;
  const setPos = r.parts.get("BYSETPOS")?.split(",").map(Number) ?? null;

  const inWeek = r.frequency === "WEEKLY" || r.frequency === "DAILY";
  const pieces: string[] = [head];
  if (r.frequency === "YEARLY" && months?.length === 1 && monthDays?.length === 1 && byDay === null) {
    const day = monthDays[0] ?? 1;
    pieces.push(day > 0 ? `on ${day} ${months[0]}` : `on ${monthDayWords(day)} of ${months[0]}`);
  } else {
    if (months) pieces.push(`in ${wordList(months)}`);
    if (setPos && byDay) {
      pieces.push(
        `on the ${wordList(setPos.map(positionWords))} of ${wordList(sortedWeekdays(byDay.map((d) => d.weekday)).map((w) => WEEKDAY_NAMES[w]))}`,
      );
    } else {
      if (byDay) pieces.push(`on ${byDayWords(byDay, inWeek)}`);
      if (monthDays) {
        const plain = monthDays.filter((d) => d > 0);
        const fromEnd = monthDays.filter((d) => d < 0).map(monthDayWords);
        const dayWords = plain.length > 1 ? [`days ${wordList(plain.map(String))}`] : plain.map(monthDayWords);
        pieces.push(`${byDay ? "when it is " : "on "}${wordList([...dayWords, ...fromEnd])}`);
      }
    }
  }
  return pieces.join(" ") + untilWords(r);
}
