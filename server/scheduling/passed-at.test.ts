import { describe, expect, it } from "vitest";
import { passedAt } from "./passed-at";

const at = (iso: string) => new Date(iso);

describe("passedAt: when the counter passed a value, from the readings around it", () => {
  it("interpolates between the last reading below and the first at or above (hand-worked)", () => {
    // 14,990 h at 09:00 on 24 Aug, 15,014 h at 09:00 on 25 Aug: 24 h run in 24 h, so 15,000 h was
    // reached 10 h after the first round, at 19:00 on 24 Aug.
    expect(
      passedAt(15_000, { at: at("2026-08-24T09:00:00Z"), totalHours: 14_990 }, { at: at("2026-08-25T09:00:00Z"), totalHours: 15_014 }),
    ).toEqual(at("2026-08-24T19:00:00Z"));
  });

  it("a reading exactly on the value is the instant", () => {
    expect(
      passedAt(15_000, { at: at("2026-08-24T09:00:00Z"), totalHours: 14_990 }, { at: at("2026-08-25T09:00:00Z"), totalHours: 15_000 }),
    ).toEqual(at("2026-08-25T09:00:00Z"));
  });

  it("no reading below: the first reading at or above; none at or above: not passed", () => {
    expect(passedAt(100, null, { at: at("2026-01-01T00:00:00Z"), totalHours: 250 })).toEqual(at("2026-01-01T00:00:00Z"));
    expect(passedAt(100, { at: at("2026-01-01T00:00:00Z"), totalHours: 50 }, null)).toBeNull();
  });

  it("stays where it is when later readings arrive: only the two readings around the value count", () => {
    const below = { at: at("2026-08-24T09:00:00Z"), totalHours: 14_990 };
    const reached = { at: at("2026-08-25T09:00:00Z"), totalHours: 15_014 };
    // A reading on 26 Aug does not change which two readings surround 15,000 h.
    expect(passedAt(15_000, below, reached)).toEqual(passedAt(15_000, below, reached));
  });
});
