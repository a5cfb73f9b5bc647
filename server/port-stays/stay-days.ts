// The ship's days a port stay covers, and the ship's-clock strings its form edits. Pure.
import { instantOfShipTime, shipClock, shipDay } from "@/server/format/hours";
import { addShipDays, shipDateFromKey, shipDateKey } from "@/server/scheduling/ship-date";

/** Every ship's day from the arrival's to the departure's, both included. */
export function stayDays(arrivesAt: Date, departsAt: Date, timeZone: string): string[] {
  const last = shipDay(departsAt, timeZone);
  const days: string[] = [];
  for (let d = shipDateFromKey(shipDay(arrivesAt, timeZone)); shipDateKey(d) <= last; d = addShipDays(d, 1)) {
    days.push(shipDateKey(d));
  }
  return days;
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
