// Worked by hand: a plot 100 wide and 40 high at (10, 4), so four days take slots of 25 and a
// share s of the height sits at y = 44 − 40 s.
import { describe, expect, it } from "vitest";
import { countTop, onTimePath, shareY, stackedAreas, trendDays, trendTicks } from "./fleet-trend-scale";

const plot = { left: 10, top: 4, width: 100, height: 40 };
const day = (n: number) => `2026-11-${String(n).padStart(2, "0")}`;
const row = (n: number, outOfTolerance: number | null, late: number | null, onTimeRate: number | null) => ({
  day: day(n),
  outOfTolerance,
  late,
  onTimeRate,
});
// Day 3 has no snapshot (the worker did not run): the areas break there, the rate line does not.
const days = [row(1, 2, 1, 0.5), row(2, 3, 1, 1), row(3, null, null, null), row(4, 0, 4, 0.25)];

describe("trendDays", () => {
  it("turns the board's parallel arrays into one row per day", () => {
    expect(
      trendDays([day(1), day(2)], { outOfTolerance: [2, null], late: [1, null], onTimeRate: [0.5, null] }),
    ).toEqual([row(1, 2, 1, 0.5), row(2, null, null, null)]);
  });
});

describe("countTop", () => {
  it("is four equal whole steps at least as high as the tallest stack", () => {
    expect(countTop(days)).toBe(4); // tallest 3 + 1 = 4 → steps of 1
    expect(countTop([row(1, 0, 0, null)])).toBe(4); // nothing overdue still draws a scale
    expect(countTop([row(1, 5, 4, null)])).toBe(12); // 9 → steps of 3
    expect(countTop([row(1, 30, 3, null)])).toBe(40); // 33 > 4 × 8 → steps of 10
    expect(countTop([row(1, 100, 20, null)])).toBe(120); // exactly 4 × 30
    expect(countTop([row(1, 100, 21, null)])).toBe(160); // 121 → steps of 40
  });
});

describe("shareY", () => {
  it("puts 0 on the baseline and 1 on the top, and keeps a stray share inside the plot", () => {
    expect(shareY(0, plot)).toBe(44);
    expect(shareY(1, plot)).toBe(4);
    expect(shareY(0.25, plot)).toBe(34);
    expect(shareY(1.5, plot)).toBe(4);
    expect(shareY(-1, plot)).toBe(44);
  });
});

describe("stackedAreas", () => {
  it("steps each day's count across its slot, late on top of out of tolerance, broken where no snapshot", () => {
    // Top 4: a work order is 10 high. Day 1: 2 + 1 (y 24, 14); day 2: 3 + 1 (y 14, 4); day 4: 0 + 4.
    const { outOfTolerance, late } = stackedAreas(days, 4, plot);
    expect(outOfTolerance).toEqual([
      "M 10 24 L 35 24 L 35 14 L 60 14 L 60 44 L 35 44 L 35 44 L 10 44 Z",
      "M 85 44 L 110 44 L 110 44 L 85 44 Z",
    ]);
    expect(late).toEqual([
      "M 10 14 L 35 14 L 35 4 L 60 4 L 60 14 L 35 14 L 35 24 L 10 24 Z",
      "M 85 4 L 110 4 L 110 44 L 85 44 Z",
    ]);
  });

  it("draws nothing for a board without snapshots", () => {
    expect(stackedAreas([row(1, null, null, null)], 4, plot)).toEqual({ outOfTolerance: [], late: [] });
  });
});

describe("onTimePath", () => {
  it("joins the days' centres on the 0–100 % scale, across a day without a rate", () => {
    expect(onTimePath(days, plot)).toBe("M 22.5 24 L 47.5 4 L 97.5 34");
    expect(onTimePath([row(1, 1, 0, null)], plot)).toBe("");
  });
});

describe("trendTicks", () => {
  it("labels days at least the gap apart, counted back from the last", () => {
    const month = Array.from({ length: 30 }, (_, i) => row(i + 1, 0, 0, null));
    // Slots of 100/30: a gap of 20 needs every 6th day, from the 30th back.
    const ticks = trendTicks(month, plot, 20);
    expect(ticks.map((t) => t.label)).toEqual(["6 Nov", "12 Nov", "18 Nov", "24 Nov", "30 Nov"]);
    expect(ticks.at(-1)!.at).toBeCloseTo(10 + 29.5 * (100 / 30));
  });

  it("labels every day of a short history, and none of an empty one", () => {
    expect(trendTicks(days, plot, 20).map((t) => t.label)).toEqual(["1 Nov", "2 Nov", "3 Nov", "4 Nov"]);
    expect(trendTicks([], plot)).toEqual([]);
  });
});
