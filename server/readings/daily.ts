// Daily running hours from irregular readings: between two readings the counter is taken to run at
// an even rate, and that interval's hours are shared out over the ship's days it spans. A day's
// figure can therefore never exceed 24 h when the readings respect the 24-in-24 rule.
import { TZDate } from "@date-fns/tz";
import { addDays, format, startOfDay } from "date-fns";
import { round1 } from "./rules";

export type TotalAt = { readAt: Date; totalHours: number };

export function dailyRunningHours(readings: TotalAt[], timeZone: string): { day: string; hours: number }[] {
  const sorted = [...readings].sort((a, b) => a.readAt.getTime() - b.readAt.getTime());
  const perDay = new Map<string, number>();
  for (let i = 1; i < sorted.length; i++) {
    const from = sorted[i - 1]!;
    const to = sorted[i]!;
    const span = to.readAt.getTime() - from.readAt.getTime();
    if (span <= 0) continue;
    const rate = (to.totalHours - from.totalHours) / span;
    let cursor = from.readAt.getTime();
    while (cursor < to.readAt.getTime()) {
      const local = new TZDate(cursor, timeZone);
      const nextMidnight = startOfDay(addDays(local, 1)).getTime();
      const end = Math.min(nextMidnight, to.readAt.getTime());
      const day = format(local, "yyyy-MM-dd");
      perDay.set(day, (perDay.get(day) ?? 0) + rate * (end - cursor));
      cursor = end;
    }
  }
  return [...perDay.entries()]
    .sort(([a], [b]) => a.localeCompare(b))
    .map(([day, hours]) => ({ day, hours: round1(hours) }));
}
