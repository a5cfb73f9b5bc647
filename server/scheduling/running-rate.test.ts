import { describe, expect, it } from "vitest";
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
});
