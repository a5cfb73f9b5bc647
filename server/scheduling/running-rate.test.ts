import { describe, expect, it } from "vitest";
import { formatRate } from "@/server/format/hours";
import { projectHours } from "./plan-work-order";
import { runningRate } from "./running-rate";

const now = new Date("2026-06-30T12:00:00Z");
const daysAgo = (d: number, totalHours: number) => ({ readAt: new Date(now.getTime() - d * 86_400_000), totalHours });

// Worked examples computed by hand.
describe("runningRate", () => {
  it("30 days at 20 h/day: 1,000 → 1,600 h gives 20 h/day, measured", () => {
    expect(runningRate([daysAgo(30, 1000), daysAgo(15, 1300), daysAgo(0, 1600)], now, 12)).toEqual({
      hoursPerDay: 20,
      basis: "measured",
      spanDays: 30,
    });
  });

  it("uses the reading before the window so the whole look-back counts", () => {
    // 40 days ago 0 h, 10 days ago 450 h, today 600 h: window starts at the 40-day reading,
    // span 40 days, 600 h → 15 h/day.
    expect(runningRate([daysAgo(40, 0), daysAgo(10, 450), daysAgo(0, 600)], now, 12).hoursPerDay).toBe(15);
  });

  it("falls back to the planned rate with under 7 days of history", () => {
    expect(runningRate([daysAgo(5, 100), daysAgo(0, 200)], now, 12)).toEqual({
      hoursPerDay: 12,
      basis: "planned",
      spanDays: 0,
    });
  });

  it("falls back to the planned rate with no readings in the look-back", () => {
    expect(runningRate([daysAgo(60, 100)], now, 16).basis).toBe("planned");
  });

  it("a stopped machine has a measured rate of 0", () => {
    expect(runningRate([daysAgo(20, 500), daysAgo(0, 500)], now, 12)).toMatchObject({
      hoursPerDay: 0,
      basis: "measured",
    });
  });

  // Issue 14, "running rates stored to a tenth" (worked by hand; the rates are the examples,
  // the 100 h to go is ours): an emergency generator run 1 h a month, one run 4.4 h in 30 days.
  it("keeps a rate under a tenth of an hour a day: 1 h in 30 days is 0.0333 h/day, not 0.0", () => {
    const rate = runningRate([daysAgo(30, 200), daysAgo(0, 201)], now, 0.5);
    expect(rate.basis).toBe("measured");
    expect(rate.hoursPerDay).toBeCloseTo(1 / 30, 10);
    expect(formatRate(rate.hoursPerDay)).toBe("1.0 h in 30 days");
    // It projects: 100 h to go at 1/30 h/day is 3,000 days away, not never.
    expect(projectHours(301, { totalHours: 201, readAt: now, hoursPerDay: rate.hoursPerDay })).not.toBeNull();
  });

  it("projects 4.4 h in 30 days at 0.1467 h/day: 100 h to go is 682 days, not the 1,000 of a rate cut to 0.1", () => {
    const rate = runningRate([daysAgo(30, 500), daysAgo(0, 504.4)], now, 0.5);
    expect(rate.hoursPerDay).toBeCloseTo(4.4 / 30, 10);
    const due = projectHours(604.4, { totalHours: 504.4, readAt: now, hoursPerDay: rate.hoursPerDay })!;
    const days = (due.getTime() - now.getTime()) / 86_400_000;
    expect(days).toBeCloseTo(681.8, 1);
    // The rate rounded to a tenth put it 318 days later.
    expect(1000 - days).toBeCloseTo(318.2, 1);
    expect(formatRate(rate.hoursPerDay)).toBe("0.1 h/day");
  });
});
