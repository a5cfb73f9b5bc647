import { describe, expect, it } from "vitest";
import { MeterValue, ReadingBatchInput } from "./contract";

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
