// When each reminder falls due, and the key that queues it once. Pure: no I/O.
//
// Every reminder is queued by a run of the worker (every 15 minutes) that looks at "now"; what
// makes a message go out once is its dedupe key in the outbox, so a key must name exactly the
// occasion: the ship's day of a digest, the reading a missing-readings chain counts from, the
// state change an escalation is about, the ISO week of a fleet summary.
import { TZDate } from "@date-fns/tz";
import { format, getISOWeek, getISOWeekYear } from "date-fns";
import { instantOfShipTime } from "@/server/format/hours";
import { shipDayKey } from "@/server/format/ship-day";
import { addShipDays, shipDateFromKey, shipDateKey } from "@/server/scheduling/ship-date";

const HOUR = 3_600_000;

export type DigestOccasion = {
  /** The ship's day the digest is for, "2026-12-02". */
  shipDay: string;
  /** The digest hour on that day (vessel-local): what changed up to here is in this digest. */
  cutOff: Date;
  /** The digest hour of the ship's day before: what changed before it was in yesterday's digest. */
  previousCutOff: Date;
  /** The first and last ship's day of "due in the next 7 days": the digest's day and 6 more. */
  dueFrom: string;
  dueUntil: string;
};

/** The instant of `hour`:00 on a ship's day in the vessel's zone. */
export function digestCutOff(shipDay: string, digestHour: number, timeZone: string): Date {
  return instantOfShipTime(shipDay, `${String(digestHour).padStart(2, "0")}:00`, timeZone);
}

export function plusShipDays(shipDay: string, days: number): string {
  return shipDateKey(addShipDays(shipDateFromKey(shipDay), days));
}

/**
 * The digest a run at `now` should queue for a vessel: the one of the current ship's day once its
 * digest hour has passed, else none. A run before the hour queues nothing, and yesterday's missed
 * digest is not sent late (the worker runs every 15 minutes, so the next one is hours away).
 */
export function dueDigest(now: Date, timeZone: string, digestHour: number): DigestOccasion | null {
  const shipDay = shipDayKey(now.getTime(), timeZone);
  const cutOff = digestCutOff(shipDay, digestHour, timeZone);
  if (now.getTime() < cutOff.getTime()) return null;
  const previousCutOff = digestCutOff(plusShipDays(shipDay, -1), digestHour, timeZone);
  return { shipDay, cutOff, previousCutOff, dueFrom: shipDay, dueUntil: plusShipDays(shipDay, 6) };
}

export type MissingReadingsStep = 1 | 2 | 3;

/**
 * The steps of the missing-readings chain reached `now`, counting from the vessel's latest
 * reading: 1 (engineers) at `afterHours`, 2 (chief engineer) `stepHours` later, 3
 * (superintendents) another `stepHours` later. All the steps reached are returned, so a worker
 * that was down for a day still tells everyone it should have; the outbox key sends each once.
 */
export function missingReadingsSteps(
  latestReadingAt: Date,
  now: Date,
  afterHours: number,
  stepHours: number,
): MissingReadingsStep[] {
  const hours = (now.getTime() - latestReadingAt.getTime()) / HOUR;
  const steps: MissingReadingsStep[] = [];
  if (hours >= afterHours) steps.push(1);
  if (hours >= afterHours + stepHours) steps.push(2);
  if (hours >= afterHours + 2 * stepHours) steps.push(3);
  return steps;
}

/** Whole hours since the latest reading, for the message ("no reading for 38 h"). */
export function hoursSince(at: Date, now: Date): number {
  return Math.floor((now.getTime() - at.getTime()) / HOUR);
}

/** "2026-W49": ISO 8601 week-numbering year and week of an instant, in UTC. */
export function isoWeekKey(instant: Date): string {
  const utc = new TZDate(instant, "UTC");
  return `${getISOWeekYear(utc)}-W${String(getISOWeek(utc)).padStart(2, "0")}`;
}

/**
 * The week of the fleet summary a run at `now` should queue: on Mondays from the company's digest
 * hour, in UTC (the office ashore has no ship's clock; the company keeps no office time zone).
 */
export function dueFleetSummary(now: Date, digestHour: number): string | null {
  const utc = new TZDate(now, "UTC");
  if (utc.getDay() !== 1 || utc.getHours() < digestHour) return null;
  return isoWeekKey(now);
}

/** "Tue 2 Dec" for a ship's day. */
export function shipDayLabel(shipDay: string): string {
  return format(new TZDate(shipDateFromKey(shipDay), "UTC"), "EEE d MMM");
}

export const reminderKeys = {
  dueDigest: (vesselId: string, shipDay: string, userId: string) => `due-digest:${vesselId}:${shipDay}:${userId}`,
  missingReadings: (vesselId: string, latestReadingAt: Date, step: MissingReadingsStep, userId: string) =>
    `missing-readings:${vesselId}:${latestReadingAt.toISOString()}:${step}:${userId}`,
  escalation: (stateChangeId: string, userId: string) => `escalation:${stateChangeId}:${userId}`,
  fleetSummary: (companyId: string, isoWeek: string, userId: string) =>
    `fleet-summary:${companyId}:${isoWeek}:${userId}`,
};
