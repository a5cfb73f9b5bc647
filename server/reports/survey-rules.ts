// The survey report's own judgements, pure: how well a counter was read over the period, and
// whether work was done late or out of tolerance.
import { addShipDays, shipDateFromKey, shipDateKey, shipDaysBetween } from "@/server/scheduling/ship-date";

/** Every ship's day from `from` to `to`, both included ("YYYY-MM-DD"). */
export function daysOf(from: string, to: string): string[] {
  const first = shipDateFromKey(from);
  const count = shipDaysBetween(first, shipDateFromKey(to)) + 1;
  return Array.from({ length: Math.max(count, 0) }, (_, i) => shipDateKey(addShipDays(first, i)));
}

export type Coverage = {
  /** The ship's days the counter was expected to be read: the period, from the counter's first day on. */
  days: number;
  /** Days of those without any reading. */
  missing: number;
  /** The longest run of days without a reading, and its first and last day. */
  longestGap: { days: number; from: string; to: string } | null;
};

/**
 * A counter's readings over the period's ship's days: a day counts as read when any reading falls
 * on it. Days before `countFrom` (the counter's first reading or its making) are not expected.
 * Keelson asks for one reading a day (PRODUCT.md: the second engineer logs every meter once a day).
 */
export function readingCoverage(periodDays: readonly string[], readDays: ReadonlySet<string>, countFrom: string | null): Coverage {
  const expected = periodDays.filter((d) => countFrom !== null && d >= countFrom);
  let missing = 0;
  type Gap = { days: number; from: string; to: string };
  let run: Gap | null = null;
  let longest: Gap | null = null;
  for (const day of expected) {
    if (readDays.has(day)) {
      run = null;
      continue;
    }
    missing++;
    const next: Gap = run ? { days: run.days + 1, from: run.from, to: day } : { days: 1, from: day, to: day };
    run = next;
    if (!longest || next.days > longest.days) longest = next;
  }
  return { days: expected.length, missing, longestGap: longest };
}

export type DoneFacts = {
  doneAt: Date;
  counterHours: number | null;
  /** The state Keelson showed the work order in when the job was done (its last change before). */
  stateWhenDone: string | null;
  /** The limits it was done against: a deferral's where one was approved. */
  dueAt: Date | null;
  graceEndsAt: Date | null;
  dueHours: number | null;
  graceEndsHours: number | null;
};

/**
 * Late or out of tolerance when done. The state Keelson showed at the time decides (it applied the
 * company's tolerance rules, a class window counted on time among them); work with no recorded
 * change before it was done (history brought in by an import) is judged against its limits as the
 * tolerance rules do: past the due point late, past the grace out of tolerance, the limit further
 * along deciding (server/scheduling/work-order-state.ts).
 */
export function doneLate(f: DoneFacts): "late" | "out-of-tolerance" | null {
  if (f.stateWhenDone) {
    return f.stateWhenDone === "late" || f.stateWhenDone === "out-of-tolerance" ? f.stateWhenDone : null;
  }
  const out =
    (f.graceEndsAt !== null && f.doneAt > f.graceEndsAt) ||
    (f.graceEndsHours !== null && f.counterHours !== null && f.counterHours > f.graceEndsHours);
  if (out) return "out-of-tolerance";
  const late =
    (f.dueAt !== null && f.doneAt > f.dueAt) || (f.dueHours !== null && f.counterHours !== null && f.counterHours > f.dueHours);
  return late ? "late" : null;
}
