import { describe, expect, it } from "vitest";
import { deferralLimitProblems, highestDeferralHours, type LimitContext, latestDeferralDay } from "./rules";

// A work order due on 15 January 2027 at 24,500 h, routine every 8,000 h; the ship's day is 1 Dec 2026.
const ctx: LimitContext = {
  today: "2026-12-01",
  currentDueDay: "2027-01-15",
  currentDueHours: 24_500,
  intervalHours: 8_000,
};
const fields = (day: string | null, hours: number | null, over: Partial<LimitContext> = {}) =>
  deferralLimitProblems({ proposedDueDay: day, proposedDueHours: hours }, { ...ctx, ...over }).map((p) => p.field);

describe("the limits a deferral may set", () => {
  it("accepts a later day and higher hours inside the bounds", () => {
    expect(fields("2027-03-01", 25_000)).toEqual([]);
  });

  it("refuses a day not after today, even when the work order is already past its due day", () => {
    expect(fields("2026-12-01", null, { currentDueDay: "2026-11-01" })).toEqual(["proposedDueDay"]);
    expect(fields("2026-12-02", null, { currentDueDay: "2026-11-01" })).toEqual([]);
  });

  it("refuses a day on or before the current due day", () => {
    expect(fields("2027-01-15", null)).toEqual(["proposedDueDay"]);
    expect(fields("2027-01-16", null)).toEqual([]);
  });

  it("allows up to two years ahead: 1 Dec 2026 + 24 months = 1 Dec 2028", () => {
    expect(latestDeferralDay("2026-12-01")).toBe("2028-12-01");
    expect(fields("2028-12-01", null)).toEqual([]);
    expect(fields("2028-12-02", null)).toEqual(["proposedDueDay"]);
    // 29 Feb 2028 + 24 months: February 2030 has 28 days, the day clamps to its end.
    expect(latestDeferralDay("2028-02-29")).toBe("2030-02-28");
  });

  it("refuses hours on a work order without an hours limit", () => {
    expect(fields(null, 100, { currentDueHours: null, intervalHours: null })).toEqual(["proposedDueHours"]);
  });

  it("wants hours above the current limit and at most one interval beyond it (24,500 + 8,000 = 32,500 h)", () => {
    expect(highestDeferralHours(ctx)).toBe(32_500);
    expect(fields(null, 24_500)).toEqual(["proposedDueHours"]);
    expect(fields(null, 24_500.1)).toEqual([]);
    expect(fields(null, 32_500)).toEqual([]);
    expect(fields(null, 32_500.1)).toEqual(["proposedDueHours"]);
  });

  it("names both fields when both are wrong", () => {
    expect(fields("2026-11-30", 20_000)).toEqual(["proposedDueDay", "proposedDueHours"]);
  });
});
