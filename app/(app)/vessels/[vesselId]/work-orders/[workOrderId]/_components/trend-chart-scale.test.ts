import { describe, expect, it } from "vitest";
import type { MeasurementTrendView } from "@/server/measurements/contract";
import { chartDomain, dueX, lineSegments, niceTicks } from "./trend-chart-scale";

// The hand-worked series of server/measurements/trend.test.ts: slope 0.000088 mm/h, intercept 0.11,
// meeting the upper limit 0.8 at 7,840.9 h.
const TREND: MeasurementTrendView = {
  name: "Liner wear",
  unit: "mm",
  lower: 0,
  upper: 0.8,
  basis: "hours",
  points: [1000, 2000, 3000, 4000].map((x, i) => ({ x, doneAt: `2026-01-0${i + 1}T00:00:00.000Z`, counterHours: x, value: [0.2, 0.3, 0.34, 0.48][i]! })),
  line: { slope: 0.000088, intercept: 0.11 },
  projection: { kind: "reaches", limit: "upper", limitValue: 0.8, x: 7840.909, atHours: 7840.909, atDate: null },
  caption: "",
  warning: null,
};
const PLOT = { left: 0, top: 0, width: 300, height: 100 };

describe("niceTicks", () => {
  it("steps by 1, 2, 2.5 or 5 times a power of ten", () => {
    expect(niceTicks(0, 0.8)).toEqual([0, 0.2, 0.4, 0.6, 0.8]);
    expect(niceTicks(1000, 7000, 3)).toEqual([2000, 4000, 6000]);
    expect(niceTicks(-0.1, 0.9)).toEqual([0, 0.25, 0.5, 0.75]);
    expect(niceTicks(5, 5)).toEqual([5]);
  });
});

describe("chartDomain", () => {
  it("runs to the meeting point, but no further than the series' span again past the last value", () => {
    // Span 3,000 h: the axis may reach 7,000 h; the line meets the limit at 7,841 h, beyond it.
    expect(chartDomain(TREND, null)).toMatchObject({ x0: 1000, x1: 7000 });
    // A due point at 5,000 h is inside that reach; the meeting point still pulls the axis to its cap.
    expect(chartDomain(TREND, 5000).x1).toBe(7000);
    const near = { ...TREND, projection: { ...TREND.projection, x: 5000 } } as MeasurementTrendView;
    expect(chartDomain(near, 4500).x1).toBe(5000);
  });

  it("holds the values, both limits and the line, with a margin of 8 %", () => {
    const d = chartDomain(TREND, null);
    // Lowest: the lower limit 0; highest: the line at 7,000 h, 0.11 + 0.000088 × 7000 = 0.726, under the limit 0.8.
    expect(d.y0).toBeCloseTo(-0.064, 9);
    expect(d.y1).toBeCloseTo(0.864, 9);
  });
});

describe("lineSegments", () => {
  it("draws the fitted line over the recorded span and the projection on to the axis' end", () => {
    const d = chartDomain(TREND, null);
    const seg = lineSegments(TREND, d, PLOT)!;
    expect(seg.fitted[0].x).toBe(0);
    expect(seg.fitted[1].x).toBeCloseTo(150, 9);
    expect(seg.projected![1].x).toBeCloseTo(300, 9);
  });

  it("puts a date's due point on the days axis", () => {
    expect(dueX({ basis: "days" }, { hours: null, date: "1970-01-11T00:00:00.000Z" })).toBe(10);
    expect(dueX({ basis: "hours" }, { hours: 1800, date: null })).toBe(1800);
    expect(dueX({ basis: "hours" }, null)).toBeNull();
  });
});
