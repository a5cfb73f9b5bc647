import { describe, expect, it } from "vitest";
import {
  COMPONENT_CODE_PATTERN,
  ComponentCode,
  ComponentInput,
  ComponentPatch,
  CounterInput,
  MeterReplacementInput,
} from "./contract";

const messageOf = (result: { error?: { issues: { message: string }[] } }) => result.error?.issues[0]?.message;

describe("ComponentCode", () => {
  it.each([
    ["ME.CYL.3", "ME.CYL.3"],
    [" me.cyl.3 ", "ME.CYL.3"],
    ["ae_1-tc", "AE_1-TC"],
    ["9", "9"],
    ["A".repeat(40), "A".repeat(40)],
  ])("accepts %j as %j, which the database's check accepts too", (input, stored) => {
    expect(ComponentCode.parse(input)).toBe(stored);
    expect(COMPONENT_CODE_PATTERN.test(stored)).toBe(true);
  });

  it.each([
    ["", /Enter a code/],
    [".ME", /must start with a letter or digit/],
    ["ME CYL", /only letters, digits/],
    ["ME/CYL", /only letters, digits/],
    ["A".repeat(41), /41 characters long; keep it to 40/],
  ])("refuses %j with one message saying why", (input, message) => {
    const result = ComponentCode.safeParse(input);
    expect(result.error?.issues).toHaveLength(1);
    expect(messageOf(result)).toMatch(message);
  });
});

describe("ComponentInput", () => {
  it("fills in the defaults: top level, not critical, no counter of its own; empty text is no value", () => {
    expect(ComponentInput.parse({ code: "ME", name: " Main engine ", maker: "", model: "6NV50" })).toEqual({
      code: "ME",
      name: "Main engine",
      parentId: null,
      critical: false,
      counterId: null,
      maker: null,
      model: "6NV50",
    });
  });
});

describe("ComponentPatch", () => {
  it("changes only what is sent: a move is just the parent", () => {
    expect(ComponentPatch.parse({ parentId: null })).toEqual({ parentId: null });
  });

  it("does not reset a flag that was not sent", () => {
    expect(ComponentPatch.parse({ name: "Governor" })).not.toHaveProperty("critical");
  });

  it("refuses an empty change", () => {
    expect(messageOf(ComponentPatch.safeParse({}))).toMatch(/Nothing to change/);
  });
});

describe("CounterInput", () => {
  it.each([
    [18, 18],
    ["0.5", 0.5],
    ["0,5", 0.5],
    ["24", 24],
    [0, 0],
  ])("takes planned hours %j as %d h/day", (input, expected) => {
    expect(CounterInput.parse({ name: "Main engine", plannedHoursPerDay: input }).plannedHoursPerDay).toBe(expected);
  });

  it.each(["24.1", "-1", "1.25", "eighteen", ""])("refuses planned hours %j", (input) => {
    expect(messageOf(CounterInput.safeParse({ name: "Main engine", plannedHoursPerDay: input }))).toMatch(
      /from 0 to 24/,
    );
  });
});

describe("MeterReplacementInput", () => {
  const replacedAt = { shipDay: "2026-05-03", time: "09:00" };

  it("an old meter that could not be read has no final value; a new meter starts at 0", () => {
    expect(MeterReplacementInput.parse({ replacedAt, oldMeterFinal: "", reason: "Meter failed" })).toEqual({
      replacedAt,
      oldMeterFinal: null,
      newMeterStart: 0,
      reason: "Meter failed",
    });
  });

  it("reads meter values as the Hour log does (12,431.5)", () => {
    const parsed = MeterReplacementInput.parse({
      replacedAt,
      oldMeterFinal: "12,431.5",
      newMeterStart: 3,
      reason: "x",
    });
    expect([parsed.oldMeterFinal, parsed.newMeterStart]).toEqual([12431.5, 3]);
  });

  it("names the meter value that is wrong", () => {
    const result = MeterReplacementInput.safeParse({
      replacedAt,
      oldMeterFinal: "12.34",
      newMeterStart: "x",
      reason: "",
    });
    const byField = Object.fromEntries(result.error!.issues.map((i) => [i.path.join("."), i.message]));
    expect(byField.oldMeterFinal).toMatch(/^Final value on the old meter: enter the meter value in hours/);
    expect(byField.newMeterStart).toMatch(/^Value shown by the new meter: /);
    expect(byField.reason).toBe("Enter the reason for the replacement.");
  });
});
