// How a measurement trend is said: the chart's caption, the reason there is no projection, and the
// warning when the line reaches its limit before the job falls due. Pure, shared by the work-order
// page and the daily digest, so both say the same.
import { formatHours, formatShipDate } from "@/server/format/hours";
import type { DueLimits, MeasurementTrend, NoProjection, Projection } from "./trend";

/** Decimals to show: as many as the limits and recorded values carry, at most 3. */
export function valueDecimals(trend: Pick<MeasurementTrend, "lower" | "upper" | "points">): number {
  const numbers = [trend.lower, trend.upper, ...trend.points.map((p) => p.value)].filter((n) => n !== null);
  const decimals = numbers.map((n) => {
    const text = String(Math.round(n * 1000) / 1000);
    return text.includes(".") ? text.split(".")[1]!.length : 0;
  });
  return Math.min(3, Math.max(0, ...decimals));
}

/** 0.8 with 2 decimals and unit mm → "0.80 mm". */
export function measuredValue(value: number, decimals: number, unit: string): string {
  const text = new Intl.NumberFormat("en-GB", { minimumFractionDigits: decimals, maximumFractionDigits: decimals }).format(value);
  return unit ? `${text} ${unit}` : text;
}

/** Running hours as an estimate: three significant figures (41,234 → "41,200 h"), never below 1 h. */
export function aboutHours(hours: number): string {
  const step = Math.max(1, 10 ** (Math.floor(Math.log10(Math.max(Math.abs(hours), 1))) - 2));
  return formatHours(Math.round(hours / step) * step);
}

/** "Liner wear, top ring TDC" → "liner wear, top ring TDC"; an abbreviation ("TBN") stays. */
function inSentence(name: string): string {
  return /^[A-Z][a-z]/.test(name) ? name[0]!.toLowerCase() + name.slice(1) : name;
}

const basisWords = (trend: MeasurementTrend) =>
  trend.basis === "hours" ? "against the counter’s running hours" : "against the date";

/** How fast the line moves: "rising 0.013 mm per 1,000 h" / "falling 0.78 bar a year". */
export function rateWords(trend: MeasurementTrend): string | null {
  if (!trend.line) return null;
  const per = trend.basis === "hours" ? 1000 : 365;
  const change = trend.line.slope * per;
  const decimals = Math.min(4, valueDecimals(trend) + 1);
  const amount = measuredValue(Math.abs(change), decimals, trend.unit);
  return `${change >= 0 ? "rising" : "falling"} ${amount} ${trend.basis === "hours" ? "per 1,000 h" : "a year"}`;
}

/** Where the line meets the limit: "at about 41,200 h (about 12 Mar 2027)" or "about 12 Mar 2027". */
export function meetingWords(projection: Extract<Projection, { kind: "reaches" }>, timeZone: string): string {
  const date = projection.atDate ? `about ${formatShipDate(new Date(projection.atDate), timeZone)}` : null;
  if (projection.atHours === null) return date ?? "at an unknown date";
  return `at about ${aboutHours(projection.atHours)}${date ? ` (${date})` : ""}`;
}

const NO_PROJECTION: Record<NoProjection, (limit: string) => string> = {
  "too-few-points": () => `No projection: a trend needs at least 3 recorded values.`,
  "no-spread": () => `No projection: every value was recorded at the same point.`,
  flat: () => `No projection: at this rate the values do not reach a limit within a hundred years.`,
  "away-from-limit": (limit) => `No projection: the values move away from the only limit (the ${limit}).`,
  "no-limit": () => `No projection: the measurement has no limits.`,
  "past-limit": (limit) => `No projection: the values are already at or past the ${limit}.`,
};

/** The chart's caption: what the line is, from how many points, and where it leads. */
export function trendCaption(trend: MeasurementTrend, timeZone: string): string {
  const n = trend.points.length;
  const decimals = valueDecimals(trend);
  const p = trend.projection;
  const limit = p.limitValue === null ? "" : `${p.limit} limit ${measuredValue(p.limitValue, decimals, trend.unit)}`;
  if (!trend.line) {
    return `${n === 1 ? "1 recorded value" : `${n} recorded values`} ${basisWords(trend)}. ${NO_PROJECTION[p.kind === "none" ? p.reason : "too-few-points"](limit)}`;
  }
  const fitted = `A straight line fitted by least squares to ${n} points ${basisWords(trend)}, ${rateWords(trend)}.`;
  if (p.kind === "none") return `${fitted} ${NO_PROJECTION[p.reason](limit)}`;
  return `${fitted} At the present rate it reaches the ${limit} ${meetingWords(p, timeZone)}.`;
}

/** The work order's next due point in words: "at 42,000 h", "on 3 Feb 2027". */
function dueWords(due: DueLimits, timeZone: string): string {
  if (due.hours !== null) return `at ${formatHours(due.hours)}`;
  return due.date ? `on ${formatShipDate(due.date, timeZone)}` : "";
}

/**
 * The plain warning, e.g. "At the present rate, liner wear reaches its limit 0.80 mm at about
 * 41,200 h — before this job falls due at 42,000 h." Call it only when `reachesBeforeDue` holds.
 */
export function warningSentence(trend: MeasurementTrend, due: DueLimits, timeZone: string): string {
  const p = trend.projection;
  if (p.kind !== "reaches") throw new Error("warningSentence needs a projection that reaches its limit");
  const limit = measuredValue(p.limitValue, valueDecimals(trend), trend.unit);
  return `At the present rate, ${inSentence(trend.name)} reaches its limit ${limit} ${meetingWords(p, timeZone)} — before this job falls due ${dueWords(due, timeZone)}.`;
}
