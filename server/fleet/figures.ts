// The Fleet board's figures (PRODUCT.md point 5): on-time completions, vessels that stopped
// reporting, and the order the office reads the fleet in. Pure: no I/O.

export const ON_TIME_DAYS = 90;
export const TREND_DAYS = 90;
const DAY_MS = 86_400_000;
const HOUR_MS = 3_600_000;

/** An approved completion with the limits its work order carried when the worker last wrote it. */
export type CompletionLimits = {
  doneAt: Date;
  /** The counter value recorded with the completion, if any. */
  counterHours: number | null;
  /** End of the calendar grace. */
  graceEndsAt: Date | null;
  /** End of the hours grace (counter value). */
  graceEndsHours: number | null;
  /** The earlier grace end as a date, hours projected at the running rate. */
  outOfToleranceAt: Date | null;
  dueDate: Date | null;
};

/**
 * Keelson's definition (no published source): a completion is on time when it was done before
 * every grace limit its work order carried, judged against the limits in force (an approved
 * deferral's, when there was one: the office agreed to the new limit).
 * - Calendar limit: `doneAt` no later than `graceEndsAt`.
 * - Hours limit: the counter value recorded with the completion no higher than `graceEndsHours`.
 *   Without a recorded counter value, the hours limit is judged by its projected date
 *   (`outOfToleranceAt`), the best the record allows.
 * - With both limits (whichever first), both must hold, as the work-order state takes the one
 *   further along.
 * - A record that carries no grace end at all (older history) is judged against its due date:
 *   the stricter reading when the grace is unknown. With no limit at all it is on time.
 */
export function isOnTime(c: CompletionLimits): boolean {
  const checks: boolean[] = [];
  const hoursJudged = c.graceEndsHours !== null && c.counterHours !== null;
  if (hoursJudged) checks.push(c.counterHours! <= c.graceEndsHours!);
  const dateLimit =
    c.graceEndsAt ??
    (c.graceEndsHours !== null && !hoursJudged ? c.outOfToleranceAt : null) ??
    (checks.length === 0 ? c.dueDate : null);
  if (dateLimit) checks.push(c.doneAt.getTime() <= dateLimit.getTime());
  return checks.every(Boolean);
}

export type OnTimeFigures = { completed: number; onTime: number; overdue: number; rate: number | null };

/**
 * The on-time rate (Keelson's definition, issue 14): of the work judged — every completion approved
 * in the last 90 days, and every open work order out of tolerance now — the share done within its
 * tolerance. Open work past its grace counts against the rate until it is done, so a vessel cannot
 * read 100 % beside critical work months out of tolerance. `rate` is null with nothing to judge.
 */
export function onTimeRate(completions: readonly CompletionLimits[], openOutOfTolerance = 0): OnTimeFigures {
  const onTime = completions.filter(isOnTime).length;
  const completed = completions.length;
  const judged = completed + openOutOfTolerance;
  return { completed, onTime, overdue: openOutOfTolerance, rate: judged === 0 ? null : Math.round((onTime / judged) * 10_000) / 10_000 };
}

/** Whether a vessel has entered no reading for longer than the company allows (or never has). */
export function stoppedReporting(lastReadingAt: Date | null, now: Date, missingReadingsHours: number): boolean {
  if (!lastReadingAt) return true;
  return now.getTime() - lastReadingAt.getTime() > missingReadingsHours * HOUR_MS;
}

/** Whole days since the last reading (0 within the first 24 h); null when there is none. */
export function daysSinceReading(lastReadingAt: Date | null, now: Date): number | null {
  if (!lastReadingAt) return null;
  return Math.max(0, Math.floor((now.getTime() - lastReadingAt.getTime()) / DAY_MS));
}

export type BoardOrderFigures = {
  name: string;
  late: number;
  outOfTolerance: number;
  criticalLate: number;
  criticalOutOfTolerance: number;
  classLate: number;
  classOutOfTolerance: number;
};

/**
 * Which group a vessel falls in on the board: 0 critical or class-related work out of tolerance,
 * 1 critical or class-related work late, 2 other work out of tolerance, 3 other work late, 4 none.
 */
export function boardTier(v: BoardOrderFigures): 0 | 1 | 2 | 3 | 4 {
  if (v.criticalOutOfTolerance + v.classOutOfTolerance > 0) return 0;
  if (v.criticalLate + v.classLate > 0) return 1;
  if (v.outOfTolerance > 0) return 2;
  if (v.late > 0) return 3;
  return 4;
}

/** The board's order: by tier (above), then by name. */
export function compareForBoard(a: BoardOrderFigures, b: BoardOrderFigures): number {
  return boardTier(a) - boardTier(b) || a.name.localeCompare(b.name, "en");
}

/** The UTC day of an instant, as the snapshots are keyed. */
export function utcDay(instant: Date): string {
  return instant.toISOString().slice(0, 10);
}

/** The `count` UTC days ending with the day of `now`, oldest first. */
export function trendDays(now: Date, count = TREND_DAYS): string[] {
  const today = Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate());
  return Array.from({ length: count }, (_, i) => utcDay(new Date(today - (count - 1 - i) * DAY_MS)));
}
