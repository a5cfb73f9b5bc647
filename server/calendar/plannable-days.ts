// The ship's days a work order may be planned on: its tolerance window from the first opening to
// the first grace end, written by the worker as planFrom / planUntil (null = no bound that side).
// Pure: the server refuses a day outside, and the planning panel says the same in the same words.
import { format } from "date-fns";

export type PlannableDays = { planFrom: string | null; planUntil: string | null };

/** "2026-12-03" → "3 December 2026" (a ship's day, so no time zone is involved). */
export function dayInWords(day: string): string {
  const [y, m, d] = day.split("-").map(Number) as [number, number, number];
  return format(new Date(y, m - 1, d), "d MMMM yyyy");
}

export function isPlannable(day: string, range: PlannableDays): boolean {
  return (range.planFrom === null || day >= range.planFrom) && (range.planUntil === null || day <= range.planUntil);
}

export function plannableDaysInWords(range: PlannableDays): string {
  const { planFrom, planUntil } = range;
  if (planFrom && planUntil) return `from ${dayInWords(planFrom)} to ${dayInWords(planUntil)}`;
  if (planFrom) return `from ${dayInWords(planFrom)} on`;
  if (planUntil) return `until ${dayInWords(planUntil)}`;
  return "on any day";
}

/** The refusal of a day outside the window, naming the days that are allowed. */
export function outsideWindowMessage(number: string, day: string, range: PlannableDays): string {
  return `${number} may be planned ${plannableDaysInWords(range)}, inside its tolerance window; ${dayInWords(day)} is outside it.`;
}
