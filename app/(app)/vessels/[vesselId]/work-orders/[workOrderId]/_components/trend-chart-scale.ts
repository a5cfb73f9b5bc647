// The geometry of a measurement's trend chart: pure, so it is tested without a browser. The x axis
// runs from the first recorded value to the furthest of the last value, the due point and the
// point where the line meets its limit (but never further than the series' own span again past the
// last value, so the points stay readable); the y axis holds the values, the limits and the line.
import type { MeasurementTrendView } from "@/server/measurements/contract";
import { lineAt } from "@/server/measurements/trend";

export type Plot = { left: number; top: number; width: number; height: number };
export type Domain = { x0: number; x1: number; y0: number; y1: number };

const DAY_MS = 86_400_000;

/** The due point in the series' own x: running hours, or days since 1970-01-01 UTC. */
export function dueX(trend: Pick<MeasurementTrendView, "basis">, due: { hours: number | null; date: string | null } | null) {
  if (!due) return null;
  if (trend.basis === "hours") return due.hours;
  return due.date ? new Date(due.date).getTime() / DAY_MS : null;
}

/** Ticks at a round step (1, 2, 2.5, 5 × 10ⁿ) giving about `count` of them over [min, max]. */
export function niceTicks(min: number, max: number, count = 4): number[] {
  if (!(max > min)) return [min];
  const raw = (max - min) / count;
  const magnitude = 10 ** Math.floor(Math.log10(raw));
  // The round step whose tick count comes nearest the count asked for.
  const step = [1, 2, 2.5, 5, 10]
    .map((s) => s * magnitude)
    .reduce((best, s) => (Math.abs((max - min) / s - count) < Math.abs((max - min) / best - count) ? s : best));
  const ticks: number[] = [];
  // Whole multiples of the step, cleaned of floating-point dust (3 × 0.2 is 0.6000000000000001).
  for (let k = Math.ceil(min / step - 1e-9); k * step <= max + step * 1e-9; k++) ticks.push(Number((k * step).toPrecision(12)));
  return ticks;
}

export function chartDomain(trend: MeasurementTrendView, due: number | null): Domain {
  const xs = trend.points.map((p) => p.x);
  const first = Math.min(...xs);
  const last = Math.max(...xs);
  const reach = Math.max(last - first, 1);
  const meets = trend.projection.kind === "reaches" ? trend.projection.x : null;
  const x1 = Math.min(Math.max(last, meets ?? last, due ?? last), last + reach);
  const x0 = first === x1 ? first - 1 : first;
  const ys = [
    ...trend.points.map((p) => p.value),
    ...(trend.lower !== null ? [trend.lower] : []),
    ...(trend.upper !== null ? [trend.upper] : []),
    ...(trend.line ? [lineAt(trend.line, x0), lineAt(trend.line, x1)] : []),
  ];
  let y0 = Math.min(...ys);
  let y1 = Math.max(...ys);
  if (y0 === y1) {
    y0 -= 1;
    y1 += 1;
  }
  const pad = (y1 - y0) * 0.08;
  return { x0, x1: x1 === x0 ? x0 + 1 : x1, y0: y0 - pad, y1: y1 + pad };
}

export function scaleX(x: number, d: Domain, plot: Plot): number {
  return plot.left + ((x - d.x0) / (d.x1 - d.x0)) * plot.width;
}

export function scaleY(y: number, d: Domain, plot: Plot): number {
  return plot.top + plot.height - ((y - d.y0) / (d.y1 - d.y0)) * plot.height;
}

/** The fitted line over the recorded span, and its projection on to the domain's end (or the limit). */
export function lineSegments(trend: MeasurementTrendView, d: Domain, plot: Plot) {
  if (!trend.line) return null;
  const line = trend.line;
  const xs = trend.points.map((p) => p.x);
  const last = Math.max(...xs);
  const meets = trend.projection.kind === "reaches" ? Math.min(trend.projection.x, d.x1) : d.x1;
  const at = (x: number) => ({ x: scaleX(x, d, plot), y: scaleY(lineAt(line, x), d, plot) });
  return { fitted: [at(Math.min(...xs)), at(last)] as const, projected: meets > last ? ([at(last), at(meets)] as const) : null };
}
