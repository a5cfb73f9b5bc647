import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { AppError } from "@/server/http/problem";
import { calendarRuleProblem, nextOccurrenceAfter, parseCalendarRule } from "./calendar-rule";
import { shipDateKey, shipDateOf } from "./ship-date";

// RFC 5545 section 3.8.5.3 vectors (SOURCES.md), which every accepted-rule check includes.
const RFC_VECTOR_RULES = [
  "FREQ=WEEKLY;INTERVAL=2;UNTIL=19971224T000000Z;WKST=SU;BYDAY=MO,WE,FR",
  "FREQ=MONTHLY;COUNT=10;BYDAY=1FR",
  "FREQ=MONTHLY;COUNT=10;BYMONTHDAY=1,-1",
  "FREQ=MONTHLY;BYMONTHDAY=15,30;COUNT=5",
];

describe("parseCalendarRule", () => {
  it("accepts the RRULE: prefix and lower case, and stores the rule alone in upper case", () => {
    const rule = parseCalendarRule(" rrule:freq=monthly;interval=3 ");
    expect(rule).toMatchObject({
      text: "FREQ=MONTHLY;INTERVAL=3",
      frequency: "MONTHLY",
      interval: 3,
      count: null,
      until: null,
    });
  });

  it("reads UNTIL as a day or as a UTC instant", () => {
    expect(parseCalendarRule("FREQ=DAILY;UNTIL=20261231").until).toEqual({
      kind: "day",
      day: new Date("2026-12-31T00:00:00Z"),
    });
    expect(parseCalendarRule("FREQ=DAILY;UNTIL=19971224T000000Z").until).toEqual({
      kind: "instant",
      at: new Date("1997-12-24T00:00:00Z"),
    });
  });

  it("throws a 422 AppError on the calendarRule field", () => {
    try {
      parseCalendarRule("INTERVAL=2");
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(AppError);
      expect((error as AppError).status).toBe(422);
      expect((error as AppError).errors[0]).toMatchObject({
        field: "calendarRule",
        message: expect.stringContaining("FREQ is required"),
      });
    }
  });

  // RFC 5545 section 3.3.10 (seen), then Keelson's own limits (calendar-rule-grammar.ts).
  it.each([
    ["", "Enter a calendar rule"],
    ["INTERVAL=2", "FREQ is required (RFC 5545, 3.3.10)"],
    ["FREQ=WEEKLY;COUNT=3;UNTIL=20261231", "UNTIL and COUNT cannot both be given"],
    ["FREQ=WEEKLY;FREQ=DAILY", "FREQ is given twice"],
    ["FREQ=WEEKLY;COLOUR=RED", "COLOUR is not a rule part"],
    ["FREQ=FORTNIGHTLY", "FREQ must be DAILY, WEEKLY, MONTHLY or YEARLY"],
    ["FREQ=HOURLY;INTERVAL=3", "whole ship's days"],
    ["FREQ=DAILY;BYHOUR=9", "whole ship's days"],
    ["FREQ=WEEKLY;INTERVAL=0", "INTERVAL must be a whole number"],
    ["FREQ=WEEKLY;BYDAY=1MO", "needs FREQ=MONTHLY or FREQ=YEARLY (RFC 5545, 3.3.10)"],
    ["FREQ=WEEKLY;BYMONTHDAY=1", "cannot be used with FREQ=WEEKLY (RFC 5545, 3.3.10)"],
    ["FREQ=MONTHLY;BYMONTHDAY=32", "BYMONTHDAY takes days 1 to 31"],
    ["FREQ=MONTHLY;BYDAY=6MO", "goes from 1 to 5"],
    ["FREQ=YEARLY;BYMONTH=2;BYMONTHDAY=30", "never falls due"],
    ["FREQ=YEARLY;INTERVAL=4;BYMONTH=2;BYMONTHDAY=29", "only in leap years"],
    ["FREQ=YEARLY;BYMONTH=6", "say the day too"],
    ["FREQ=MONTHLY;INTERVAL=12;BYMONTH=6;BYMONTHDAY=1", "use FREQ=YEARLY with BYMONTH"],
    ["FREQ=MONTHLY;INTERVAL=2;BYMONTHDAY=31", "INTERVAL must be 1"],
    ["FREQ=DAILY;INTERVAL=7;BYDAY=MO", "needs INTERVAL=1"],
    ["FREQ=MONTHLY;BYDAY=MO;BYSETPOS=6", "BYSETPOS goes from 1 to 4"],
    ["FREQ=YEARLY;BYYEARDAY=100", "BYYEARDAY is not supported"],
    // rrule 2.8.1 returns no date for this mix (found by the property test below).
    ["FREQ=MONTHLY;BYDAY=MO,-1SU", "not a mix"],
    ["DTSTART:20260101\nRRULE:FREQ=DAILY", "the start date comes from the routine"],
  ])("refuses %j: %s", (text, words) => {
    expect(calendarRuleProblem(text)).toContain(words);
  });

  it.each([
    "FREQ=DAILY",
    "FREQ=WEEKLY;INTERVAL=2;BYDAY=MO,FR",
    "FREQ=MONTHLY;BYDAY=-1FR",
    "FREQ=MONTHLY;BYDAY=MO,TU,WE,TH,FR;BYSETPOS=-1",
    "FREQ=MONTHLY;BYDAY=FR;BYMONTHDAY=13",
    "FREQ=YEARLY;BYMONTH=4;BYMONTHDAY=15",
    "FREQ=YEARLY;BYMONTH=2;BYMONTHDAY=29",
    "FREQ=MONTHLY;INTERVAL=60",
    ...RFC_VECTOR_RULES,
  ])("accepts %j", (text) => {
    expect(calendarRuleProblem(text)).toBeNull();
  });
});

describe("properties of accepted rules", () => {
  const weekday = fc.constantFrom("MO", "TU", "WE", "TH", "FR", "SA", "SU");
  const ruleText = fc
    .record({
      freq: fc.constantFrom("DAILY", "WEEKLY", "MONTHLY", "YEARLY"),
      interval: fc.oneof(fc.constant(1), fc.integer({ min: 2, max: 5 }), fc.integer({ min: 6, max: 60 })),
      byDay: fc.option(
        fc.uniqueArray(fc.tuple(fc.option(fc.integer({ min: -5, max: 5 }).filter((n) => n !== 0)), weekday), {
          minLength: 1,
          maxLength: 3,
        }),
      ),
      monthDays: fc.option(
        fc.uniqueArray(
          fc.integer({ min: -31, max: 31 }).filter((n) => n !== 0),
          { minLength: 1, maxLength: 3 },
        ),
      ),
      months: fc.option(fc.uniqueArray(fc.integer({ min: 1, max: 12 }), { minLength: 1, maxLength: 3 })),
      setPos: fc.option(
        fc.integer({ min: -4, max: 4 }).filter((n) => n !== 0),
        { freq: 4 },
      ),
    })
    .map(({ freq, interval, byDay, monthDays, months, setPos }) =>
      [
        `FREQ=${freq}`,
        interval > 1 ? `INTERVAL=${interval}` : null,
        byDay ? `BYDAY=${byDay.map(([n, d]) => `${n ?? ""}${d}`).join(",")}` : null,
        monthDays ? `BYMONTHDAY=${monthDays.join(",")}` : null,
        months ? `BYMONTH=${months.join(",")}` : null,
        setPos ? `BYSETPOS=${setPos}` : null,
      ]
        .filter((p) => p !== null)
        .join(";"),
    )
    .filter((text) => calendarRuleProblem(text) === null);
  const instant = fc.date({
    min: new Date("2000-01-01T00:00:00Z"),
    max: new Date("2060-12-31T00:00:00Z"),
    noInvalidDate: true,
  });
  const zone = fc.constantFrom(
    "UTC",
    "Europe/Amsterdam",
    "America/New_York",
    "Asia/Singapore",
    "Pacific/Auckland",
    "America/Santiago",
  );

  // Keelson's own guarantee (calendar-rule-grammar.ts): an accepted rule without COUNT or UNTIL
  // always falls due again, from any start, on a later ship's day.
  it("an accepted rule always gives a next due day after the given day", () => {
    fc.assert(
      fc.property(ruleText, instant, fc.integer({ min: 0, max: 400 }), zone, (text, start, laterDays, timeZone) => {
        const after = new Date(start.getTime() + laterDays * 86_400_000);
        const next = nextOccurrenceAfter(text, start, after, timeZone);
        expect(next).not.toBeNull();
        expect(shipDateKey(shipDateOf(next ?? new Date(0), timeZone)) > shipDateKey(shipDateOf(after, timeZone))).toBe(
          true,
        );
      }),
      { numRuns: 150 },
    );
  });
});
