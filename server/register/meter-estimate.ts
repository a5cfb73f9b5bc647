import { round1 } from "@/server/readings/rules";

/**
 * The old meter's likely final value when it could not be read: its last reading plus the hours
 * run since at the counter's running rate (never more than 24 h a day), to a tenth of an hour.
 */
export function estimateFinal(
  last: { readAt: string; meterValue: number } | null,
  replacedAt: Date | null,
  hoursPerDay: number,
): { value: number; ran: number } | null {
  if (!last || !replacedAt || !(hoursPerDay > 0)) return null;
  const days = (replacedAt.getTime() - new Date(last.readAt).getTime()) / 86_400_000;
  if (!(days > 0)) return null;
  const ran = round1(Math.min(hoursPerDay, 24) * days);
  return { value: round1(last.meterValue + ran), ran };
}
