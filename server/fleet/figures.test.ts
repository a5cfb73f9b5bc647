import { describe, expect, it } from "vitest";
import {
  boardTier,
  type BoardOrderFigures,
  compareForBoard,
  type CompletionLimits,
  daysSinceReading,
  isOnTime,
  onTimeRate,
  stoppedReporting,
  trendDays,
} from "./figures";

const at = (iso: string) => new Date(iso);
const none: CompletionLimits = {
  doneAt: at("2026-03-10T12:00:00Z"),
  counterHours: null,
  graceEndsAt: null,
  graceEndsHours: null,
  outOfToleranceAt: null,
  dueDate: null,
};

// Keelson's definition of "on time" (no published source), worked by hand.
describe("isOnTime", () => {
  it("calendar work: done on or before the end of the grace", () => {
    // Grace ends 15 Mar 23:59:59.999; done 10 Mar → on time; done 16 Mar 00:00 → not.
    const graceEndsAt = at("2026-03-15T23:59:59.999Z");
    expect(isOnTime({ ...none, graceEndsAt })).toBe(true);
    expect(isOnTime({ ...none, graceEndsAt, doneAt: at("2026-03-15T23:59:59.999Z") })).toBe(true);
    expect(isOnTime({ ...none, graceEndsAt, doneAt: at("2026-03-16T00:00:00Z") })).toBe(false);
  });

  it("hours work: the counter value recorded is judged against the hours grace end", () => {
    // Due at 24,000 h, grace 5 % of 2,000 h = 100 h → grace ends at 24,100 h.
    const hours = { ...none, graceEndsHours: 24_100 };
    expect(isOnTime({ ...hours, counterHours: 24_100 })).toBe(true);
    expect(isOnTime({ ...hours, counterHours: 24_100.1 })).toBe(false);
    // The projected date does not count once the counter value is known: done "late" by the
    // projection, but at 24,050 h by the meter → on time.
    expect(isOnTime({ ...hours, counterHours: 24_050, outOfToleranceAt: at("2026-03-01T00:00:00Z") })).toBe(true);
  });

  it("hours work without a counter value: judged by the projected date of the hours grace", () => {
    const hours = { ...none, graceEndsHours: 24_100 };
    expect(isOnTime({ ...hours, outOfToleranceAt: at("2026-03-11T00:00:00Z") })).toBe(true);
    expect(isOnTime({ ...hours, outOfToleranceAt: at("2026-03-09T00:00:00Z") })).toBe(false);
  });

  it("whichever first: both limits must hold", () => {
    // Calendar grace ends 15 Mar, hours grace at 24,100 h. Done 10 Mar at 24,150 h: the hours
    // limit was passed → not on time. Done 16 Mar at 24,000 h: the calendar limit → not on time.
    const both = { ...none, graceEndsAt: at("2026-03-15T23:59:59.999Z"), graceEndsHours: 24_100 };
    expect(isOnTime({ ...both, counterHours: 24_150 })).toBe(false);
    expect(isOnTime({ ...both, counterHours: 24_000, doneAt: at("2026-03-16T06:00:00Z") })).toBe(false);
    expect(isOnTime({ ...both, counterHours: 24_000 })).toBe(true);
  });

  it("a record without a grace end is judged against its due date; with no limit at all it is on time", () => {
    expect(isOnTime({ ...none, dueDate: at("2026-03-10T23:59:59Z") })).toBe(true);
    expect(isOnTime({ ...none, dueDate: at("2026-03-09T23:59:59Z") })).toBe(false);
    expect(isOnTime(none)).toBe(true);
  });
});

describe("onTimeRate", () => {
  it("is null with no completion", () => {
    expect(onTimeRate([])).toEqual({ completed: 0, onTime: 0, overdue: 0, rate: null });
  });

  it("counts the on-time share, to four decimals", () => {
    // 3 completions: grace 15 Mar; done 10 Mar (on time), 12 Mar (on time), 20 Mar (late) → 2/3 = 0.6667.
    const graceEndsAt = at("2026-03-15T23:59:59Z");
    const rows = [
      { ...none, graceEndsAt },
      { ...none, graceEndsAt, doneAt: at("2026-03-12T08:00:00Z") },
      { ...none, graceEndsAt, doneAt: at("2026-03-20T08:00:00Z") },
    ];
    expect(onTimeRate(rows)).toEqual({ completed: 3, onTime: 2, overdue: 0, rate: 0.6667 });
  });

  it("counts open work out of tolerance against the rate (issue 14: 100 % beside work 166 days overdue)", () => {
    // Hand-worked: 4 jobs done in the 90 days, all on time, and 1 class item out of tolerance for 166
    // days, still open → 4 on time of 5 judged = 80 %, not 100 %.
    const graceEndsAt = at("2026-03-15T23:59:59Z");
    const done = [1, 2, 3, 4].map(() => ({ ...none, graceEndsAt }));
    expect(onTimeRate(done, 1)).toEqual({ completed: 4, onTime: 4, overdue: 1, rate: 0.8 });
    // Nothing done, one open overdue: 0 %, not "no figure".
    expect(onTimeRate([], 1)).toEqual({ completed: 0, onTime: 0, overdue: 1, rate: 0 });
  });
});

describe("stoppedReporting and daysSinceReading", () => {
  const now = at("2026-03-10T12:00:00Z");
  it("flags a vessel whose last reading is older than the company's hours (default 36)", () => {
    // 36 h before 10 Mar 12:00 is 9 Mar 00:00: exactly 36 h is still reporting, a minute more is not.
    expect(stoppedReporting(at("2026-03-09T00:00:00Z"), now, 36)).toBe(false);
    expect(stoppedReporting(at("2026-03-08T23:59:00Z"), now, 36)).toBe(true);
    // The company's own setting: 12 h.
    expect(stoppedReporting(at("2026-03-09T23:00:00Z"), now, 12)).toBe(true);
    expect(stoppedReporting(null, now, 36)).toBe(true);
  });

  it("counts whole days since the last reading", () => {
    expect(daysSinceReading(at("2026-03-10T09:00:00Z"), now)).toBe(0);
    // 9 Mar 09:00 → 10 Mar 12:00 is 27 h → 1 day.
    expect(daysSinceReading(at("2026-03-09T09:00:00Z"), now)).toBe(1);
    // 5 Mar 13:00 → 10 Mar 12:00 is 4 days 23 h → 4 days.
    expect(daysSinceReading(at("2026-03-05T13:00:00Z"), now)).toBe(4);
    expect(daysSinceReading(null, now)).toBeNull();
  });
});

describe("the board's order", () => {
  const clean: BoardOrderFigures = {
    name: "",
    late: 0,
    outOfTolerance: 0,
    criticalLate: 0,
    criticalOutOfTolerance: 0,
    classLate: 0,
    classOutOfTolerance: 0,
  };
  const vessels: BoardOrderFigures[] = [
    { ...clean, name: "Zephyr" },
    { ...clean, name: "Yarrow", late: 4 },
    { ...clean, name: "Wren", outOfTolerance: 9, late: 9 },
    { ...clean, name: "Vale", late: 1, classLate: 1 },
    { ...clean, name: "Umber", outOfTolerance: 1, classOutOfTolerance: 1 },
    { ...clean, name: "Tansy", late: 2, criticalLate: 2 },
    { ...clean, name: "Sorrel", outOfTolerance: 1, criticalOutOfTolerance: 1 },
    { ...clean, name: "Alder" },
  ];

  it("puts critical/class out of tolerance first, then critical/class late, then other out of tolerance, late, then the rest by name", () => {
    expect(vessels.map(boardTier)).toEqual([4, 3, 2, 1, 0, 1, 0, 4]);
    expect([...vessels].sort(compareForBoard).map((v) => v.name)).toEqual([
      "Sorrel",
      "Umber",
      "Tansy",
      "Vale",
      "Wren",
      "Yarrow",
      "Alder",
      "Zephyr",
    ]);
  });
});

describe("trendDays", () => {
  it("gives the 90 UTC days ending today, oldest first", () => {
    const days = trendDays(at("2026-03-10T23:30:00Z"));
    expect(days).toHaveLength(90);
    expect(days.at(-1)).toBe("2026-03-10");
    // 10 Mar − 89 days: 10 days of March back to 1 Mar, 28 of February, 31 of January, 20 more of December → 11 Dec 2025.
    expect(days[0]).toBe("2025-12-11");
  });
});
