// Daily running hours from irregular readings: between two readings the counter is taken to run at
// an even rate, and that interval's hours are shared out over the ship's days it spans. A day's
// figure can therefore never exceed 24 h when the readings respect the 24-in-24 rule.
import { endOfShipDay, shipDayKey, startOfShipDay } from "@/server/format/ship-day";
import { round1 } from "./rules";

export type TotalAt = { readAt: Date; totalHours: number };

/**
 * `since`: only the ship's days from the one holding this instant are shared out. The reading
 * before a window can be years old; without the clip the loop would walk every day in between.
 */
export function dailyRunningHours(
  readings: TotalAt[],
  timeZone: string,
  since?: Date,
): { day: string; hours: number }[] {
  const floor = since ? startOfShipDay(since.getTime(), timeZone) : -Infinity;
  const sorted = [...readings].sort((a, b) => a.readAt.getTime() - b.readAt.getTime());
  const perDay = new Map<string, number>();
  for (let i = 1; i < sorted.length; i++) {
    const from = sorted[i - 1]!.readAt.getTime();
    const to = sorted[i]!.readAt.getTime();
    if (to <= from) continue;
    const rate = (sorted[i]!.totalHours - sorted[i - 1]!.totalHours) / (to - from);
    let cursor = Math.max(from, floor);
    while (cursor < to) {
      const end = Math.min(endOfShipDay(cursor, timeZone), to);
      const day = shipDayKey(cursor, timeZone);
      perDay.set(day, (perDay.get(day) ?? 0) + rate * (end - cursor));
      cursor = end;
    }
  }
  return [...perDay.entries()]
    .sort(([a], [b]) => a.localeCompare(b))
    .map(([day, hours]) => ({ day, hours: round1(hours) }));
}
