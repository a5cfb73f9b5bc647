// How Keelson writes hours, dates and times: one place, used by messages, pages and e-mail.
import { TZDate } from "@date-fns/tz";
import { format } from "date-fns";

const hoursFormat = new Intl.NumberFormat("en-GB", { minimumFractionDigits: 0, maximumFractionDigits: 1 });

/** 12431.5 → "12,431.5 h" */
export function formatHours(value: number): string {
  return `${hoursFormat.format(value)} h`;
}

/**
 * A running rate as people read it, from the rate kept at full precision: "12.4 h/day"; a machine
 * that runs less than 0.1 h a day by the month ("1.0 h in 30 days"), never a misleading "0.0 h/day".
 */
export function formatRate(hoursPerDay: number): string {
  if (hoursPerDay > 0 && hoursPerDay < 0.1) return `${(hoursPerDay * 30).toFixed(1)} h in 30 days`;
  return `${hoursPerDay.toFixed(1)} h/day`;
}

/** 36 → "36 man-hours" */
export function formatManHours(value: number): string {
  return `${hoursFormat.format(value)} man-hours`;
}

/** An instant as the ship's clock shows it: "3 May 2026 12:00". */
export function formatShipTime(instant: Date, timeZone: string): string {
  return format(new TZDate(instant, timeZone), "d MMM yyyy HH:mm");
}

export function formatShipDate(instant: Date, timeZone: string): string {
  return format(new TZDate(instant, timeZone), "d MMM yyyy");
}

/** The ship's day (YYYY-MM-DD) of an instant. */
export function shipDay(instant: Date, timeZone: string): string {
  return format(new TZDate(instant, timeZone), "yyyy-MM-dd");
}

/** The ship's clock time (HH:mm) of an instant. */
export function shipClock(instant: Date, timeZone: string): string {
  return format(new TZDate(instant, timeZone), "HH:mm");
}

/** The instant of a ship's day and clock time in the vessel's time zone. */
export function instantOfShipTime(day: string, clock: string, timeZone: string): Date {
  const [y, m, d] = day.split("-").map(Number) as [number, number, number];
  const [hh, mm] = clock.split(":").map(Number) as [number, number];
  return new Date(new TZDate(y, m - 1, d, hh, mm, 0, timeZone).getTime());
}

/** The ship's time with its UTC offset, as a file states it without doubt: "2026-03-13T09:00+08:00". */
export function shipTimeWithOffset(instant: Date, timeZone: string): string {
  return format(new TZDate(instant, timeZone), "yyyy-MM-dd'T'HH:mmxxx");
}

/** "UTC+08:00" for an instant in a time zone. */
export function utcOffsetLabel(instant: Date, timeZone: string): string {
  return `UTC${format(new TZDate(instant, timeZone), "xxx")}`;
}
