import { formatDistanceStrict } from "date-fns";
import { shipDayKey } from "@/server/format/ship-day";

const MINUTE = 60_000;
const HOUR = 60 * MINUTE;
const DAY_MS = 86_400_000;

/** Whole days between two "YYYY-MM-DD" keys. */
function daysBetween(from: string, to: string): number {
  return Math.round((Date.parse(`${to}T00:00:00Z`) - Date.parse(`${from}T00:00:00Z`)) / DAY_MS);
}

/**
 * How old something is, for people, by the clock they live by: "just now", "25 minutes ago",
 * "3 hours ago", "yesterday", "4 days ago", "3 months ago". Days are counted on the calendar of
 * `timeZone` (the ship's for a reading; the browser's by default): a reading taken at 09:00
 * yesterday is "yesterday" at 23:00 today, not "2 days ago" as 38 hours rounded would say.
 */
export function ageOf(instant: Date | string, now: Date | string, timeZone?: string): string {
  const then = new Date(instant).getTime();
  const at = new Date(now).getTime();
  const ms = at - then;
  if (ms < MINUTE) return "just now";
  if (ms < HOUR) {
    const minutes = Math.floor(ms / MINUTE);
    return `${minutes} ${minutes === 1 ? "minute" : "minutes"} ago`;
  }
  const zone = timeZone ?? Intl.DateTimeFormat().resolvedOptions().timeZone;
  const days = daysBetween(shipDayKey(then, zone), shipDayKey(at, zone));
  // The same day, or last night seen early this morning: hours say it better than "yesterday".
  if (days === 0 || ms < 6 * HOUR) {
    const hours = Math.floor(ms / HOUR);
    return `${hours} ${hours === 1 ? "hour" : "hours"} ago`;
  }
  if (days === 1) return "yesterday";
  if (days < 45) return `${days} days ago`;
  return `${formatDistanceStrict(then, at)} ago`;
}
