import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { calendarRuleProblem } from "./calendar-rule";
import {
  calendarRuleFromForm,
  describeCalendarRule,
  formFromCalendarRule,
  type CalendarRuleForm,
} from "./calendar-rule-words";

// Worked examples: the words a chief engineer reads for each stored rule.
describe("describeCalendarRule", () => {
  it.each([
    ["FREQ=DAILY", "every day"],
    ["FREQ=DAILY;INTERVAL=3", "every 3 days"],
    ["FREQ=WEEKLY;BYDAY=MO", "every week on Monday"],
    ["FREQ=WEEKLY;INTERVAL=2;BYDAY=FR,MO,WE", "every 2 weeks on Monday, Wednesday and Friday"],
    ["FREQ=MONTHLY", "every month"],
    ["FREQ=MONTHLY;INTERVAL=3", "every 3 months"],
    ["FREQ=YEARLY;INTERVAL=5", "every 5 years"],
    ["FREQ=YEARLY;BYMONTH=4;BYMONTHDAY=15", "every year on 15 April"],
    ["FREQ=MONTHLY;BYDAY=-1FR", "every month on the last Friday"],
    ["FREQ=MONTHLY;BYDAY=MO", "every month on every Monday"],
    ["FREQ=MONTHLY;BYMONTHDAY=1,-1", "every month on day 1 and the last day"],
    ["FREQ=MONTHLY;BYMONTHDAY=15,30", "every month on days 15 and 30"],
    ["FREQ=MONTHLY;BYDAY=FR;BYMONTHDAY=13", "every month on every Friday when it is day 13"],
    [
      "FREQ=MONTHLY;BYDAY=MO,TU,WE,TH,FR;BYSETPOS=-1",
      "every month on the last of Monday, Tuesday, Wednesday, Thursday and Friday",
    ],
    // RFC 5545 3.8.5.3 vectors (SOURCES.md), in words.
    ["FREQ=MONTHLY;COUNT=10;BYDAY=1FR", "every month on the first Friday, 10 times"],
    [
      "FREQ=WEEKLY;INTERVAL=2;UNTIL=19971224T000000Z;WKST=SU;BYDAY=MO,WE,FR",
      "every 2 weeks on Monday, Wednesday and Friday, until 24 Dec 1997 (UTC)",
    ],
    ["FREQ=WEEKLY;UNTIL=20261231", "every week, until 31 Dec 2026"],
  ])("%s → %s", (rule, words) => {
    expect(describeCalendarRule(rule)).toBe(words);
  });
});

describe("the routine form's friendly fields", () => {
  it("every 3 months → FREQ=MONTHLY;INTERVAL=3 and back", () => {
    expect(calendarRuleFromForm({ every: 3, unit: "month" })).toBe("FREQ=MONTHLY;INTERVAL=3");
    expect(formFromCalendarRule("FREQ=MONTHLY;INTERVAL=3")).toEqual({ every: 3, unit: "month" });
  });

  it("every week on Friday and Monday → weekdays in week order, INTERVAL left out at 1", () => {
    expect(calendarRuleFromForm({ every: 1, unit: "week", weekdays: ["FR", "MO"] })).toBe("FREQ=WEEKLY;BYDAY=MO,FR");
    expect(formFromCalendarRule("FREQ=WEEKLY;BYDAY=MO,FR")).toEqual({ every: 1, unit: "week", weekdays: ["MO", "FR"] });
  });

  it("a rule the form cannot show gives null, so the page offers the RRULE field instead", () => {
    expect(formFromCalendarRule("FREQ=MONTHLY;BYDAY=1FR")).toBeNull();
    expect(formFromCalendarRule("FREQ=MONTHLY;COUNT=10")).toBeNull();
    expect(formFromCalendarRule("FREQ=WEEKLY;WKST=SU;INTERVAL=2;BYDAY=MO")).toBeNull();
    expect(formFromCalendarRule("FREQ=WEEKLY;WKST=MO;BYDAY=MO")).toEqual({ every: 1, unit: "week", weekdays: ["MO"] });
  });

  it("refuses weekdays on a monthly rule and an every of 0, naming the field", () => {
    expect(() => calendarRuleFromForm({ every: 1, unit: "month", weekdays: ["MO"] })).toThrow(
      "Weekdays go with a rule that repeats by weeks.",
    );
    expect(() => calendarRuleFromForm({ every: 0, unit: "day" })).toThrow(/Repeat every 1 to 999 days/);
  });

  it("property: form → rule → form gives the form back, and the rule is always accepted", () => {
    const form = fc.oneof(
      fc.record({
        every: fc.integer({ min: 1, max: 999 }),
        unit: fc.constantFrom("day" as const, "month" as const, "year" as const),
      }),
      fc.record({
        every: fc.integer({ min: 1, max: 999 }),
        unit: fc.constant("week" as const),
        weekdays: fc.uniqueArray(
          fc.constantFrom(
            "MO" as const,
            "TU" as const,
            "WE" as const,
            "TH" as const,
            "FR" as const,
            "SA" as const,
            "SU" as const,
          ),
          { minLength: 1 },
        ),
      }),
    );
    const weekOrder = ["MO", "TU", "WE", "TH", "FR", "SA", "SU"];
    fc.assert(
      fc.property(form, (f: CalendarRuleForm) => {
        const rule = calendarRuleFromForm(f);
        expect(calendarRuleProblem(rule)).toBeNull();
        const expected = f.weekdays
          ? { ...f, weekdays: [...f.weekdays].sort((a, b) => weekOrder.indexOf(a) - weekOrder.indexOf(b)) }
          : f;
        expect(formFromCalendarRule(rule)).toEqual(expected);
      }),
    );
  });
});
