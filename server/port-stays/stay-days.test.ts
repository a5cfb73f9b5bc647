import { describe, expect, it } from "vitest";
import { instantOfShipDateTime, MAX_STAY_SHIP_DAYS, shipDateTimeOf, stayDays } from "./stay-days";

describe("a port stay's ship's days", () => {
  it("counts the arrival's and the departure's day, across the end of summer time", () => {
    // Europe/Amsterdam leaves summer time on Sunday 25 Oct 2026 (03:00 CEST → 02:00 CET, EU rule:
    // last Sunday of October). 24 Oct 20:00 CEST = 18:00 UTC; 26 Oct 08:00 CET = 07:00 UTC.
    const arrives = instantOfShipDateTime("2026-10-24T20:00", "Europe/Amsterdam");
    const departs = instantOfShipDateTime("2026-10-26T08:00", "Europe/Amsterdam");
    expect(arrives.toISOString()).toBe("2026-10-24T18:00:00.000Z");
    expect(departs.toISOString()).toBe("2026-10-26T07:00:00.000Z");
    expect(stayDays(arrives, departs, "Europe/Amsterdam")).toEqual(["2026-10-24", "2026-10-25", "2026-10-26"]);
  });

  it("gives two days to a stay over midnight and one to a stay inside a day", () => {
    const z = "Asia/Singapore";
    expect(stayDays(instantOfShipDateTime("2026-12-04T23:30", z), instantOfShipDateTime("2026-12-05T00:30", z), z)).toEqual([
      "2026-12-04",
      "2026-12-05",
    ]);
    expect(stayDays(instantOfShipDateTime("2026-12-04T06:00", z), instantOfShipDateTime("2026-12-04T22:00", z), z)).toEqual([
      "2026-12-04",
    ]);
  });

  it("names the days by the ship's zone, not UTC's", () => {
    // Pacific/Auckland keeps NZDT (UTC+13) in December: 20:00 UTC on 3 Dec is 09:00 on 4 Dec aboard.
    const instant = new Date("2026-12-03T20:00:00Z");
    expect(shipDateTimeOf(instant, "Pacific/Auckland")).toBe("2026-12-04T09:00");
    expect(stayDays(instant, new Date("2026-12-04T05:00:00Z"), "Pacific/Auckland")).toEqual(["2026-12-04"]);
  });

  it("walks a stored stay across the end of year 9999 by counting, not by comparing day texts", () => {
    // The old loop compared "10000-01-01" < "9999-12-31" as text and ran about 97 million steps.
    const days = stayDays(new Date("9999-12-31T06:00:00Z"), new Date("9999-12-31T20:00:00Z"), "Pacific/Kiritimati");
    // UTC+14 aboard: the arrival is on 31 Dec 9999 at 20:00, the departure on 1 Jan 10000.
    expect(days).toHaveLength(2);
    expect(days[0]).toBe("9999-12-31");
  });

  it("never gives more than the longest stay's days, whatever is stored", () => {
    const days = stayDays(new Date("2026-01-01T00:00:00Z"), new Date("9999-12-31T00:00:00Z"), "UTC");
    expect(days).toHaveLength(MAX_STAY_SHIP_DAYS);
    expect(days.at(-1)).toBe("2026-01-31");
    expect(stayDays(new Date("2026-01-02T00:00:00Z"), new Date("2026-01-01T00:00:00Z"), "UTC")).toEqual([]);
  });
});
