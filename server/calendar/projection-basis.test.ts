import { describe, expect, it } from "vitest";
import { projectionBasis } from "./projection-basis";

describe("projectionBasis", () => {
  it("names the rate and the reading the projection starts from, on the ship's day", () => {
    // 28 Nov 2026 20:00 UTC is 29 Nov 04:00 in Singapore (UTC+8): the ship's day is 29 Nov.
    const text = projectionBasis(
      {
        hoursPerDay: 17.6,
        rateBasis: "measured",
        lastReadAt: new Date("2026-11-28T20:00:00Z"),
        lastTotalHours: 12431.5,
        dueHours: 12500,
      },
      "Asia/Singapore",
    );
    expect(text).toBe("due at 12,500 h; projected at 17.6 h/day from the reading of 29 Nov, 12,431.5 h");
  });

  it("says when the rate is the counter's planned one", () => {
    const text = projectionBasis(
      { hoursPerDay: 12, rateBasis: "planned", lastReadAt: new Date("2026-11-28T08:00:00Z"), lastTotalHours: null, dueHours: null },
      "UTC",
    );
    expect(text).toBe("projected at 12.0 h/day (the planned rate: too little history) from the reading of 28 Nov");
  });

  it("says so when there is nothing to project from", () => {
    const text = projectionBasis(
      { hoursPerDay: null, rateBasis: null, lastReadAt: null, lastTotalHours: null, dueHours: 900 },
      "UTC",
    );
    expect(text).toBe("due at 900 h; projected from running hours, but the counter has no reading or rate yet");
  });
});
