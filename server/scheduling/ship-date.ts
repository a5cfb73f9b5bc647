// Ship's calendar days for the due engine. Maintenance falls due on a day of the ship's calendar,
// not at an instant, so calendar arithmetic (rrule, adding months) runs on "floating" dates: a
// Date at 00:00 UTC whose UTC year, month and day are the ship's local ones. Only at the edges
// is a floating date turned into real instants in the vessel's time zone, which keeps the
// arithmetic free of DST and of the process's own time zone (rrule's TZID support depends on
// the latter: it gave other instants when the process ran in Asia/Tokyo).
import { TZDate, tz } from "@date-fns/tz";
import { addDays, addMonths, differenceInCalendarDays } from "date-fns";
import { shipDayKey } from "@/server/format/ship-day";

const UTC = tz("UTC");

/** The ship's day an instant falls on, as a floating date. */
export function shipDateOf(instant: Date, timeZone: string): Date {
  return shipDateFromKey(shipDayKey(instant.getTime(), timeZone));
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
  return new Date(
    new TZDate(shipDate.getUTCFullYear(), shipDate.getUTCMonth(), shipDate.getUTCDate(), timeZone).getTime(),
  );
}

/**
 * Keelson's due instant of a ship's day: its last millisecond, 23:59:59.999 on the ship's clock
 * (days are 23, 24 or 25 hours long). Work due "on 15 April" is on time all of 15 April, and the
 * instant still formats as 15 April in the vessel's zone.
 */
export function endOfShipDate(shipDate: Date, timeZone: string): Date {
  return new Date(startOfShipDate(addShipDays(shipDate, 1), timeZone).getTime() - 1);
}

export function addShipDays(shipDate: Date, days: number): Date {
  return new Date(addDays(shipDate, days, { in: UTC }).getTime());
}

/**
 * Adds calendar months; a day that the target month lacks becomes that month's last day
 * (date-fns clamps: 31 May − 3 months = 28 Feb, or 29 Feb in a leap year).
 */
export function addShipMonths(shipDate: Date, months: number): Date {
  return new Date(addMonths(shipDate, months, { in: UTC }).getTime());
}

/** Whole ship's days from `from` to `to` (negative when `to` is earlier). */
export function shipDaysBetween(from: Date, to: Date): number {
  return differenceInCalendarDays(to, from, { in: UTC });
}
