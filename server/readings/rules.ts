// Rules for a new reading of a counter (PRODUCT.md, "Counters and readings"): it may not go
// backwards, and it may not advance by more hours than elapsed since the previous reading — an
// engine runs at most 24 h in 24 h (SOURCES.md, "Running-hour facts": physical limit).
import { formatHours, formatShipTime } from "@/server/format/hours";

export type Neighbour = { readAt: Date; meterValue: number };

export type CounterContext = {
  name: string;
  /** When the meter fitted now was fitted; readings before it belong to the old meter. */
  segmentStartedAt: Date | null;
  /** Latest reading of the current meter before the new reading's instant. */
  previous: Neighbour | null;
  /** Earliest reading of the current meter after the new reading's instant (back-filled days). */
  next: Neighbour | null;
  /** A reading already exists at exactly this instant. */
  existingAtSameInstant: Neighbour | null;
};

/** Readings are kept in tenths: allow for rounding when comparing with elapsed time. */
const TENTH_SLACK = 0.05;

export function elapsedHours(from: Date, to: Date): number {
  return (to.getTime() - from.getTime()) / 3_600_000;
}

/** Why this meter value cannot be stored at `readAt`, or null when it can. */
export function readingProblem(
  counter: CounterContext,
  meterValue: number,
  readAt: Date,
  timeZone: string,
): string | null {
  const when = (d: Date) => formatShipTime(d, timeZone);
  if (counter.existingAtSameInstant) {
    const e = counter.existingAtSameInstant;
    return `There is already a reading at ${when(e.readAt)} (${formatHours(e.meterValue)}).`;
  }
  if (counter.segmentStartedAt && readAt < counter.segmentStartedAt) {
    return `The meter was replaced on ${when(counter.segmentStartedAt)}; a reading before then belongs to the old meter.`;
  }
  const { previous, next } = counter;
  if (previous) {
    // The words are made only for a refusal: an import checks thousands of readings that pass.
    const prevText = () => `${formatHours(previous.meterValue)} on ${when(previous.readAt)}`;
    if (meterValue < previous.meterValue) {
      return `Reading is lower than the previous one (${prevText()}).`;
    }
    const advance = meterValue - previous.meterValue;
    const elapsed = elapsedHours(previous.readAt, readAt);
    if (advance > elapsed + TENTH_SLACK) {
      return `Reading advances ${formatHours(round1(advance))} but only ${formatHours(round1(elapsed))} passed since the previous reading (${prevText()}).`;
    }
  }
  if (next) {
    const nextText = () => `${formatHours(next.meterValue)} on ${when(next.readAt)}`;
    if (meterValue > next.meterValue) {
      return `Reading is higher than the next one (${nextText()}).`;
    }
    const advance = next.meterValue - meterValue;
    const elapsed = elapsedHours(readAt, next.readAt);
    if (advance > elapsed + TENTH_SLACK) {
      return `The next reading (${nextText()}) would then advance ${formatHours(round1(advance))} in only ${formatHours(round1(elapsed))}.`;
    }
  }
  return null;
}

/**
 * Why a reading cannot be removed, or null when it can: without it the next reading is checked
 * against the one before it, and must still not go backwards nor run more hours than elapsed.
 * `previous` and `next` are the removed reading's neighbours on the same meter.
 */
export function removalProblem(
  counter: Pick<CounterContext, "previous" | "next">,
  timeZone: string,
): string | null {
  const { previous, next } = counter;
  if (!previous || !next) return null;
  const when = (d: Date) => formatShipTime(d, timeZone);
  const nextText = `${formatHours(next.meterValue)} on ${when(next.readAt)}`;
  const prevText = `${formatHours(previous.meterValue)} on ${when(previous.readAt)}`;
  if (next.meterValue < previous.meterValue) {
    return `Without this reading the next one (${nextText}) would be lower than the one before it (${prevText}). Correct the next reading first.`;
  }
  const advance = next.meterValue - previous.meterValue;
  const elapsed = elapsedHours(previous.readAt, next.readAt);
  if (advance > elapsed + TENTH_SLACK) {
    return `Without this reading the next one (${nextText}) would advance ${formatHours(round1(advance))} in only ${formatHours(round1(elapsed))} since the one before it (${prevText}). Correct the next reading first, or correct this one instead of removing it.`;
  }
  return null;
}

/** Hours run per day between two readings; null when no time passed. */
export function hoursPerDay(fromHours: number, fromAt: Date, toHours: number, toAt: Date): number | null {
  const days = elapsedHours(fromAt, toAt) / 24;
  if (days <= 0) return null;
  return round1((toHours - fromHours) / days);
}

export function round1(value: number): number {
  return Math.round(value * 10) / 10;
}

/** Clocks on board drift: a reading up to five minutes ahead of the server is not "in the future". */
export const FUTURE_SLACK_MS = 5 * 60_000;

export function isInFuture(readAt: Date, now: Date): boolean {
  return readAt.getTime() > now.getTime() + FUTURE_SLACK_MS;
}
