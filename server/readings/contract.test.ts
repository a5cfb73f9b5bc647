import { describe, expect, it } from "vitest";
import { MeterValue, ReadingBatchInput, ReadingCorrectionInput, ReadingRemovalInput } from "./contract";

describe("MeterValue", () => {
  it.each([
    ["12431", 12431],
    ["12431.5", 12431.5],
    [" 12 431,5 ", 12431.5],
    ["12,431.5", 12431.5],
    [42, 42],
  ])("reads %j as %d", (input, expected) => {
    expect(MeterValue.parse(input)).toBe(expected);
  });

  it.each(["", "abc", "-5", "12.55", "1e5", "12..3"])("refuses %j with a message", (input) => {
    const result = MeterValue.safeParse(input);
    expect(result.success).toBe(false);
    expect(result.error?.issues[0]?.message).toMatch(/at most one decimal/);
  });

  it("refuses more than a meter can show", () => {
    expect(MeterValue.safeParse("10000000").error?.issues[0]?.message).toMatch(/more hours than a meter/);
  });
});

describe("ReadingBatchInput", () => {
  it("needs at least one entry, a date and a 24-hour time", () => {
    const result = ReadingBatchInput.safeParse({ shipDay: "2026-13-01", time: "25:00", entries: [] });
    expect(result.success).toBe(false);
    const fields = result.error?.issues.map((i) => i.path.join("."));
    expect(fields).toEqual(expect.arrayContaining(["shipDay", "time", "entries"]));
  });
});

describe("ReadingCorrectionInput and ReadingRemovalInput", () => {
  it("take a value, an optional remark and a reason", () => {
    expect(ReadingCorrectionInput.parse({ value: "14,250", reason: " typed 41,250 " })).toEqual({
      value: 14250,
      reason: "typed 41,250",
    });
  });

  it.each([
    ["missing", undefined],
    ["too short once trimmed", "  typo  "],
    ["too long", "x".repeat(501)],
  ])("refuse a reason that is %s, naming the reason", (_label, reason) => {
    for (const schema of [ReadingCorrectionInput, ReadingRemovalInput]) {
      const result = schema.safeParse({ value: 14250, reason });
      expect(result.success).toBe(false);
      expect(result.error?.issues.map((i) => i.path.join("."))).toEqual(["reason"]);
      expect(result.error?.issues[0]?.message).toMatch(/reason|Say why/);
    }
  });

  it("refuses a malformed value, naming the value", () => {
    const result = ReadingCorrectionInput.safeParse({ value: "14.25", reason: "typed a digit too many" });
    expect(result.error?.issues.map((i) => i.path.join("."))).toEqual(["value"]);
  });
});
