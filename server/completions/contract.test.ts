import { describe, expect, it } from "vitest";
import type { RoutineMeasurement } from "@/db/schema";
import { assessMeasurements, CompletionInput, DecisionInput, limitSide, measurementMismatches } from "./contract";

// Hand-worked limits, in the style of a maker's table: a clearance of 0.20–0.50 mm and a wear
// limit with only an upper bound of 0.80 mm.
const CLEARANCE: RoutineMeasurement = { name: "Ring groove clearance", unit: "mm", lower: 0.2, upper: 0.5 };
const WEAR: RoutineMeasurement = { name: "Liner wear", unit: "mm", lower: null, upper: 0.8 };

describe("assessMeasurements", () => {
  it("flags values below the lower or above the upper limit; the limits themselves are inside", () => {
    const values = [0.19, 0.2, 0.35, 0.5, 0.51].map((value) =>
      assessMeasurements([CLEARANCE], [{ name: CLEARANCE.name, value }]),
    );
    expect(values.map((v) => v[0]?.outOfLimits)).toEqual([true, false, false, false, true]);
  });

  it("treats a missing limit as open-ended", () => {
    expect(limitSide(WEAR, -5)).toBeNull();
    expect(limitSide(WEAR, 0.8)).toBeNull();
    expect(limitSide(WEAR, 0.81)).toBe("high");
    expect(limitSide(CLEARANCE, 0.1)).toBe("low");
  });

  it("copies unit and limits into the record and skips names the routine does not have", () => {
    expect(
      assessMeasurements(
        [CLEARANCE, WEAR],
        [
          { name: "Liner wear", value: 0.92 },
          { name: "Bore", value: 1 },
        ],
      ),
    ).toEqual([{ name: "Liner wear", unit: "mm", value: 0.92, lower: null, upper: 0.8, outOfLimits: true }]);
  });
});

describe("measurementMismatches", () => {
  it("names unknown, repeated and missing measurements", () => {
    const problems = measurementMismatches(
      [CLEARANCE, WEAR],
      [
        { name: "Liner wear", value: 0.3 },
        { name: "Liner wear", value: 0.4 },
        { name: "Bore", value: 1 },
      ],
    );
    expect(problems.map((p) => p.field)).toEqual(["measurements.1.name", "measurements.2.name", "measurements"]);
    expect(problems[2]?.message).toContain("Ring groove clearance");
  });
});

const valid = {
  doneOn: "2026-05-03",
  time: "14:30",
  counterHours: "12,431.5",
  manHours: 6,
  checklist: [
    { step: "Isolate", done: true },
    { step: "Renew rings", done: false, remark: "Rings not on board; see follow-up" },
  ],
  measurements: [{ name: "Liner wear", value: "0.42" }],
};

describe("CompletionInput", () => {
  it("takes a ship's day and clock, a meter value as typed, and numbers as text", () => {
    const parsed = CompletionInput.parse(valid);
    expect(parsed).toMatchObject({ counterHours: 12431.5, manHours: 6, remarks: "", measurements: [{ value: 0.42 }] });
  });

  it("refuses an unticked step without a remark, naming its row", () => {
    const result = CompletionInput.safeParse({ ...valid, checklist: [{ step: "Isolate", done: false }] });
    expect(result.success).toBe(false);
    expect(result.error?.issues[0]?.path).toEqual(["checklist", 0, "remark"]);
  });

  it("refuses man-hours of 0, a bad clock and a counter value with two decimals", () => {
    const result = CompletionInput.safeParse({ ...valid, manHours: 0, time: "25:00", counterHours: "100.25" });
    expect(result.error?.issues.map((i) => i.path.join(".")).sort()).toEqual(["counterHours", "manHours", "time"]);
  });

  it("leaves the counter value out when it is not given", () => {
    expect(CompletionInput.parse({ ...valid, counterHours: null }).counterHours).toBeNull();
    expect(CompletionInput.parse({ ...valid, counterHours: undefined }).counterHours).toBeUndefined();
  });
});

describe("DecisionInput", () => {
  it("needs a note to return a completion, not to approve it", () => {
    expect(DecisionInput.safeParse({ decision: "approve" }).success).toBe(true);
    expect(DecisionInput.safeParse({ decision: "return" }).error?.issues[0]?.path).toEqual(["note"]);
    expect(DecisionInput.safeParse({ decision: "maybe" }).success).toBe(false);
  });
});

describe("typed numbers on the completion form", () => {
  it("reads a decimal comma, and never takes a blank for 0", () => {
    const parsed = CompletionInput.parse({
      ...valid,
      manHours: "6,5",
      counterHours: "",
      measurements: [{ name: "Liner wear", value: "0,42" }],
    });
    expect(parsed).toMatchObject({ manHours: 6.5, counterHours: null, measurements: [{ value: 0.42 }] });
    const blank = CompletionInput.safeParse({
      ...valid,
      manHours: "",
      measurements: [{ name: "Liner wear", value: " " }],
    });
    expect(blank.error?.issues.map((i) => i.path.join(".")).sort()).toEqual(["manHours", "measurements.0.value"]);
  });
});
