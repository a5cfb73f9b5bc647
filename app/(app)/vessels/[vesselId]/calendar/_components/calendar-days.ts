// Ship's days as the Calendar writes them. A ship's day is a plain date: no time zone is involved.
import { format } from "date-fns";
import { shipDayKey } from "@/server/format/ship-day";

function asLocalDate(day: string): Date {
  const [y, m, d] = day.split("-").map(Number) as [number, number, number];
  return new Date(y, m - 1, d);
}

/** "2026-12-03" → "3 Dec". */
export function shortDay(day: string): string {
  return format(asLocalDate(day), "d MMM");
}

/** "2026-12-03" → "Thu 3 Dec 2026". */
export function longDay(day: string): string {
  return format(asLocalDate(day), "EEE d MMM yyyy");
}

/** Today on the ship's calendar, whatever zone the browser is in. */
export function shipToday(timeZone: string): string {
  return shipDayKey(Date.now(), timeZone);
}
