import { describe, expect, it } from "vitest";
import { daysOf, doneLate, readingCoverage } from "./survey-rules";

describe("readings coverage over a period", () => {
  const period = daysOf("2026-02-25", "2026-03-06"); // 10 days across the end of February

  it("counts the days without a reading and the longest gap, worked by hand", () => {
    expect(period).toHaveLength(10);
    expect(period.slice(3, 5)).toEqual(["2026-02-28", "2026-03-01"]);
    // Read on 25, 26 Feb, 2, 3 and 6 Mar: missing 27, 28 Feb, 1 Mar (3 in a row), 4, 5 Mar.
    const read = new Set(["2026-02-25", "2026-02-26", "2026-03-02", "2026-03-03", "2026-03-06"]);
    expect(readingCoverage(period, read, "2020-01-01")).toEqual({
      days: 10,
      missing: 5,
      longestGap: { days: 3, from: "2026-02-27", to: "2026-03-01" },
    });
  });

  it("does not expect readings before the counter's first day, nor of a counter never read", () => {
    const read = new Set(["2026-03-04", "2026-03-06"]);
    expect(readingCoverage(period, read, "2026-03-04")).toEqual({
      days: 3,
      missing: 1,
      longestGap: { days: 1, from: "2026-03-05", to: "2026-03-05" },
    });
    expect(readingCoverage(period, new Set(), null)).toEqual({ days: 0, missing: 0, longestGap: null });
  });
});

describe("work done late or out of tolerance", () => {
  const at = (day: string) => new Date(`${day}T12:00:00Z`);
  const base = {
    doneAt: at("2026-05-10"),
    counterHours: null,
    stateWhenDone: null,
    dueAt: at("2026-05-01"),
    graceEndsAt: at("2026-05-31"),
    dueHours: null,
    graceEndsHours: null,
  };

  it("takes the state Keelson showed when the job was done", () => {
    expect(doneLate({ ...base, stateWhenDone: "window-open" })).toBeNull();
    expect(doneLate({ ...base, stateWhenDone: "late" })).toBe("late");
    expect(doneLate({ ...base, stateWhenDone: "out-of-tolerance" })).toBe("out-of-tolerance");
    // A class item inside its window after the anniversary showed window-open: on time (HSSC, IMO Res. A.1104(29) §4.2.1).
    expect(doneLate({ ...base, doneAt: at("2026-06-20"), stateWhenDone: "window-open" })).toBeNull();
  });

  it("judges history without recorded states against its limits, the one further along deciding", () => {
    expect(doneLate({ ...base, doneAt: at("2026-04-30") })).toBeNull();
    expect(doneLate(base)).toBe("late");
    expect(doneLate({ ...base, doneAt: at("2026-06-01") })).toBe("out-of-tolerance");
    // Inside the calendar limits but past the hours grace (14,100 h): out of tolerance.
    const hours = { ...base, doneAt: at("2026-04-20"), counterHours: 14_150, dueHours: 14_000, graceEndsHours: 14_100 };
    expect(doneLate(hours)).toBe("out-of-tolerance");
    // Exactly at the grace's end is still late (limits are inclusive).
    expect(doneLate({ ...hours, counterHours: 14_100 })).toBe("late");
  });
});
