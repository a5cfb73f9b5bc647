import { TZDate } from "@date-fns/tz";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { parseCalendarRule } from "./calendar-rule";
import { computeDuePoint, nextAnchoredDue } from "./due-point";
import { TOLERANCE_PRESETS } from "./presets";
import { calendarWindow, type ToleranceRule } from "./tolerance";

const at = (timeZone: string, y: number, m: number, d: number, h = 12) =>
  new Date(new TZDate(y, m - 1, d, h, 0, 0, timeZone).getTime());
const utc = (y: number, m: number, d: number, h = 12) => at("UTC", y, m, d, h);
const iso = (d: Date | null) => d?.toISOString() ?? null;
const preset = (id: string): ToleranceRule => {
  const found = TOLERANCE_PRESETS.find((p) => p.id === id);
  if (!found) throw new Error(`no preset ${id}`);
  return found;
};

// Worked example, by hand: last done at 12,000 h, interval 2,000 h → due at 14,000 h. The last
// reading says 13,200 h on 1 Mar 2026 08:00Z and the counter runs 20 h a day: 800 h left is 40
// days → projected 10 Apr 2026 08:00Z.
const hoursCase = {
  intervalHours: 2_000,
  anchored: false,
  lastDone: { at: utc(2026, 1, 10), counterHours: 12_000 },
  counter: { totalHours: 13_200, readAt: new Date("2026-03-01T08:00:00Z"), hoursPerDay: 20 },
  now: new Date("2026-03-01T10:00:00Z"),
  timeZone: "UTC",
};

describe("computeDuePoint: a due point the counter has passed stays on the day it was passed", () => {
  // Hand-worked (issue 14's report): due at 14,000 h; readings 13,990 h on 24 Aug 09:00 and
  // 14,014 h on 25 Aug 09:00 put the passing at 19:00 on 24 Aug; one more reading (14,040 h on
  // 26 Aug) must not move it to 25 Aug, as the projection back at the running rate did.
  const passedAt = (hours: number) => (hours === 14_000 ? new Date("2026-08-24T19:00:00Z") : null);
  const after = (totalHours: number, readAt: string) => ({
    ...hoursCase,
    counter: { totalHours, readAt: new Date(readAt), hoursPerDay: 26, passedAt },
    now: new Date(readAt),
  });

  it("is dated by the readings, with each new reading", () => {
    for (const [total, readAt] of [
      [14_014, "2026-08-25T09:00:00Z"],
      [14_040, "2026-08-26T09:00:00Z"],
    ] as const) {
      const due = computeDuePoint(after(total, readAt));
      expect(due.dueDate).toEqual(new Date("2026-08-24T19:00:00Z"));
      expect(due.remainingHours).toBe(14_000 - total);
    }
  });

  it("without the readings' answer it is projected back at the rate, and moves (the old behaviour)", () => {
    const a = computeDuePoint({ ...after(14_014, "2026-08-25T09:00:00Z"), counter: { totalHours: 14_014, readAt: new Date("2026-08-25T09:00:00Z"), hoursPerDay: 24 } });
    const b = computeDuePoint({ ...after(14_040, "2026-08-26T09:00:00Z"), counter: { totalHours: 14_040, readAt: new Date("2026-08-26T09:00:00Z"), hoursPerDay: 30 } });
    expect(a.dueDate).not.toEqual(b.dueDate);
  });
});

describe("computeDuePoint: running hours", () => {
  it("due 14,000 h, 800 h left, projected 40 days on at 20 h/day", () => {
    expect(computeDuePoint(hoursCase)).toEqual({
      dueHours: 14_000,
      projectedDate: new Date("2026-04-10T08:00:00Z"),
      calendarDue: null,
      dueDate: new Date("2026-04-10T08:00:00Z"),
      governing: "hours",
      remainingHours: 800,
      remainingDays: 40,
    });
  });

  it("a stopped counter (0 h/day) gives no projected date, so no due date", () => {
    const due = computeDuePoint({ ...hoursCase, counter: { ...hoursCase.counter, hoursPerDay: 0 } });
    expect(due).toMatchObject({
      dueHours: 14_000,
      projectedDate: null,
      dueDate: null,
      remainingHours: 800,
      remainingDays: null,
    });
  });

  it("past due: at 14,300 h the 300 h over project 15 days back", () => {
    const due = computeDuePoint({ ...hoursCase, counter: { ...hoursCase.counter, totalHours: 14_300 } });
    expect(due).toMatchObject({
      remainingHours: -300,
      projectedDate: new Date("2026-02-14T08:00:00Z"),
      remainingDays: -15,
    });
  });

  it("a routine never done counts from its baseline: 5,000 h + 1,500 h = 6,500 h", () => {
    const due = computeDuePoint({
      ...hoursCase,
      intervalHours: 1_500,
      lastDone: null,
      baseline: { at: utc(2026, 1, 1), counterHours: 5_000 },
    });
    expect(due.dueHours).toBe(6_500);
  });

  it("needs a baseline or a completion, and a limit", () => {
    expect(() => computeDuePoint({ ...hoursCase, lastDone: null })).toThrow(/needs a baseline/);
    expect(() => computeDuePoint({ ...hoursCase, intervalHours: null })).toThrow(
      /running hours, a calendar rule, or both/,
    );
    expect(() => computeDuePoint({ ...hoursCase, intervalHours: 0 })).toThrow(/above 0/);
  });
});

describe("computeDuePoint: calendar and whichever first", () => {
  const quarterly = parseCalendarRule("FREQ=MONTHLY;INTERVAL=3");

  it("floating: done 17 Mar 2026 on a ship in Singapore, every 3 months → due at the end of 17 Jun (15:59:59.999Z)", () => {
    const due = computeDuePoint({
      calendarRule: quarterly,
      anchored: false,
      lastDone: { at: at("Asia/Singapore", 2026, 3, 17, 7), counterHours: 0 },
      now: at("Asia/Singapore", 2026, 6, 1),
      timeZone: "Asia/Singapore",
    });
    expect(due).toMatchObject({
      calendarDue: new Date("2026-06-17T15:59:59.999Z"),
      governing: "calendar",
      remainingDays: 16,
      dueHours: null,
    });
  });

  // Both limits on the worked hours example: 3 months after 10 Jan is 10 Apr, due at 23:59:59.999.
  it("hours first: projected 10 Apr 08:00 comes before the end of 10 Apr", () => {
    const due = computeDuePoint({ ...hoursCase, calendarRule: quarterly });
    expect(due).toMatchObject({
      governing: "hours",
      dueDate: new Date("2026-04-10T08:00:00Z"),
      calendarDue: new Date("2026-04-10T23:59:59.999Z"),
    });
  });

  it("calendar first: at 10 h/day the 800 h take 80 days (20 May), so 10 Apr governs", () => {
    const due = computeDuePoint({
      ...hoursCase,
      calendarRule: quarterly,
      counter: { ...hoursCase.counter, hoursPerDay: 10 },
    });
    expect(due).toMatchObject({
      governing: "calendar",
      dueDate: new Date("2026-04-10T23:59:59.999Z"),
      projectedDate: new Date("2026-05-20T08:00:00Z"),
      remainingDays: 40,
    });
  });

  it("anchored: the due point is the anniversary, whatever the last completion", () => {
    const due = computeDuePoint({
      calendarRule: parseCalendarRule("FREQ=YEARLY"),
      anchored: true,
      anchorDate: utc(2026, 4, 15),
      lastDone: { at: utc(2025, 3, 1), counterHours: 0 },
      now: utc(2026, 4, 1),
      timeZone: "UTC",
    });
    expect(due).toMatchObject({ calendarDue: new Date("2026-04-15T23:59:59.999Z"), remainingDays: 14 });
    expect(() =>
      computeDuePoint({
        calendarRule: parseCalendarRule("FREQ=YEARLY"),
        anchored: true,
        now: utc(2026, 4, 1),
        timeZone: "UTC",
      }),
    ).toThrow(/anniversary date/);
  });

  it("property: more running hours never make the due date later", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 50_000 }),
        fc.integer({ min: 1, max: 20_000 }),
        fc.integer({ min: 0, max: 70_000 }),
        fc.integer({ min: 0, max: 10_000 }),
        fc.double({ min: 0.1, max: 24, noNaN: true }),
        fc.boolean(),
        (doneHours, interval, total, more, rate, withCalendar) => {
          const input = {
            ...hoursCase,
            intervalHours: interval,
            lastDone: { at: utc(2026, 1, 10), counterHours: doneHours },
            calendarRule: withCalendar ? quarterly : null,
          };
          const fewer = computeDuePoint({
            ...input,
            counter: { ...hoursCase.counter, totalHours: total, hoursPerDay: rate },
          });
          const moreRun = computeDuePoint({
            ...input,
            counter: { ...hoursCase.counter, totalHours: total + more, hoursPerDay: rate },
          });
          expect(moreRun.projectedDate?.getTime() ?? 0).toBeLessThanOrEqual(fewer.projectedDate?.getTime() ?? 0);
          expect(moreRun.dueDate?.getTime() ?? 0).toBeLessThanOrEqual(fewer.dueDate?.getTime() ?? 0);
        },
      ),
      { numRuns: 300 },
    );
  });
});

describe("nextAnchoredDue: HSSC, IMO Resolution A.1104(29), renewal (SOURCES.md, seen)", () => {
  // Expiry E = 30 Jun 2026 (chosen for the example); renewal preset: 3 months before, none after.
  // 30 Jun − 3 months = 30 Mar, so the window opens 31 Mar 2026.
  const E = utc(2026, 6, 30);
  const renewal = preset("preset-renewal");
  const window = calendarWindow(E, renewal, "UTC");
  const fiveYears = parseCalendarRule("FREQ=YEARLY;INTERVAL=5");
  const next = (completedAt: Date, keepsAnniversary = true) =>
    nextAnchoredDue({
      previousDue: window.dueAt,
      completedAt,
      window,
      period: fiveYears,
      timeZone: "UTC",
      keepsAnniversary,
    });

  it("completed within the 3 months before E → E + 5 years", () => {
    expect(next(utc(2026, 5, 10))).toEqual({ nextDue: new Date("2031-06-30T23:59:59.999Z"), anniversaryKept: true });
  });
  it("completed after E → still E + 5 years", () => {
    expect(next(utc(2026, 7, 20))).toEqual({ nextDue: new Date("2031-06-30T23:59:59.999Z"), anniversaryKept: true });
  });
  it("completed before the window, on C = 10 Feb 2026 → C + 5 years", () => {
    expect(next(utc(2026, 2, 10))).toEqual({ nextDue: new Date("2031-02-10T23:59:59.999Z"), anniversaryKept: false });
  });
  it("the window's first day keeps E; the day before moves it", () => {
    expect(next(utc(2026, 3, 31, 0)).nextDue?.toISOString()).toBe("2031-06-30T23:59:59.999Z");
    expect(next(utc(2026, 3, 30, 23)).nextDue?.toISOString()).toBe("2031-03-30T23:59:59.999Z");
  });
  it("a rule that does not keep the anniversary counts from the completion", () => {
    expect(next(utc(2026, 5, 10), false)).toEqual({
      nextDue: new Date("2031-05-10T23:59:59.999Z"),
      anniversaryKept: false,
    });
  });

  // Annual items, after the IACS booklet's 15 April example: 3 months either side.
  const annualDue = calendarWindow(utc(2026, 4, 15), preset("preset-annual"), "UTC");
  const yearly = (rule: string, completedAt: Date) =>
    iso(
      nextAnchoredDue({ previousDue: annualDue.dueAt, completedAt, window: annualDue, period: rule, timeZone: "UTC" })
        .nextDue,
    );
  it("annual, done late in the grace on 1 Jun → 15 Apr next year; done a year late → the anniversary after", () => {
    expect(yearly("FREQ=YEARLY", utc(2026, 6, 1))).toBe("2027-04-15T23:59:59.999Z");
    expect(yearly("FREQ=YEARLY", utc(2027, 4, 20))).toBe("2028-04-15T23:59:59.999Z");
  });
  it("a fixed-date rule (every year on 15 April) done before the window still comes next on 15 Apr 2027", () => {
    expect(yearly("FREQ=YEARLY;BYMONTH=4;BYMONTHDAY=15", utc(2026, 1, 1))).toBe("2027-04-15T23:59:59.999Z");
  });
});
