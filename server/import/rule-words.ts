// A calendar interval in the words a spreadsheet holds — "every 3 months", "monthly", "every 2 weeks
// on Monday and Thursday", "every year" — read into the routine form's fields. What is not read
// gets a suggestion: "every 3 mnths" → try "every 3 months".
import type { CalendarRuleForm, CalendarUnit } from "@/server/scheduling/calendar-rule-words";
import type { WeekdayCode } from "@/server/scheduling/calendar-rule-grammar";

const UNITS: Record<string, CalendarUnit> = { day: "day", week: "week", month: "month", year: "year" };
const ADVERBS: Record<string, CalendarUnit> = { daily: "day", weekly: "week", monthly: "month", yearly: "year", annually: "year", annual: "year" };
const WEEKDAYS: Record<string, WeekdayCode> = {
  monday: "MO", tuesday: "TU", wednesday: "WE", thursday: "TH", friday: "FR", saturday: "SA", sunday: "SU",
  mon: "MO", tue: "TU", wed: "WE", thu: "TH", fri: "FR", sat: "SA", sun: "SU",
};
const NUMBER_WORDS: Record<string, number> = { one: 1, two: 2, three: 3, four: 4, five: 5, six: 6, twelve: 12 };

export type RuleWordsResult = { form: CalendarRuleForm } | { problem: string };

export function readRuleWords(raw: string): RuleWordsResult {
  const text = raw.trim().toLowerCase().replace(/\s+/g, " ");
  const refused = (hint?: string) => ({
    problem: `“${raw.trim()}” is not a rule Keelson reads${hint ? ` — try “${hint}”` : ": write e.g. “every 3 months”, “every year”, “every 2 weeks on Monday”, or give an RRULE"}.`,
  });
  if (text.length > 120) return refused();
  const adverb = /^(daily|weekly|monthly|yearly|annually|annual)(?: on (.+))?$/.exec(text);
  if (adverb) return withWeekdays({ every: 1, unit: ADVERBS[adverb[1]!]! }, adverb[2], refused);
  const m = /^every(?: (\d{1,3}|[a-z]+))? ([a-z]+?)s?(?: on (.+))?$/.exec(text);
  if (!m) return refused(suggest(text));
  const [, countWord, unitWord, days] = m;
  let every = 1;
  if (countWord !== undefined) {
    const n = /^\d+$/.test(countWord) ? Number(countWord) : NUMBER_WORDS[countWord];
    if (n === undefined) return refused(suggest(text));
    every = n;
  }
  const unit = UNITS[unitWord!];
  if (!unit) return refused(suggest(text));
  if (every < 1) return { problem: `“${raw.trim()}”: repeat every 1 or more ${unit}s.` };
  return withWeekdays({ every, unit }, days, refused);
}

function withWeekdays(form: CalendarRuleForm, days: string | undefined, refused: (hint?: string) => { problem: string }): RuleWordsResult {
  if (days === undefined) return { form };
  if (form.unit !== "week") return { problem: "Weekdays go with a rule that repeats by weeks, e.g. “every 2 weeks on Monday”." };
  const words = days.split(/,|\band\b|;|\//).map((w) => w.trim().replace(/s$/, "")).filter(Boolean);
  const weekdays: WeekdayCode[] = [];
  for (const w of words) {
    const code = WEEKDAYS[w];
    if (!code) return refused();
    if (!weekdays.includes(code)) weekdays.push(code);
  }
  return { form: { ...form, weekdays } };
}

/** The nearest rule Keelson reads, from a typo in the unit ("mnths" → "months") or a missing "every". */
function suggest(text: string): string | undefined {
  const m = /^(?:every )?(\d{1,3} )?([a-z]+)(.*)$/.exec(text);
  if (!m) return undefined;
  const [, count = "", word, rest = ""] = m;
  if (rest && !rest.startsWith(" on ")) return undefined;
  const singular = word!.replace(/s$/, "");
  const unit = Object.keys(UNITS).find((u) => distance(u, singular) <= 2 && singular.length >= 2);
  if (!unit) return undefined;
  const n = count.trim();
  return `every ${n ? `${n} ${unit}${n === "1" ? "" : "s"}` : unit}${rest}`;
}

/** Edit distance, for short words only (bounded by the 120-character limit above). */
function distance(a: string, b: string): number {
  const d = Array.from({ length: a.length + 1 }, (_, i) => [i, ...Array<number>(b.length).fill(0)]);
  for (let j = 1; j <= b.length; j += 1) d[0]![j] = j;
  for (let i = 1; i <= a.length; i += 1) {
    for (let j = 1; j <= b.length; j += 1) {
      d[i]![j] = Math.min(d[i - 1]![j]! + 1, d[i]![j - 1]! + 1, d[i - 1]![j - 1]! + (a[i - 1] === b[j - 1] ? 0 : 1));
    }
  }
  return d[a.length]![b.length]!;
}
