import { describe, expect, it } from "vitest";
import { type CounterContext, hoursPerDay, isInFuture, readingProblem, removalProblem } from "./rules";

const base: CounterContext = {
  name: "ME",
  segmentStartedAt: null,
  previous: { readAt: new Date("2026-05-03T12:00:00Z"), meterValue: 12431 },
  next: null,
  existingAtSameInstant: null,
};
const dayLater = new Date("2026-05-04T12:00:00Z");

// The 24-hours-in-24-hours limit is the physical limit of an hour meter
// (SOURCES.md, "Running-hour facts"). Hand-computed cases follow.
describe("readingProblem", () => {
  it("accepts a reading that ran every hour of the day: 12,431 → 12,455 in 24 h", () => {
    expect(readingProblem(base, 12455, dayLater, "UTC")).toBeNull();
  });

  it("accepts a stopped engine: same value a day later", () => {
    expect(readingProblem(base, 12431, dayLater, "UTC")).toBeNull();
  });

  it("refuses a reading lower than the previous one and names it", () => {
    expect(readingProblem(base, 12430.9, dayLater, "UTC")).toBe(
      "Reading is lower than the previous one (12,431 h on 3 May 2026 12:00).",
    );
  });

  it("refuses 24.5 h run in 24 h", () => {
    expect(readingProblem(base, 12455.5, dayLater, "UTC")).toBe(
      "Reading advances 24.5 h but only 24 h passed since the previous reading (12,431 h on 3 May 2026 12:00).",
    );
  });

  it("allows rounding to tenths: 6.1 h run in 6 h 4 min", () => {
    const readAt = new Date("2026-05-03T18:04:00Z");
    expect(readingProblem(base, 12437.1, readAt, "UTC")).toBeNull();
  });

  it("shows times in the vessel's time zone", () => {
    expect(readingProblem(base, 12000, dayLater, "Asia/Singapore")).toMatch(/3 May 2026 20:00/);
  });

  it("checks a back-filled reading against the next one too", () => {
    const ctx: CounterContext = {
      ...base,
      next: { readAt: new Date("2026-05-05T12:00:00Z"), meterValue: 12470 },
    };
    expect(readingProblem(ctx, 12450, dayLater, "UTC")).toBeNull(); // 19 h then 20 h
    const noPrevious = { ...ctx, previous: null };
    expect(readingProblem(noPrevious, 12471, dayLater, "UTC")).toMatch(/higher than the next one \(12,470 h/);
    // 12,440 → 12,470 would be 30 h in 24 h.
    expect(readingProblem(ctx, 12440, dayLater, "UTC")).toMatch(/would then advance 30 h in only 24 h/);
  });

  it("refuses a second reading at the same instant", () => {
    const ctx = { ...base, existingAtSameInstant: { readAt: dayLater, meterValue: 12450 } };
    expect(readingProblem(ctx, 12450, dayLater, "UTC")).toMatch(/already a reading/);
  });

  it("refuses a reading from before the meter was replaced", () => {
    const ctx = { ...base, previous: null, segmentStartedAt: new Date("2026-05-10T00:00:00Z") };
    expect(readingProblem(ctx, 10, dayLater, "UTC")).toMatch(/meter was replaced on 10 May 2026/);
  });
});

describe("hoursPerDay", () => {
  it("is 18 h/day for 9 h in 12 h", () => {
    expect(hoursPerDay(100, new Date("2026-01-01T00:00:00Z"), 109, new Date("2026-01-01T12:00:00Z"))).toBe(18);
  });
  it("is null when no time passed", () => {
    const t = new Date();
    expect(hoursPerDay(1, t, 2, t)).toBeNull();
  });
});

describe("isInFuture", () => {
  const now = new Date("2026-05-04T12:00:00Z");
  it("tolerates five minutes of clock drift", () => {
    expect(isInFuture(new Date("2026-05-04T12:05:00Z"), now)).toBe(false);
    expect(isInFuture(new Date("2026-05-04T12:06:00Z"), now)).toBe(true);
  });
});

// Removing a reading: its neighbours must still pass the same 24-hours-in-24-hours check
// (SOURCES.md, "Running-hour facts") against each other. Hand-computed cases.
describe("removalProblem", () => {
  const previous = { readAt: new Date("2026-05-03T12:00:00Z"), meterValue: 14230 };
  const next = { readAt: new Date("2026-05-05T12:00:00Z"), meterValue: 14270 };

  it("allows removing the newest or the only reading: nothing comes after it", () => {
    expect(removalProblem({ previous, next: null }, "UTC")).toBeNull();
    expect(removalProblem({ previous: null, next: null }, "UTC")).toBeNull();
  });

  it("allows removing the first reading: nothing before it to check the next one against", () => {
    expect(removalProblem({ previous: null, next }, "UTC")).toBeNull();
  });

  it("allows it when the neighbours agree: 40 h in 48 h", () => {
    expect(removalProblem({ previous, next }, "UTC")).toBeNull();
  });

  it("refuses when the next one would run 50 h in 48 h, naming both readings", () => {
    expect(removalProblem({ previous, next: { ...next, meterValue: 14280 } }, "UTC")).toBe(
      "Without this reading the next one (14,280 h on 5 May 2026 12:00) would advance 50 h in only 48 h since the one before it (14,230 h on 3 May 2026 12:00). Correct the next reading first, or correct this one instead of removing it.",
    );
  });

  it("refuses when the next one would be lower than the one before", () => {
    expect(removalProblem({ previous, next: { ...next, meterValue: 14000 } }, "UTC")).toMatch(
      /next one \(14,000 h on 5 May 2026 12:00\) would be lower than the one before it \(14,230 h on 3 May 2026 12:00\)/,
    );
  });

  it("allows the engine running every hour: 48 h in 48 h", () => {
    expect(removalProblem({ previous, next: { ...next, meterValue: 14278 } }, "UTC")).toBeNull();
  });
});
