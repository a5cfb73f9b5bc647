import { describe, expect, it } from "vitest";
import { RoutineCopyInput, RoutineInput, RoutinePatch } from "./contract";
import { intervalWords } from "./interval-words";

const COMPONENT = "2b6f0c1e-8a8e-4c4f-9d59-3a4b5c6d7e8f";
const base = { componentId: COMPONENT, title: "Purifier bowl cleaning", rank: "third-engineer" } as const;
const hoursRoutine = { ...base, intervalHours: 2000, baselineAt: "2026-03-01", baselineHours: 12_400 };

const issuesOf = (input: unknown) =>
  (RoutineInput.safeParse(input).error?.issues ?? []).map((i) => ({ field: i.path.join("."), message: i.message }));
const fieldsOf = (input: unknown) => issuesOf(input).map((i) => i.field);

describe("RoutineInput", () => {
  it("accepts an hours routine and fills in the defaults", () => {
    expect(RoutineInput.parse({ ...hoursRoutine, intervalHours: "2,000" })).toMatchObject({
      intervalHours: 2000,
      calendarRule: null,
      anchored: false,
      estimatedManHours: 1,
      checklist: [],
      measurements: [],
      cautions: [],
      description: "",
      classItemRef: null,
      baselineHours: 12_400,
    });
  });

  it("turns the friendly calendar form into the stored RRULE", () => {
    const out = RoutineInput.parse({ ...base, calendar: { every: 6, unit: "month" }, baselineAt: "2026-01-10" });
    expect(out.calendarRule).toBe("FREQ=MONTHLY;INTERVAL=6");
    const weekly = RoutineInput.parse({
      ...base,
      calendar: { every: 1, unit: "week", weekdays: ["FR", "MO"] },
      baselineAt: "2026-01-10",
    });
    expect(weekly.calendarRule).toBe("FREQ=WEEKLY;BYDAY=MO,FR");
  });

  it("accepts a raw RRULE, upper-cased and without the RRULE: prefix", () => {
    const out = RoutineInput.parse({
      ...base,
      calendarRule: "rrule:freq=yearly",
      anchored: true,
      anchorDate: "2026-04-15",
    });
    expect(out).toMatchObject({ calendarRule: "FREQ=YEARLY", anchored: true, anchorDate: "2026-04-15" });
  });

  it("keeps the cautions in their usual order, once each", () => {
    const out = RoutineInput.parse({ ...hoursRoutine, cautions: ["turning-gear", "isolation", "isolation"] });
    expect(out.cautions).toEqual(["isolation", "turning-gear"]);
  });

  it("refuses a routine without any interval, naming intervalHours", () => {
    expect(issuesOf(base)).toEqual([
      { field: "intervalHours", message: expect.stringMatching(/interval in running hours, a calendar rule, both .* or tie it to every port stay/) },
    ]);
  });

  it.each([
    ["a bad RRULE", { calendarRule: "FREQ=FORTNIGHTLY" }, "calendarRule"],
    ["COUNT in a raw rule", { calendarRule: "FREQ=MONTHLY;COUNT=10" }, "calendarRule"],
    [
      "both the form and a raw rule",
      { calendar: { every: 1, unit: "month" }, calendarRule: "FREQ=MONTHLY" },
      "calendarRule",
    ],
    ["weekdays on a monthly form", { calendar: { every: 1, unit: "month", weekdays: ["MO"] } }, "calendar.weekdays"],
    ["every 0 months", { calendar: { every: 0, unit: "month" } }, "calendar.every"],
  ])("refuses %s", (_what, extra, field) => {
    expect(fieldsOf({ ...base, baselineAt: "2026-01-10", ...extra })).toEqual([field]);
  });

  it("says why COUNT is refused", () => {
    expect(issuesOf({ ...base, baselineAt: "2026-01-10", calendarRule: "FREQ=MONTHLY;COUNT=3" })[0]?.message).toMatch(
      /Leave COUNT out/,
    );
  });

  it("refuses an anchored routine without its anniversary, and anchoring an hours-only routine", () => {
    expect(fieldsOf({ ...base, calendarRule: "FREQ=YEARLY", anchored: true })).toEqual(["anchorDate"]);
    expect(fieldsOf({ ...hoursRoutine, anchored: true, anchorDate: "2026-04-15" })).toEqual(["anchored"]);
  });

  it("refuses a measurement whose lower limit is above the upper, on that row", () => {
    const issues = issuesOf({
      ...hoursRoutine,
      measurements: [
        { name: "Bowl clearance", unit: "mm", lower: 0.2, upper: 0.5 },
        { name: "Disc stack height", unit: "mm", lower: 40, upper: 38 },
      ],
    });
    expect(issues).toEqual([{ field: "measurements.1.upper", message: expect.stringMatching(/Disc stack height/) }]);
  });

  it("asks for a baseline on an hours routine never done", () => {
    const issues = issuesOf({ ...base, intervalHours: 2000 });
    expect(issues.map((i) => i.field).sort()).toEqual(["baselineAt", "baselineHours"]);
    expect(issues[0]?.message).toMatch(/^A routine never done needs a baseline/);
  });

  it.each([
    ["intervalHours", 0],
    ["intervalHours", -5],
    ["intervalHours", "12.25"],
    ["estimatedManHours", "lots"],
    ["rank", "bosun"],
    ["cautions", ["smoking"]],
    ["componentId", "ME.CYL.3"],
    ["anchorDate", "15/04/2026"],
    ["title", "  "],
  ])("refuses %s = %j, naming the field", (field, value) => {
    const input = {
      ...hoursRoutine,
      calendarRule: "FREQ=YEARLY",
      anchored: true,
      anchorDate: "2026-04-15",
      [field]: value,
    };
    expect(fieldsOf(input)[0]).toMatch(new RegExp(`^${field}`));
  });
});

describe("a routine's team", () => {
  const team = [
    { rank: "second-engineer", count: 1 },
    { rank: "motorman", count: 2 },
  ];
  it("derives the lead rank and the man-hours from the team and its elapsed time", () => {
    expect(RoutineInput.parse({ ...hoursRoutine, rank: undefined, team, elapsedHours: "12" })).toMatchObject({
      rank: "second-engineer",
      team,
      elapsedHours: 12,
      estimatedManHours: 36,
    });
  });

  it("keeps an older client's rank and man-hours as one person of that rank", () => {
    expect(RoutineInput.parse({ ...hoursRoutine, estimatedManHours: 6 })).toMatchObject({
      rank: "third-engineer",
      team: [{ rank: "third-engineer", count: 1 }],
      elapsedHours: 6,
      estimatedManHours: 6,
    });
  });

  it.each([
    ["a rank twice", { team: [...team, { rank: "motorman", count: 1 }], elapsedHours: 2 }, "team.2.rank"],
    ["no one", { team: [], elapsedHours: 2 }, "team"],
    ["half a person", { team: [{ rank: "motorman", count: 1.5 }], elapsedHours: 2 }, "team.0.count"],
    ["eleven of a rank", { team: [{ rank: "motorman", count: 11 }], elapsedHours: 2 }, "team.0.count"],
    ["a team without its elapsed time", { team }, "elapsedHours"],
    ["more man-hours than one job takes", { team: [{ rank: "motorman", count: 10 }, { rank: "oiler", count: 10 }], elapsedHours: 500 }, "elapsedHours"],
    ["an elapsed time of 0", { team, elapsedHours: 0 }, "elapsedHours"],
  ])("refuses %s, naming the field", (_what, extra, field) => {
    expect(fieldsOf({ ...hoursRoutine, rank: undefined, ...extra })).toEqual([field]);
  });
});

describe("a routine tied to every port stay", () => {
  // SOLAS chapter V, regulation 26 (memory): the steering gear tested within 12 h before departure.
  const steering = { ...base, portEvent: "departure", portEventHours: 12 };
  it("needs no interval and no baseline", () => {
    expect(RoutineInput.parse(steering)).toMatchObject({ portEvent: "departure", portEventHours: 12, intervalHours: null, calendarRule: null });
  });

  it("refuses an interval beside it, and a missing number of hours", () => {
    expect(fieldsOf({ ...steering, calendarRule: "FREQ=WEEKLY" })).toEqual(["calendar"]);
    expect(fieldsOf({ ...steering, intervalHours: 100 })).toEqual(["intervalHours"]);
    expect(fieldsOf({ ...steering, portEventHours: null })).toEqual(["portEventHours"]);
    expect(fieldsOf({ ...steering, portEventHours: 73 })).toEqual(["portEventHours"]);
  });

  it("is worded as the list shows it", () => {
    expect(intervalWords(null, null, { event: "departure", withinHours: 12 })).toBe("within 12 h before each departure");
  });
});

describe("RoutinePatch and RoutineCopyInput", () => {
  it("a patch takes single fields and refuses an empty one", () => {
    expect(RoutinePatch.parse({ intervalHours: "1500" })).toEqual({ intervalHours: 1500 });
    expect(RoutinePatch.safeParse({}).success).toBe(false);
  });

  it("a copy needs at least one component id", () => {
    expect(RoutineCopyInput.safeParse({ componentIds: [] }).error?.issues[0]?.message).toMatch(/at least one/);
    expect(RoutineCopyInput.safeParse({ componentIds: ["x"] }).error?.issues[0]?.path).toEqual(["componentIds", 0]);
  });
});

describe("intervalWords", () => {
  it.each([
    [2000, null, "every 2,000 h"],
    [null, "FREQ=MONTHLY;INTERVAL=6", "every 6 months"],
    [2000, "FREQ=MONTHLY;INTERVAL=12", "every 2,000 h or every 12 months, whichever first"],
    [null, "FREQ=WEEKLY;BYDAY=MO", "every week on Monday"],
  ])("%j h and %j read %j", (hours, rule, words) => {
    expect(intervalWords(hours, rule)).toBe(words);
  });
});
