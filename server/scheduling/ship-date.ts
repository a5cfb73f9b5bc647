// Ship's calendar days for the due engine. Maintenance falls due on a day of the ship's calendar,
// not at an instant, so calendar arithmetic (rrule, adding months) runs on "floating" dates: a
// Date at 00:00 UTC whose UTC year, month and day are the ship's local ones. Only at the edges
// is a floating date turned into real instants in the vessel's time zone, which keeps the
// arithmetic free of DST and of the process's own time zone (rrule's TZID support depends on
// the latter: it gave other instants when the process ran in Asia/Tokyo).
import { TZDate } from "@date-fns/tz";
import { shipDayKey } from "@/server/format/ship-day";

const DAY_MS = 86_400_000;

// Each lookup in a vessel's zone asks Intl, a few microseconds each time, and a vessel's recompute
// asks about the same few thousand days and instants (due days, now) over and over: up to 100,000
// answers are kept (scripts/bench/fleet.ts, README "Speed").
function remembered<T>(compute: (timeZone: string, ms: number) => T): (timeZone: string, ms: number) => T {
  const known = new Map<string, T>();
  return (timeZone, ms) => {
    const key = `${timeZone} ${ms}`;
    let answer = known.get(key);
    if (answer === undefined) {
      answer = compute(timeZone, ms);
      if (known.size >= 100_000) known.clear();
      known.set(key, answer);
    }
    return answer;
  };
}

const dayKeyOf = remembered((timeZone, ms) => shipDayKey(ms, timeZone));

/** The ship's day an instant falls on, as a floating date. */
export function shipDateOf(instant: Date, timeZone: string): Date {
  return shipDateFromKey(dayKeyOf(timeZone, instant.getTime()));
}

/** "2026-04-15" → floating date. */
export function shipDateFromKey(key: string): Date {
  const [y, m, d] = key.split("-").map(Number) as [number, number, number];
  return new Date(Date.UTC(y, m - 1, d));
}

/** Floating date → "2026-04-15" (the value a `date` column or a page shows). */
export function shipDateKey(shipDate: Date): string {
  return shipDate.toISOString().slice(0, 10);
}

/**
 * The instant the ship's day starts: local midnight, or the first instant after it where a
 * clock change skips midnight (America/Santiago goes from 23:59:59 to 01:00).
 */
export function startOfShipDate(shipDate: Date, timeZone: string): Date {
  return new Date(startOf(timeZone, shipDate.getTime()));
}

const startOf = remembered((timeZone, ms) => {
  const d = new Date(ms);
  return new TZDate(d.getUTCFullYear(), d.getUTCMonth(), d.getUTCDate(), timeZone).getTime();
});

/**
 * Keelson's due instant of a ship's day: its last millisecond, 23:59:59.999 on the ship's clock
 * (days are 23, 24 or 25 hours long). Work due "on 15 April" is on time all of 15 April, and the
 * instant still formats as 15 April in the vessel's zone.
 */
export function endOfShipDate(shipDate: Date, timeZone: string): Date {
  return new Date(startOfShipDate(addShipDays(shipDate, 1), timeZone).getTime() - 1);
}

// Floating dates live in UTC, which has no clock changes, so their arithmetic is plain UTC
// arithmetic. (date-fns with `in: tz("UTC")` asked Intl for UTC's offset on every call: a third
// of a vessel's recompute, scripts/bench/fleet.ts.)
export function addShipDays(shipDate: Date, days: number): Date {
  return new Date(shipDate.getTime() + days * DAY_MS);
}

/**
 * Adds calendar months; a day that the target month lacks becomes that month's last day
 * (as date-fns clamps: 31 May − 3 months = 28 Feb, or 29 Feb in a leap year).
 */
export function addShipMonths(shipDate: Date, months: number): Date {
  const result = new Date(shipDate.getTime());
  result.setUTCDate(1);
  result.setUTCMonth(result.getUTCMonth() + months);
  const lastDay = new Date(result.getTime());
  lastDay.setUTCMonth(lastDay.getUTCMonth() + 1, 0);
  result.setUTCDate(Math.min(shipDate.getUTCDate(), lastDay.getUTCDate()));
  return result;
}

/** Whole ship's days from `from` to `to` (negative when `to` is earlier). */
export function shipDaysBetween(from: Date, to: Date): number {
  return Math.round((utcMidnight(to) - utcMidnight(from)) / DAY_MS);
}

const utcMidnight = (d: Date) => d.getTime() - (((d.getTime() % DAY_MS) + DAY_MS) % DAY_MS);
