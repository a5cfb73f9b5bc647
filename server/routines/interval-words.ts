// A routine's interval in words, as the list and the form's preview say it.
import { formatHours } from "@/server/format/hours";
import { calendarRuleProblem } from "@/server/scheduling/calendar-rule";
import { describeCalendarRule } from "@/server/scheduling/calendar-rule-words";

/**
 * "every 2,000 h", "every 6 months", "every 2,000 h or every 12 months, whichever first",
 * "within 12 h before each departure".
 */
export function intervalWords(
  intervalHours: number | null,
  calendarRule: string | null,
  tie: { event: "departure" | "arrival"; withinHours: number } | null = null,
): string {
  if (tie) return `within ${formatHours(tie.withinHours)} ${tie.event === "departure" ? "before each departure" : "after each arrival"}`;
  const hours = intervalHours !== null && intervalHours > 0 ? `every ${formatHours(intervalHours)}` : null;
  const calendar = calendarRule && !calendarRuleProblem(calendarRule) ? describeCalendarRule(calendarRule) : null;
  if (hours && calendar) return `${hours} or ${calendar}, whichever first`;
  return hours ?? calendar ?? "no interval";
}
