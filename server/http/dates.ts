// The days a person may enter, by kind, with messages that name the field. The contract refuses a
// day outside its kind's range before any query runs: far-future years sent loops walking a stay's
// days into year 10000 (whose "10000-…" sorts before "9999-…"), and a completion dated 1900 is no
// record of this ship. The domain still checks the precise rules (not in the future on the ship's
// clock, inside the plan range, after the current limit); these are the outer fences.
import { z } from "zod";

export type DayKind = "recorded" | "history" | "planned" | "anniversary";

/**
 * Each kind's earliest day and how far past today (UTC) it may lie.
 * - recorded (a reading, a completion, a meter replacement): what happened on board, so not before
 *   2000 (no Keelson ship keeps records older than its software) and at most a week past today in
 *   UTC. The domain refuses the ship's own future exactly, with a message on the time ("… is in
 *   the future"); the fence lies a week out, well past any ship's zone (UTC+14) and a wrong day
 *   or two, so a day just in the future still gets that precise message.
 * - history (a routine's baseline, its last time done before Keelson): an old ship's history may
 *   reach back to 1980; it happened, so the same fence ahead.
 * - planned (a port stay, a planned day, a package's day, a deferral's new limit): at most three
 *   years ahead — class allows at most 36 months between bottom surveys, so no plan or
 *   postponement reaches further; from 2000 so a past stay can still be entered.
 * - anniversary (an anchored routine's anniversary date): from 1980 (the ship's delivery) to six
 *   years ahead (a five-year certificate's expiry, and a margin).
 */
const RANGES: Record<DayKind, { earliest: string; aheadYears: number; aheadDays: number }> = {
  recorded: { earliest: "2000-01-01", aheadYears: 0, aheadDays: 7 },
  history: { earliest: "1980-01-01", aheadYears: 0, aheadDays: 7 },
  planned: { earliest: "2000-01-01", aheadYears: 3, aheadDays: 0 },
  anniversary: { earliest: "1980-01-01", aheadYears: 6, aheadDays: 0 },
};

const DAY_MS = 86_400_000;

/** The first and last day a person may enter for the kind, as "YYYY-MM-DD", for `now`. */
export function dayRange(kind: DayKind, now: Date = new Date()): { from: string; until: string } {
  const { earliest, aheadYears, aheadDays } = RANGES[kind];
  const ahead = new Date(now.getTime() + aheadDays * DAY_MS).toISOString().slice(0, 10);
  // Years are added to the text: 29 February + 3 years stays "…-02-29", still a sound upper bound.
  const until = `${Number(ahead.slice(0, 4)) + aheadYears}${ahead.slice(4)}`;
  return { from: earliest, until };
}

/**
 * Why the day (a checked "YYYY-MM-DD", four-digit year) is out of its kind's range, naming the
 * field in words (`what`, e.g. "The reading’s ship’s day"), or null when it is inside.
 */
export function dayRangeProblem(kind: DayKind, what: string, day: string): string | null {
  const { from, until } = dayRange(kind);
  // Four-digit ISO days sort as text in date order.
  return day < from || day > until ? `${what} must lie between ${from} and ${until}.` : null;
}

/** A ship's day "YYYY-MM-DD" a person enters: `formatMessage` for a malformed one, then its range. */
export function enteredDay(kind: DayKind, what: string, formatMessage: string) {
  return z.iso.date({ message: formatMessage, abort: true }).superRefine((day, ctx) => {
    const problem = dayRangeProblem(kind, what, day);
    if (problem) ctx.addIssue({ code: "custom", message: problem });
  });
}
