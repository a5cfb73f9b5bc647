import { describe, expect, it } from "vitest";
import { formatDayKey, formatUtcTime } from "./dates";

describe("one date style", () => {
  it("writes a day as day, short month, year", () => {
    expect(formatDayKey("2026-06-21")).toBe("21 Jun 2026");
    expect(formatDayKey("2026-12-05")).toBe("5 Dec 2026");
    expect(formatDayKey("not a day")).toBe("not a day");
  });

  it("writes an instant on the UTC clock", () => {
    expect(formatUtcTime("2026-01-02T03:04:59Z")).toBe("2 Jan 2026 03:04 UTC");
    expect(formatUtcTime(new Date(Date.UTC(2026, 11, 31, 23, 59)))).toBe("31 Dec 2026 23:59 UTC");
  });
});
