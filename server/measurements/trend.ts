// Measurement trends (issue 14): each measurement a routine records, as a series over its
// completions, a straight line fitted to it by ordinary least squares, and where that line meets
// the limit it is heading for. Pure: the caller loads the completions and the counter.
//
// Least squares, the ordinary formula (NIST/SEMATECH e-Handbook of Statistical Methods, §4.1.4.1,
// linear least squares regression; SOURCES.md, "Trends"):
//   slope = Σ(x − x̄)(y − ȳ) / Σ(x − x̄)²,  intercept = ȳ − slope · x̄.
// x is the counter's running hours at completion (routines by hours) or the day of completion
// (calendar routines, as days since 1970-01-01 UTC). A straight line is only "the present rate":
// a liner renewed, a new maker's figure or a change of fuel all break it; the page says so.
import type { RecordedMeasurement, RoutineMeasurement } from "@/db/schema";

const DAY_MS = 86_400_000;

/** The newest completions a series is drawn from: a routine's history is bounded. */
export const SERIES_LIMIT = 50;
/** Fewer points than this and no line is fitted: two points make a line, not a trend. */
export const MIN_POINTS = 3;
/** A line reaching its limit further than this beyond the last point counts as flat (100 years). */
export const HORIZON = { hours: 100 * 8_760, days: 100 * 365 } as const;

export type TrendBasis = "hours" | "days";

export type TrendCompletion = {
  doneAt: Date;
  counterHours: number | null;
  measurements: readonly Pick<RecordedMeasurement, "name" | "value">[];
};

/** The counter's latest reading and running rate, to date a projection in running hours. */
export type TrendCounter = { totalHours: number; readAt: Date; hoursPerDay: number | null };

export type TrendPoint = { x: number; doneAt: string; counterHours: number | null; value: number };

/** value = intercept + slope · x, in the series' own x (hours, or days since 1970-01-01 UTC). */
export type StraightLine = { slope: number; intercept: number };

export type NoProjection =
  /** Fewer than MIN_POINTS recorded values. */
  | "too-few-points"
  /** Every value recorded at the same counter hours (or on the same day). */
  | "no-spread"
  /** The line does not change, or would take more than the horizon to reach a limit. */
  | "flat"
  /** The line moves away from the only limit there is. */
  | "away-from-limit"
  /** The measurement has neither a lower nor an upper limit. */
  | "no-limit"
  /** The last value, or the line at the last point, is already at or past the limit it heads for. */
  | "past-limit";

export type Projection =
  | {
      kind: "reaches";
      limit: "upper" | "lower";
      limitValue: number;
      /** Where the line meets the limit, in the series' x. */
      x: number;
      /** Running hours at the meeting point (hours basis only). */
      atHours: number | null;
      /** Its estimated date: hours at the counter's running rate, or the day itself. Null at a rate of 0. */
      atDate: string | null;
    }
  | { kind: "none"; reason: NoProjection; limit: "upper" | "lower" | null; limitValue: number | null };

export type MeasurementTrend = RoutineMeasurement & {
  basis: TrendBasis;
  points: TrendPoint[];
  /** Null with fewer than MIN_POINTS points or no spread in x. */
  line: StraightLine | null;
  projection: Projection;
};

/** The ordinary least-squares line through the points; null with fewer than 2 or all at one x. */
export function fitStraightLine(points: readonly { x: number; y: number }[]): StraightLine | null {
  const n = points.length;
  if (n < 2) return null;
  const meanX = points.reduce((sum, p) => sum + p.x, 0) / n;
  const meanY = points.reduce((sum, p) => sum + p.y, 0) / n;
  let sxy = 0;
  let sxx = 0;
  for (const p of points) {
    sxy += (p.x - meanX) * (p.y - meanY);
    sxx += (p.x - meanX) ** 2;
  }
  if (sxx === 0) return null;
  const slope = sxy / sxx;
  return { slope, intercept: meanY - slope * meanX };
}

export const lineAt = (line: StraightLine, x: number) => line.intercept + line.slope * x;

/** The x of a completion in a basis: its counter hours, or its day (null when hours are missing). */
function xOf(c: TrendCompletion, basis: TrendBasis): number | null {
  return basis === "hours" ? c.counterHours : c.doneAt.getTime() / DAY_MS;
}

/** The newest SERIES_LIMIT completions, oldest first. */
export function latestCompletions<T extends { doneAt: Date }>(completions: readonly T[]): T[] {
  return [...completions].sort((a, b) => a.doneAt.getTime() - b.doneAt.getTime()).slice(-SERIES_LIMIT);
}

/** Each measurement the routine defines, over the routine's completions (the newest SERIES_LIMIT). */
export function measurementTrends(input: {
  measurements: readonly RoutineMeasurement[];
  basis: TrendBasis;
  completions: readonly TrendCompletion[];
  counter: TrendCounter | null;
}): MeasurementTrend[] {
  const series = latestCompletions(input.completions);
  return input.measurements.map((m) => {
    const points: TrendPoint[] = [];
    for (const c of series) {
      const x = xOf(c, input.basis);
      const recorded = c.measurements.find((r) => r.name === m.name);
      if (x === null || !recorded || !Number.isFinite(recorded.value)) continue;
      points.push({ x, doneAt: c.doneAt.toISOString(), counterHours: c.counterHours, value: recorded.value });
    }
    points.sort((a, b) => a.x - b.x);
    const line = points.length >= MIN_POINTS ? fitStraightLine(points.map((p) => ({ x: p.x, y: p.value }))) : null;
    return { ...m, basis: input.basis, points, line, projection: project(m, input.basis, points, line, input.counter) };
  });
}

function none(reason: NoProjection, limit: "upper" | "lower" | null = null, limitValue: number | null = null): Projection {
  return { kind: "none", reason, limit, limitValue };
}

function project(
  m: RoutineMeasurement,
  basis: TrendBasis,
  points: TrendPoint[],
  line: StraightLine | null,
  counter: TrendCounter | null,
): Projection {
  if (points.length < MIN_POINTS) return none("too-few-points");
  if (!line) return none("no-spread");
  if (m.lower === null && m.upper === null) return none("no-limit");
  const first = points[0]!;
  const last = points.at(-1)!;
  // Flat: the line moves less over the whole series than a billionth of the values' size.
  const scale = Math.max(1, ...points.map((p) => Math.abs(p.value)));
  if (Math.abs(line.slope * (last.x - first.x)) <= 1e-9 * scale) return none("flat");
  const limit = line.slope > 0 ? "upper" : "lower";
  const limitValue = limit === "upper" ? m.upper : m.lower;
  if (limitValue === null) return none("away-from-limit", limit === "upper" ? "lower" : "upper", limit === "upper" ? m.lower : m.upper);
  const lastPast = limit === "upper" ? last.value >= limitValue : last.value <= limitValue;
  const x = (limitValue - line.intercept) / line.slope;
  if (lastPast || x <= last.x) return none("past-limit", limit, limitValue);
  if (x - last.x > HORIZON[basis]) return none("flat", limit, limitValue);
  if (basis === "days") return { kind: "reaches", limit, limitValue, x, atHours: null, atDate: new Date(x * DAY_MS).toISOString() };
  const rate = counter?.hoursPerDay ?? 0;
  const atMs = counter && rate > 0 ? counter.readAt.getTime() + ((x - counter.totalHours) / rate) * DAY_MS : null;
  // A slow counter (an emergency generator's hour a month) puts a far limit past any date a Date
  // holds: beyond a century ahead there is no date to give, only the hours.
  const atDate = atMs !== null && Number.isFinite(atMs) && atMs - counter!.readAt.getTime() <= 100 * 365.25 * DAY_MS
    ? new Date(atMs).toISOString()
    : null;
  return { kind: "reaches", limit, limitValue, x, atHours: x, atDate };
}

/** A work order's limits: due hours and due date (a deferral's in force when there is one). */
export type DueLimits = { hours: number | null; date: Date | null };

/**
 * Whether the line meets its limit before the job falls due. A job falls due at the first of its
 * limits, so the meeting point must come before every limit the work order has that can be
 * compared: hours with hours, the estimated date with the due date.
 */
export function reachesBeforeDue(projection: Projection, due: DueLimits): boolean {
  if (projection.kind !== "reaches") return false;
  const checks: boolean[] = [];
  if (projection.atHours !== null && due.hours !== null) checks.push(projection.atHours < due.hours);
  if (projection.atDate !== null && due.date !== null) checks.push(new Date(projection.atDate) < due.date);
  return checks.length > 0 && checks.every(Boolean);
}
