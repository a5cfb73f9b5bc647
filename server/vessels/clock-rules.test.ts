import { describe, expect, it } from "vitest";
import { clockMoveWords, offsetMinutes, offsetZone, zoneAtFrom, zoneFromInput, zoneWords } from "./clock-rules";

describe("the ship's clock", () => {
  it("takes whole-hour offsets and zone names, and refuses anything else", () => {
    expect(zoneFromInput("UTC+7")).toBe("Etc/GMT-7");
    expect(zoneFromInput("utc -3")).toBe("Etc/GMT+3");
    expect(zoneFromInput("UTC")).toBe("UTC");
    expect(zoneFromInput("Asia/Kolkata")).toBe("Asia/Kolkata");
    expect(zoneFromInput("UTC+15")).toBeNull();
    expect(zoneFromInput("Mars/Olympus")).toBeNull();
    expect(zoneFromInput("'; drop table vessel")).toBeNull();
  });

  it("says an Etc zone the way a person does (the IANA name's sign is the other way round)", () => {
    expect(zoneWords(offsetZone(7))).toBe("UTC+7");
    expect(zoneWords(offsetZone(-3))).toBe("UTC−3");
    expect(zoneWords("Asia/Singapore")).toBe("Asia/Singapore");
  });

  it("works out the move of the clock: Singapore (UTC+8) to UTC+7 is back 1 h, to India (UTC+5:30) back 2 h 30 min", () => {
    const at = new Date("2026-12-05T16:00:00Z");
    expect(offsetMinutes("Asia/Singapore", at)).toBe(480);
    expect(clockMoveWords("Asia/Singapore", offsetZone(7), at)).toBe("Clocks go back 1 h");
    expect(clockMoveWords("Asia/Singapore", "Asia/Kolkata", at)).toBe("Clocks go back 2 h 30 min");
    expect(clockMoveWords(offsetZone(7), "Asia/Singapore", at)).toBe("Clocks go forward 1 h");
  });
});

describe("the zone kept at an instant", () => {
  const back = { effectiveAt: new Date("2026-12-05T16:00:00Z"), fromTimeZone: "Asia/Singapore", timeZone: "Etc/GMT-7" };
  const again = { effectiveAt: new Date("2026-12-07T17:00:00Z"), fromTimeZone: "Etc/GMT-7", timeZone: "Etc/GMT-6" };
  const zoneAt = zoneAtFrom([again, back], "Etc/GMT-6");

  it("is the zone of the last change at or before it, and the first change's old zone before any", () => {
    expect(zoneAt(new Date("2026-12-05T01:00:00Z"))).toBe("Asia/Singapore");
    expect(zoneAt(new Date("2026-12-05T16:00:00Z"))).toBe("Etc/GMT-7");
    expect(zoneAt(new Date("2026-12-06T09:00:00Z"))).toBe("Etc/GMT-7");
    expect(zoneAt(new Date("2026-12-08T00:00:00Z"))).toBe("Etc/GMT-6");
  });

  it("is the zone kept now for a ship that never changed its clock", () => {
    expect(zoneAtFrom([], "Asia/Singapore")(new Date("2020-01-01T00:00:00Z"))).toBe("Asia/Singapore");
  });
});
