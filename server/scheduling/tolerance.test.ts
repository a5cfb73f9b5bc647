import { TZDate } from "@date-fns/tz";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { parseCalendarRule } from "./calendar-rule";
import { TOLERANCE_PRESETS } from "./presets";
import {
  calendarIntervalDays,
  calendarWindow,
  FALLBACK_TOLERANCE,
  hoursWindow,
  matchToleranceRule,
  toleranceRuleProblems,
  type ToleranceRule,
} from "./tolerance";

const at = (timeZone: string, y: number, m: number, d: number, h = 12) =>
  new Date(new TZDate(y, m - 1, d, h, 0, 0, timeZone).getTime());
const isoWindow = (w: { opensAt: Date; dueAt: Date; graceEndsAt: Date }) => ({
  opensAt: w.opensAt.toISOString(),
  dueAt: w.dueAt.toISOString(),
  graceEndsAt: w.graceEndsAt.toISOString(),
});
const preset = (id: string): ToleranceRule => {
  const found = TOLERANCE_PRESETS.find((p) => p.id === id);
  if (!found) throw new Error(`no preset ${id}`);
  return found;
};
const annual = preset("preset-annual");
const hours = preset("preset-running-hours");
const months = (value: number) => ({ value, unit: "months" as const });
const daysSpan = (value: number) => ({ value, unit: "days" as const });
const calendarRuleOf = (
  windowBefore: ToleranceRule["windowBefore"],
  graceAfter: ToleranceRule["graceAfter"],
): ToleranceRule => ({
  id: "t",
  name: "test",
  kind: "calendar",
  minInterval: 0,
  maxInterval: 10_000,
  windowBefore,
  graceAfter,
  keepsAnniversary: true,
});

describe("calendarWindow: the class-survey convention", () => {
  it("IACS booklet: anniversary 15 April, 3 months either side → 16 January to 15 July inclusive", () => {
    // IACS, "Classification Societies – What, Why and How?" (SOURCES.md, seen).
    expect(isoWindow(calendarWindow(at("UTC", 2026, 4, 15), annual, "UTC"))).toEqual({
      opensAt: "2026-01-16T00:00:00.000Z",
      dueAt: "2026-04-15T23:59:59.999Z",
      graceEndsAt: "2026-07-15T23:59:59.999Z",
    });
  });

  it("the same window on a ship in Singapore (UTC+8) opens at 16 Jan 00:00 on board = 15 Jan 16:00Z", () => {
    expect(isoWindow(calendarWindow(at("Asia/Singapore", 2026, 4, 15), annual, "Asia/Singapore"))).toEqual({
      opensAt: "2026-01-15T16:00:00.000Z",
      dueAt: "2026-04-15T15:59:59.999Z",
      graceEndsAt: "2026-07-15T15:59:59.999Z",
    });
  });

  it("across DST in Amsterdam: opens 16 Jan 00:00 CET (23:00Z), due 15 Apr 24:00 CEST (22:00Z)", () => {
    const w = calendarWindow(at("Europe/Amsterdam", 2026, 4, 15), annual, "Europe/Amsterdam");
    expect(w.opensAt.toISOString()).toBe("2026-01-15T23:00:00.000Z");
    expect(w.dueAt.toISOString()).toBe("2026-04-15T21:59:59.999Z");
  });

  // Month ends (Keelson's convention, tolerance.ts): date-fns clamps to the month's last day.
  it("31 May − 3 months is 28 Feb 2025 (29 Feb 2024), so the window opens on 1 March", () => {
    expect(calendarWindow(at("UTC", 2025, 5, 31), annual, "UTC").opensAt.toISOString()).toBe(
      "2025-03-01T00:00:00.000Z",
    );
    expect(calendarWindow(at("UTC", 2024, 5, 31), annual, "UTC").opensAt.toISOString()).toBe(
      "2024-03-01T00:00:00.000Z",
    );
  });

  it("30 Nov + 3 months is 28 Feb 2026 (29 Feb 2028): the grace ends at the end of that day", () => {
    expect(calendarWindow(at("UTC", 2025, 11, 30), annual, "UTC").graceEndsAt.toISOString()).toBe(
      "2026-02-28T23:59:59.999Z",
    );
    expect(calendarWindow(at("UTC", 2027, 11, 30), annual, "UTC").graceEndsAt.toISOString()).toBe(
      "2028-02-29T23:59:59.999Z",
    );
  });

  it("31 Aug − 3 months is 31 May: the window opens 1 June", () => {
    expect(calendarWindow(at("UTC", 2026, 8, 31), annual, "UTC").opensAt.toISOString()).toBe(
      "2026-06-01T00:00:00.000Z",
    );
  });

  it("days: weekly preset due Monday 6 Apr 2026 → open from Sunday 5 Apr, grace to the end of Tuesday 7 Apr", () => {
    expect(isoWindow(calendarWindow(at("UTC", 2026, 4, 6), preset("preset-weekly"), "UTC"))).toEqual({
      opensAt: "2026-04-05T00:00:00.000Z",
      dueAt: "2026-04-06T23:59:59.999Z",
      graceEndsAt: "2026-04-07T23:59:59.999Z",
    });
  });

  it("a window of 0 opens at the due point; a grace of 0 ends there", () => {
    const w = calendarWindow(at("UTC", 2026, 4, 6), calendarRuleOf(daysSpan(0), months(0)), "UTC");
    expect(w.opensAt).toEqual(w.dueAt);
    expect(w.graceEndsAt).toEqual(w.dueAt);
  });

  it("percent of a calendar interval rounds to whole days: 10 % of 30 days = 3 days before, 5 % = 1.5 → 2 days after", () => {
    const rule = calendarRuleOf({ value: 10, unit: "percent" }, { value: 5, unit: "percent" });
    expect(isoWindow(calendarWindow(at("UTC", 2026, 4, 10), rule, "UTC", 30))).toEqual({
      opensAt: "2026-04-08T00:00:00.000Z",
      dueAt: "2026-04-10T23:59:59.999Z",
      graceEndsAt: "2026-04-12T23:59:59.999Z",
    });
    expect(() => calendarWindow(at("UTC", 2026, 4, 10), rule, "UTC")).toThrow(/interval in days is needed/);
  });

  it("an hours span on a calendar rule is refused", () => {
    expect(() =>
      calendarWindow(at("UTC", 2026, 4, 10), calendarRuleOf({ value: 5, unit: "hours" }, daysSpan(1)), "UTC"),
    ).toThrow(/cannot use hours/);
  });

  it("property: opensAt ≤ dueAt ≤ graceEndsAt for any due day, zone and span", () => {
    const span = fc.oneof(
      fc.record({ value: fc.integer({ min: 0, max: 400 }), unit: fc.constant("days" as const) }),
      fc.record({ value: fc.integer({ min: 0, max: 36 }), unit: fc.constant("months" as const) }),
      fc.record({ value: fc.integer({ min: 0, max: 100 }), unit: fc.constant("percent" as const) }),
    );
    const zone = fc.constantFrom(
      "UTC",
      "Europe/Amsterdam",
      "America/New_York",
      "America/Santiago",
      "Pacific/Auckland",
      "Asia/Kolkata",
      "Australia/Lord_Howe",
    );
    const due = fc.date({
      min: new Date("1990-01-01T00:00:00Z"),
      max: new Date("2080-01-01T00:00:00Z"),
      noInvalidDate: true,
    });
    fc.assert(
      fc.property(
        due,
        span,
        span,
        zone,
        fc.integer({ min: 1, max: 3660 }),
        (d, before, after, timeZone, intervalDays) => {
          const w = calendarWindow(d, calendarRuleOf(before, after), timeZone, intervalDays);
          expect(w.opensAt.getTime()).toBeLessThanOrEqual(w.dueAt.getTime());
          expect(w.dueAt.getTime()).toBeLessThanOrEqual(w.graceEndsAt.getTime());
          expect(d.getTime()).toBeLessThanOrEqual(w.dueAt.getTime());
        },
      ),
      { numRuns: 300 },
    );
  });
});

describe("hoursWindow", () => {
  // Worked by hand from PRODUCT.md's example rule (10 % window, 5 % grace, cap 500 h):
  // last done at 12,000 h + 2,000 h interval = due 14,000 h; 10 % of 2,000 = 200 h → opens at
  // 13,800 h; 5 % = 100 h → grace ends at 14,100 h.
  it("due 14,000 h on a 2,000 h interval: window opens at 13,800 h, grace ends at 14,100 h", () => {
    expect(hoursWindow(14_000, 2_000, hours)).toEqual({
      opensAtHours: 13_800,
      dueHours: 14_000,
      graceEndsHours: 14_100,
    });
  });

  it("the cap: on a 16,000 h interval 10 % = 1,600 h and 5 % = 800 h, both capped at 500 h", () => {
    // Worked by hand: last done 40,000 h + 16,000 h = due 56,000 h → 55,500 h to 56,500 h.
    expect(hoursWindow(56_000, 16_000, hours)).toEqual({
      opensAtHours: 55_500,
      dueHours: 56_000,
      graceEndsHours: 56_500,
    });
  });

  it("a fixed number of hours is not capped; days on an hours rule are refused", () => {
    const rule: ToleranceRule = { ...hours, windowBefore: { value: 800, unit: "hours" }, capHours: 500 };
    expect(hoursWindow(10_000, 8_000, rule).opensAtHours).toBe(9_200);
    expect(() => hoursWindow(10_000, 8_000, { ...hours, graceAfter: daysSpan(3) })).toThrow(/cannot use days/);
  });
});

describe("calendarIntervalDays: FREQ × INTERVAL, month 30.44 d, year 365.25 d, rounded", () => {
  it.each([
    ["FREQ=DAILY", 1],
    ["FREQ=WEEKLY;BYDAY=MO,TH", 7],
    ["FREQ=MONTHLY", 30],
    ["FREQ=MONTHLY;INTERVAL=3", 91],
    ["FREQ=MONTHLY;INTERVAL=12", 365],
    ["FREQ=YEARLY", 365],
    ["FREQ=YEARLY;INTERVAL=5", 1826],
    ["FREQ=MONTHLY;INTERVAL=60", 1826],
  ])("%s → %i days", (rule, days) => {
    expect(calendarIntervalDays(parseCalendarRule(rule))).toBe(days);
  });
});

describe("matchToleranceRule", () => {
  const rules: ToleranceRule[] = [...TOLERANCE_PRESETS];
  it("a 12-month rule matches the annual preset; 5 years the renewal preset; 2,000 h the hours preset", () => {
    expect(
      matchToleranceRule(rules, { calendarRule: parseCalendarRule("FREQ=MONTHLY;INTERVAL=12") }, "calendar")?.rule.id,
    ).toBe("preset-annual");
    expect(
      matchToleranceRule(rules, { calendarRule: parseCalendarRule("FREQ=YEARLY;INTERVAL=5") }, "calendar")?.rule.id,
    ).toBe("preset-renewal");
    expect(matchToleranceRule(rules, { intervalHours: 2_000 }, "hours")).toEqual({ rule: hours, basis: "matched" });
  });

  it("the narrowest range wins over a wider one that also covers the size", () => {
    const liferafts: ToleranceRule = {
      ...annual,
      id: "z-liferafts",
      minInterval: 360,
      maxInterval: 370,
      graceAfter: months(5),
    };
    const match = matchToleranceRule(
      [...rules, liferafts],
      { calendarRule: parseCalendarRule("FREQ=YEARLY") },
      "calendar",
    );
    expect(match).toEqual({ rule: liferafts, basis: "matched" });
  });

  it("between equally narrow rules the lower id wins, whatever the order", () => {
    const a: ToleranceRule = { ...annual, id: "a" };
    const b: ToleranceRule = { ...annual, id: "b" };
    const routine = { calendarRule: parseCalendarRule("FREQ=YEARLY") };
    expect(matchToleranceRule([b, a], routine, "calendar")?.rule.id).toBe("a");
    expect(matchToleranceRule([a, b], routine, "calendar")?.rule.id).toBe("a");
  });

  it("a routine's override of the same kind beats matching; an override of the other kind does not", () => {
    const routine = {
      intervalHours: 2_000,
      calendarRule: parseCalendarRule("FREQ=YEARLY"),
      overrideRuleIds: ["preset-renewal"],
    };
    expect(matchToleranceRule(rules, routine, "calendar")).toEqual({
      rule: preset("preset-renewal"),
      basis: "override",
    });
    expect(matchToleranceRule(rules, routine, "hours")?.basis).toBe("matched");
  });

  it("nothing matching gives the strict fallback; no limit of the kind gives null", () => {
    expect(matchToleranceRule([], { intervalHours: 500 }, "hours")).toEqual({
      rule: FALLBACK_TOLERANCE.hours,
      basis: "fallback",
    });
    expect(matchToleranceRule(rules, { intervalHours: 500 }, "calendar")).toBeNull();
    expect(hoursWindow(14_000, 2_000, FALLBACK_TOLERANCE.hours)).toEqual({
      opensAtHours: 14_000,
      dueHours: 14_000,
      graceEndsHours: 14_000,
    });
  });
});

describe("toleranceRuleProblems", () => {
  it("finds nothing wrong with the presets and the fallbacks", () => {
    for (const rule of [...TOLERANCE_PRESETS, FALLBACK_TOLERANCE.hours, FALLBACK_TOLERANCE.calendar])
      expect(toleranceRuleProblems(rule)).toEqual([]);
  });

  it("names each field that is wrong", () => {
    const bad: ToleranceRule = {
      ...hours,
      name: " ",
      minInterval: 100,
      maxInterval: 50,
      windowBefore: months(3),
      graceAfter: { value: 120, unit: "percent" },
    };
    expect(toleranceRuleProblems(bad).map((p) => p.field)).toEqual([
      "name",
      "maxInterval",
      "windowBefore.unit",
      "graceAfter.value",
    ]);
    expect(
      toleranceRuleProblems({ ...annual, capHours: 500, windowBefore: { value: 1.5, unit: "months" } }).map(
        (p) => p.field,
      ),
    ).toEqual(["windowBefore.value", "capHours"]);
  });
});
