// The ship's days a port stay covers, and the ship's-clock strings its form edits. Pure.
import { instantOfShipTime, shipClock, shipDay } from "@/server/format/hours";
import { addShipDays, shipDateFromKey, shipDateKey, shipDaysBetween } from "@/server/scheduling/ship-date";
import { MAX_STAY_DAYS } from "./contract";

/**
 * The most days a stay can cover: the contract's longest stay, plus the arrival's day when it
 * starts mid-day. Bad data already stored (a stay into year 10000) is cut here, never walked.
 */
export const MAX_STAY_SHIP_DAYS = MAX_STAY_DAYS + 1;

/** Every ship's day from the arrival's to the departure's, both included (at most MAX_STAY_SHIP_DAYS). */
export function stayDays(arrivesAt: Date, departsAt: Date, timeZone: string): string[] {
  const first = shipDateFromKey(shipDay(arrivesAt, timeZone));
  // Counted, not compared as text: "10000-01-01" sorts before "9999-12-31".
  const span = shipDaysBetween(first, shipDateFromKey(shipDay(departsAt, timeZone))) + 1;
  const count = Number.isFinite(span) ? Math.min(Math.max(span, 0), MAX_STAY_SHIP_DAYS) : 0;
  return Array.from({ length: count }, (_, i) => shipDateKey(addShipDays(first, i)));
}

/** "2026-12-04T07:00" in the vessel's zone → the instant. */
export function instantOfShipDateTime(value: string, timeZone: string): Date {
  const [day, clock] = value.split("T") as [string, string];
  return instantOfShipTime(day, clock, timeZone);
}

/** The instant → "2026-12-04T07:00" on the ship's clock. */
export function shipDateTimeOf(instant: Date, timeZone: string): string {
  return `${shipDay(instant, timeZone)}T${shipClock(instant, timeZone)}`;
}

/** 510 minutes after the ship's midnight → "08:30" (1440 → "24:00"). */
export function clockWords(minutes: number): string {
  return `${String(Math.floor(minutes / 60)).padStart(2, "0")}:${String(minutes % 60).padStart(2, "0")}`;
}
