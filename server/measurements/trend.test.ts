// Hand-worked least-squares examples. The formula is the ordinary one (NIST/SEMATECH e-Handbook of
// Statistical Methods, §4.1.4.1; SOURCES.md, "Trends": slope = Σ(x−x̄)(y−ȳ) / Σ(x−x̄)², common
// practice); every expected value below is worked by hand in the comment beside it.
import { describe, expect, it } from "vitest";
import type { RoutineMeasurement } from "@/db/schema";
import {
  fitStraightLine,
  HORIZON,
  measurementTrends,
  reachesBeforeDue,
  SERIES_LIMIT,
  type TrendCompletion,
  type TrendCounter,
} from "./trend";
import { aboutHours, trendCaption, valueDecimals, warningSentence } from "./trend-words";

const WEAR: RoutineMeasurement = { name: "Liner wear", unit: "mm", lower: 0, upper: 0.8 };
const PRESSURE: RoutineMeasurement = { name: "Delivery pressure", unit: "bar", lower: 2.7, upper: null };
const DAY = 86_400_000;
const JAN_1 = Date.UTC(2026, 0, 1);

/** Completions at these counter hours with these liner-wear values, a day apart. */
function byHours(rows: [number | null, number][], name = WEAR.name): TrendCompletion[] {
  return rows.map(([counterHours, value], i) => ({
    doneAt: new Date(JAN_1 + i * DAY),
    counterHours,
    measurements: [{ name, value }],
  }));
}

// The hours example: (1000, 0.20), (2000, 0.30), (3000, 0.34), (4000, 0.48).
// x̄ = 2500, ȳ = 1.32 / 4 = 0.33; x − x̄ = −1500, −500, 500, 1500; y − ȳ = −0.13, −0.03, 0.01, 0.15.
// Σ(x−x̄)(y−ȳ) = 195 + 15 + 5 + 225 = 440; Σ(x−x̄)² = 2.25e6 + 0.25e6 + 0.25e6 + 2.25e6 = 5e6.
// slope = 440 / 5e6 = 0.000088 mm/h (0.088 mm per 1,000 h); intercept = 0.33 − 0.000088 × 2500 = 0.11.
// The upper limit 0.8 is met at x = (0.8 − 0.11) / 0.000088 = 7,840.909… h.
const HOURS_SERIES = byHours([
  [1000, 0.2],
  [2000, 0.3],
  [3000, 0.34],
  [4000, 0.48],
]);
// The counter read 4,500 h on 1 June 2026 and runs 20 h/day: (7,840.909 − 4,500) / 20 = 167.045 days
// → 15 November 2026 (1 June + 167 days) at 0.04545 × 24 h = 01:05:27.3 UTC.
const COUNTER: TrendCounter = { totalHours: 4500, readAt: new Date(Date.UTC(2026, 5, 1)), hoursPerDay: 20 };

describe("fitStraightLine", () => {
  it("gives back a line the points lie on exactly", () => {
    const line = fitStraightLine([0, 1, 2, 3].map((x) => ({ x, y: 2 * x + 1 })));
    expect(line?.slope).toBeCloseTo(2, 12);
    expect(line?.intercept).toBeCloseTo(1, 12);
  });

  it("fits the hand-worked hours example", () => {
    const line = fitStraightLine(HOURS_SERIES.map((c) => ({ x: c.counterHours!, y: c.measurements[0]!.value })));
    expect(line?.slope).toBeCloseTo(0.000088, 12);
    expect(line?.intercept).toBeCloseTo(0.11, 10);
  });

  it("has no line through one point, or through points all at one x", () => {
    expect(fitStraightLine([{ x: 1, y: 1 }])).toBeNull();
    expect(fitStraightLine([{ x: 5, y: 1 }, { x: 5, y: 2 }, { x: 5, y: 3 }])).toBeNull();
  });
});

describe("measurementTrends, by running hours", () => {
  it("projects where the line meets the upper limit, in hours and as a date at the running rate", () => {
    const [trend] = measurementTrends({ measurements: [WEAR], basis: "hours", completions: HOURS_SERIES, counter: COUNTER });
    expect(trend!.points.map((p) => [p.x, p.value])).toEqual([
      [1000, 0.2],
      [2000, 0.3],
      [3000, 0.34],
      [4000, 0.48],
    ]);
    const p = trend!.projection;
    expect(p.kind).toBe("reaches");
    if (p.kind !== "reaches") return;
    expect(p.limit).toBe("upper");
    expect(p.limitValue).toBe(0.8);
    expect(p.atHours).toBeCloseTo(7840.909, 3);
    expect(Math.abs(new Date(p.atDate!).getTime() - Date.UTC(2026, 10, 15, 1, 5, 27, 273))).toBeLessThan(1000);
  });

  it("says it in words: the caption and, before the due point, the warning", () => {
    const [trend] = measurementTrends({ measurements: [WEAR], basis: "hours", completions: HOURS_SERIES, counter: COUNTER });
    // Decimals: 0.34 and 0.48 carry two, so the limit reads 0.80 mm; 7,840.9 h to three figures is 7,840 h.
    expect(valueDecimals(trend!)).toBe(2);
    expect(trendCaption(trend!, "UTC")).toBe(
      "A straight line fitted by least squares to 4 points against the counter’s running hours, rising 0.088 mm per 1,000 h. " +
        "At the present rate it reaches the upper limit 0.80 mm at about 7,840 h (about 15 Nov 2026).",
    );
    const due = { hours: 8000, date: new Date(Date.UTC(2026, 11, 1)) };
    expect(reachesBeforeDue(trend!.projection, due)).toBe(true);
    expect(warningSentence(trend!, due, "UTC")).toBe(
      "At the present rate, liner wear reaches its limit 0.80 mm at about 7,840 h (about 15 Nov 2026) — before this job falls due at 8,000 h.",
    );
  });

  it("gives no warning when the job falls due first, by hours or by its calendar date", () => {
    const [trend] = measurementTrends({ measurements: [WEAR], basis: "hours", completions: HOURS_SERIES, counter: COUNTER });
    expect(reachesBeforeDue(trend!.projection, { hours: 7500, date: null })).toBe(false);
    // 7,841 h comes before 8,000 h, but the job's calendar limit (1 October) comes before 15 November.
    expect(reachesBeforeDue(trend!.projection, { hours: 8000, date: new Date(Date.UTC(2026, 9, 1)) })).toBe(false);
    expect(reachesBeforeDue(trend!.projection, { hours: null, date: null })).toBe(false);
  });

  it("has no date for the meeting point without a counter or at a rate of 0", () => {
    for (const counter of [null, { ...COUNTER, hoursPerDay: 0 }]) {
      const [trend] = measurementTrends({ measurements: [WEAR], basis: "hours", completions: HOURS_SERIES, counter });
      expect(trend!.projection).toMatchObject({ kind: "reaches", atDate: null });
      // The hours still compare.
      expect(reachesBeforeDue(trend!.projection, { hours: 8000, date: new Date(Date.UTC(2026, 6, 1)) })).toBe(true);
    }
  });

  it("has no date for a meeting point further than a century ahead at a slow counter's rate", () => {
    // 3,341 h to go at 0.003 h/day (an emergency generator's hour a year) is some 3,000 years: no
    // date a Date can hold, and no date worth giving. The hours still stand.
    const [trend] = measurementTrends({
      measurements: [WEAR],
      basis: "hours",
      completions: HOURS_SERIES,
      counter: { ...COUNTER, hoursPerDay: 0.003 },
    });
    expect(trend!.projection).toMatchObject({ kind: "reaches", atDate: null });
  });

  it("leaves out completions without counter hours or without this measurement", () => {
    const completions = [
      ...HOURS_SERIES,
      { doneAt: new Date(JAN_1 + 10 * DAY), counterHours: null, measurements: [{ name: WEAR.name, value: 0.9 }] },
      { doneAt: new Date(JAN_1 + 11 * DAY), counterHours: 4200, measurements: [{ name: "Ring groove clearance", value: 0.3 }] },
      { doneAt: new Date(JAN_1 + 12 * DAY), counterHours: 4300, measurements: [] },
    ];
    const [trend] = measurementTrends({ measurements: [WEAR], basis: "hours", completions, counter: COUNTER });
    expect(trend!.points.length).toBe(4);
    expect(trend!.projection).toMatchObject({ kind: "reaches", limit: "upper" });
  });

  it(`draws from the newest ${SERIES_LIMIT} completions only`, () => {
    const many = byHours(Array.from({ length: 60 }, (_, i) => [(i + 1) * 100, 0.1 + i * 0.005] as [number, number]));
    const [trend] = measurementTrends({ measurements: [WEAR], basis: "hours", completions: many.reverse(), counter: null });
    expect(trend!.points.length).toBe(SERIES_LIMIT);
    expect(trend!.points[0]!.x).toBe(1100);
    expect(trend!.points.at(-1)!.x).toBe(6000);
  });
});

describe("measurementTrends, by date (calendar routines)", () => {
  // Days 0, 30, 60, 90 from 1 January 2026: 3.30, 3.22, 3.18, 3.10 bar, lower limit 2.7 only.
  // x̄ = 45 days, ȳ = 12.8 / 4 = 3.2; x − x̄ = −45, −15, 15, 45; y − ȳ = 0.10, 0.02, −0.02, −0.10.
  // Σ(x−x̄)(y−ȳ) = −4.5 − 0.3 − 0.3 − 4.5 = −9.6; Σ(x−x̄)² = 2025 + 225 + 225 + 2025 = 4500.
  // slope = −9.6 / 4500 = −0.0021333 bar/day (−0.779 bar a year); the line is 3.2 at day 45 and meets
  // 2.7 after (2.7 − 3.2) / −0.0021333 = 234.375 more days: day 279.375 = 7 October 2026, 09:00 UTC.
  const completions: TrendCompletion[] = [
    [0, 3.3],
    [30, 3.22],
    [60, 3.18],
    [90, 3.1],
  ].map(([day, value]) => ({
    doneAt: new Date(JAN_1 + day! * DAY),
    counterHours: null,
    measurements: [{ name: PRESSURE.name, value: value! }],
  }));

  it("projects the day a falling value meets its lower limit", () => {
    const [trend] = measurementTrends({ measurements: [PRESSURE], basis: "days", completions, counter: null });
    expect(trend!.line!.slope).toBeCloseTo(-9.6 / 4500, 12);
    const p = trend!.projection;
    expect(p).toMatchObject({ kind: "reaches", limit: "lower", limitValue: 2.7, atHours: null });
    if (p.kind !== "reaches") return;
    expect(Math.abs(new Date(p.atDate!).getTime() - Date.UTC(2026, 9, 7, 9))).toBeLessThan(1000);
    expect(trendCaption(trend!, "UTC")).toBe(
      "A straight line fitted by least squares to 4 points against the date, falling 0.779 bar a year. " +
        "At the present rate it reaches the lower limit 2.70 bar about 7 Oct 2026.",
    );
    const due = { hours: null, date: new Date(Date.UTC(2026, 11, 31)) };
    expect(reachesBeforeDue(p, due)).toBe(true);
    expect(reachesBeforeDue(p, { hours: null, date: new Date(Date.UTC(2026, 8, 30)) })).toBe(false);
    expect(warningSentence(trend!, due, "UTC")).toBe(
      "At the present rate, delivery pressure reaches its limit 2.70 bar about 7 Oct 2026 — before this job falls due on 31 Dec 2026.",
    );
  });
});

describe("no projection, and why", () => {
  const trendOf = (rows: [number | null, number][], m: RoutineMeasurement = WEAR) =>
    measurementTrends({ measurements: [m], basis: "hours", completions: byHours(rows, m.name), counter: COUNTER })[0]!;

  it("with fewer than 3 points", () => {
    const t = trendOf([
      [1000, 0.2],
      [2000, 0.4],
    ]);
    expect(t.line).toBeNull();
    expect(t.projection).toMatchObject({ kind: "none", reason: "too-few-points" });
    expect(trendCaption(t, "UTC")).toBe(
      "2 recorded values against the counter’s running hours. No projection: a trend needs at least 3 recorded values.",
    );
  });

  it("with every value at the same counter hours", () => {
    expect(trendOf([[1000, 0.2], [1000, 0.3], [1000, 0.4]]).projection).toMatchObject({ reason: "no-spread" });
  });

  it("with a flat line (0.1 three times is not exactly 0.1 on average in floating point)", () => {
    expect(trendOf([[1000, 0.1], [2000, 0.1], [3000, 0.1]]).projection).toMatchObject({ reason: "flat" });
  });

  it("with a line that would take more than a hundred years to reach the limit", () => {
    // 0.100, 0.100, 0.101 at 0, 1000, 2000 h: slope 1 / 2e6 = 5e-7 mm/h; 100 mm is ~2e8 h away, past 876,000 h.
    const t = trendOf([[0, 0.1], [1000, 0.1], [2000, 0.101]], { ...WEAR, upper: 100 });
    expect(HORIZON.hours).toBe(876_000);
    expect(t.projection).toMatchObject({ reason: "flat" });
  });

  it("with a line moving away from the only limit", () => {
    const t = trendOf([[1000, 0.5], [2000, 0.6], [3000, 0.7]], { ...WEAR, upper: null });
    expect(t.projection).toMatchObject({ kind: "none", reason: "away-from-limit", limit: "lower", limitValue: 0 });
    expect(trendCaption(t, "UTC")).toMatch(/No projection: the values move away from the only limit \(the lower limit 0\.0 mm\)\.$/);
  });

  it("with no limits at all", () => {
    expect(trendOf([[1000, 0.5], [2000, 0.6], [3000, 0.7]], { ...WEAR, lower: null, upper: null }).projection).toMatchObject({
      reason: "no-limit",
    });
  });

  it("when the last value is already at the limit", () => {
    const t = trendOf([[1000, 0.5], [2000, 0.65], [3000, 0.8]]);
    expect(t.projection).toMatchObject({ kind: "none", reason: "past-limit", limit: "upper", limitValue: 0.8 });
    expect(trendCaption(t, "UTC")).toMatch(/No projection: the values are already at or past the upper limit 0\.80 mm\.$/);
  });

  it("when the line is past the limit at the last point although the last value is not", () => {
    // (0, 0.5), (1000, 0.9), (2000, 0.79): x̄ = 1000, ȳ = 0.73; Σ(x−x̄)(y−ȳ) = 230 + 0 + 60 = 290,
    // Σ(x−x̄)² = 2e6: slope 0.000145, intercept 0.585; 0.8 is met at 1,482.8 h, before the last point.
    expect(trendOf([[0, 0.5], [1000, 0.9], [2000, 0.79]]).projection).toMatchObject({ reason: "past-limit" });
  });
});

describe("aboutHours", () => {
  it("rounds an estimate to three significant figures", () => {
    expect(aboutHours(41_234)).toBe("41,200 h");
    expect(aboutHours(7_840.9)).toBe("7,840 h");
    expect(aboutHours(123_456)).toBe("123,000 h");
    expect(aboutHours(42.4)).toBe("42 h");
  });
});
