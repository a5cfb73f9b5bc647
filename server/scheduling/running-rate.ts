// Running rate of a counter (PRODUCT.md, "Counters and readings"): hours run per day over a
// look-back (default 30 days), with the planned rate where the history is too short to trust.
import { round1 } from "@/server/readings/rules";

export type RateReading = { readAt: Date; totalHours: number };

export type RunningRate = {
  hoursPerDay: number;
  basis: "measured" | "planned";
  /** Days of history the measured rate rests on (0 for a planned rate). */
  spanDays: number;
};

export const DEFAULT_LOOKBACK_DAYS = 30;
/** Fewer days of history than this and the planned rate is used instead (common practice). */
export const MIN_SPAN_DAYS = 7;

/**
 * `readings` must include the last reading at or before the look-back's start, if any, so the
 * window is covered from its first day.
 */
export function runningRate(
  readings: RateReading[],
  now: Date,
  plannedHoursPerDay: number,
  lookbackDays = DEFAULT_LOOKBACK_DAYS,
): RunningRate {
  const planned: RunningRate = { hoursPerDay: plannedHoursPerDay, basis: "planned", spanDays: 0 };
  const start = now.getTime() - lookbackDays * 86_400_000;
  const sorted = [...readings].filter((r) => r.readAt <= now).sort((a, b) => a.readAt.getTime() - b.readAt.getTime());
  const before = sorted.filter((r) => r.readAt.getTime() <= start).at(-1);
  const inWindow = sorted.filter((r) => r.readAt.getTime() > start);
  const first = before ?? inWindow[0];
  const last = inWindow.at(-1);
  if (!first || !last || last === first) return planned;
  const spanDays = (last.readAt.getTime() - first.readAt.getTime()) / 86_400_000;
  if (spanDays < MIN_SPAN_DAYS) return planned;
  const rate = (last.totalHours - first.totalHours) / spanDays;
  // Kept at full precision: an emergency generator's 1 h a month is 0.033 h/day, not 0.0 (shown rounded).
  return { hoursPerDay: Math.min(24, Math.max(0, rate)), basis: "measured", spanDays: round1(spanDays) };
}
