import { TZDate } from "@date-fns/tz";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { TOLERANCE_PRESETS } from "./presets";
import { calendarWindow, hoursWindow, type ToleranceRule } from "./tolerance";
import { escalationNeeded, toleranceRank, workOrderState, type ToleranceState } from "./work-order-state";

const at = (y: number, m: number, d: number, h = 0, mi = 0, s = 0, ms = 0) =>
  new Date(new TZDate(y, m - 1, d, h, mi, s, ms, "UTC").getTime());
const rule = (id: string): ToleranceRule => {
  const found = TOLERANCE_PRESETS.find((p) => p.id === id);
  if (!found) throw new Error(`no preset ${id}`);
  return found;
};
// IACS booklet (SOURCES.md, seen): anniversary 15 April → window 16 January to 15 July, overdue after.
const survey = calendarWindow(at(2026, 4, 15, 12), rule("preset-annual"), "UTC");
/** The same window under a company rule that keeps `late` for its grace. */
const plainSurvey = calendarWindow(at(2026, 4, 15, 12), { ...rule("preset-annual"), graceOnTime: false }, "UTC");
// Worked by hand (tolerance.test.ts): due 14,000 h, window from 13,800 h, grace to 14,100 h.
const engine = hoursWindow(14_000, 2_000, rule("preset-running-hours"));

describe("workOrderState on a calendar window", () => {
  it.each([
    [at(2026, 1, 15, 23, 59, 59, 999), "scheduled"],
    [at(2026, 1, 16), "window-open"],
    [at(2026, 4, 15, 23, 59, 59, 999), "window-open"],
    // HSSC, IMO Res. A.1104(29) 4.2.1: within 3 months before or after the anniversary is on time,
    // so the class preset has no `late`: window open to the end of 15 July, out of tolerance after.
    [at(2026, 4, 16), "window-open"],
    [at(2026, 6, 1), "window-open"],
    [at(2026, 7, 15, 23, 59, 59, 999), "window-open"],
    [at(2026, 7, 16), "out-of-tolerance"],
  ] as const)("IACS 15 April: at %s it is %s", (now, state) => {
    expect(workOrderState({ now, currentHours: null, calendar: survey })).toBe(state);
  });

  it.each([
    [at(2026, 4, 15, 23, 59, 59, 999), "window-open"],
    [at(2026, 4, 16), "late"],
    [at(2026, 7, 15, 23, 59, 59, 999), "late"],
    [at(2026, 7, 16), "out-of-tolerance"],
  ] as const)("the same window under a rule whose grace is not on time: at %s it is %s", (now, state) => {
    expect(workOrderState({ now, currentHours: null, calendar: plainSurvey })).toBe(state);
  });
});

describe("workOrderState on an hours window", () => {
  it.each([
    [13_799.9, "scheduled"],
    [13_800, "window-open"],
    [14_000, "window-open"],
    [14_000.1, "late"],
    [14_100, "late"],
    [14_100.1, "out-of-tolerance"],
  ] as const)("due 14,000 h (window 13,800 h, grace 14,100 h): at %d h it is %s", (currentHours, state) => {
    expect(workOrderState({ now: at(2026, 1, 1), currentHours, hours: engine })).toBe(state);
  });

  it("no reading yet: the hours limit is not judged", () => {
    expect(workOrderState({ now: at(2026, 1, 1), currentHours: null, hours: engine })).toBe("scheduled");
  });
});

describe("whichever first: the limit further along decides", () => {
  it("hours in the window, calendar not yet → window-open", () => {
    expect(workOrderState({ now: at(2026, 1, 1), currentHours: 13_900, hours: engine, calendar: survey })).toBe(
      "window-open",
    );
  });
  it("calendar late, hours not yet in the window → late", () => {
    expect(workOrderState({ now: at(2026, 5, 1), currentHours: 13_000, hours: engine, calendar: plainSurvey })).toBe(
      "late",
    );
  });
  it("hours past the grace while the calendar window is open → out-of-tolerance", () => {
    expect(workOrderState({ now: at(2026, 2, 1), currentHours: 14_200, hours: engine, calendar: survey })).toBe(
      "out-of-tolerance",
    );
  });
});

describe("deferral", () => {
  it("shows deferred until the deferred-to due point, then late in its grace, out-of-tolerance past it", () => {
    // The deferred-to due point is 15 April 2026 with 3 months either side, grace not on time.
    const state = (now: Date) => workOrderState({ now, currentHours: null, calendar: plainSurvey, deferred: true });
    expect(state(at(2026, 1, 10))).toBe("deferred"); // before the window
    expect(state(at(2026, 4, 1))).toBe("deferred"); // inside the window
    expect(state(at(2026, 5, 1))).toBe("late"); // past 15 April, inside the grace
    expect(state(at(2026, 8, 1))).toBe("out-of-tolerance");
  });

  it("under a class rule, the deferral's date is a hard limit: late after it, not on time", () => {
    // The window around the anniversary (HSSC, IMO Res. A.1104(29) 4.2.1) is what a deferral spends;
    // the date agreed in it is not another anniversary (Keelson's reading, common practice).
    const state = (now: Date) => workOrderState({ now, currentHours: null, calendar: survey, deferred: true });
    expect(state(at(2026, 4, 1))).toBe("deferred");
    expect(state(at(2026, 5, 1))).toBe("late");
    expect(state(at(2026, 7, 16))).toBe("out-of-tolerance");
  });
});

describe("escalationNeeded", () => {
  it.each([
    ["late", "out-of-tolerance", true],
    ["deferred", "out-of-tolerance", true],
    [null, "out-of-tolerance", true],
    ["out-of-tolerance", "out-of-tolerance", false],
    ["window-open", "late", false],
    ["out-of-tolerance", "done", false],
  ] as const)("%s → %s: %s", (previous, next, expected) => {
    expect(escalationNeeded(previous, next)).toBe(expected);
  });
});

describe("property: without a completion, the state never moves backwards", () => {
  const span = fc.oneof(
    fc.record({ value: fc.integer({ min: 0, max: 60 }), unit: fc.constant("days" as const) }),
    fc.record({ value: fc.integer({ min: 0, max: 6 }), unit: fc.constant("months" as const) }),
  );
  const hoursSpan = fc.oneof(
    fc.record({ value: fc.integer({ min: 0, max: 2_000 }), unit: fc.constant("hours" as const) }),
    fc.record({ value: fc.integer({ min: 0, max: 100 }), unit: fc.constant("percent" as const) }),
  );
  const instant = fc.date({
    min: new Date("2020-01-01T00:00:00Z"),
    max: new Date("2030-01-01T00:00:00Z"),
    noInvalidDate: true,
  });
  const base: ToleranceRule = { ...rule("preset-annual"), graceOnTime: false };

  it("scheduled < window-open < late < out-of-tolerance as time passes and hours run", () => {
    fc.assert(
      fc.property(
        instant,
        span,
        span,
        fc.integer({ min: 100, max: 20_000 }),
        fc.integer({ min: 0, max: 60_000 }),
        hoursSpan,
        hoursSpan,
        fc.option(fc.integer({ min: 1, max: 2_000 }), { nil: undefined }),
        instant,
        fc.integer({ min: 0, max: 500 }),
        fc.integer({ min: 0, max: 60_000 }),
        fc.integer({ min: 0, max: 5_000 }),
        fc.boolean(),
        (
          due,
          before,
          after,
          interval,
          dueHours,
          hBefore,
          hAfter,
          capHours,
          now,
          laterDays,
          hoursNow,
          moreHours,
          deferred,
        ) => {
          const calendar = calendarWindow(
            due,
            { ...base, windowBefore: before, graceAfter: after },
            "Europe/Amsterdam",
          );
          const hoursRule: ToleranceRule = {
            ...rule("preset-running-hours"),
            windowBefore: hBefore,
            graceAfter: hAfter,
            capHours,
          };
          const hours = hoursWindow(dueHours, interval, hoursRule);
          const first = workOrderState({ now, currentHours: hoursNow, calendar, hours, deferred });
          const later = workOrderState({
            now: new Date(now.getTime() + laterDays * 86_400_000),
            currentHours: hoursNow + moreHours,
            calendar,
            hours,
            deferred,
          });
          // deferred stands where scheduled and window-open stand: deferred → late → out-of-tolerance.
          const rank = (s: string) => (s === "deferred" ? toleranceRank("window-open") : toleranceRank(s as ToleranceState));
          expect(rank(later)).toBeGreaterThanOrEqual(rank(first));
          if (deferred) expect(["scheduled", "window-open"]).not.toContain(later);
        },
      ),
      { numRuns: 500 },
    );
  });
});
