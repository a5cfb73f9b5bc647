import { describe, expect, it } from "vitest";
import { endOfShipDay, shipDayKey, startOfShipDay } from "./ship-day";

const iso = (ms: number) => new Date(ms).toISOString();

// Time-zone rules from the IANA database as shipped with Node's ICU (common practice: EU summer
// time starts on the last Sunday of March at 01:00 UTC).
describe("ship's day boundaries", () => {
  it("Singapore (UTC+8, no DST): 1 Mar 03:00Z is 1 Mar 11:00 on board, day starts 28 Feb 16:00Z", () => {
    const ms = Date.parse("2026-03-01T03:00:00Z");
    expect(shipDayKey(ms, "Asia/Singapore")).toBe("2026-03-01");
    expect(iso(startOfShipDay(ms, "Asia/Singapore"))).toBe("2026-02-28T16:00:00.000Z");
    expect(iso(endOfShipDay(ms, "Asia/Singapore"))).toBe("2026-03-01T16:00:00.000Z");
  });

  it("Amsterdam on 29 Mar 2026, a 23-hour day: from 28 Mar 23:00Z to 29 Mar 22:00Z", () => {
    const ms = Date.parse("2026-03-29T12:00:00Z");
    expect(iso(startOfShipDay(ms, "Europe/Amsterdam"))).toBe("2026-03-28T23:00:00.000Z");
    expect(iso(endOfShipDay(ms, "Europe/Amsterdam"))).toBe("2026-03-29T22:00:00.000Z");
  });

  it("Amsterdam on 25 Oct 2026, a 25-hour day: from 24 Oct 22:00Z to 25 Oct 23:00Z", () => {
    const ms = Date.parse("2026-10-25T20:00:00Z");
    expect(iso(startOfShipDay(ms, "Europe/Amsterdam"))).toBe("2026-10-24T22:00:00.000Z");
    expect(iso(endOfShipDay(ms, "Europe/Amsterdam"))).toBe("2026-10-25T23:00:00.000Z");
  });

  it("Auckland, across the date line from UTC: 1 Dec 19:00Z is already 2 Dec on board", () => {
    expect(shipDayKey(Date.parse("2026-12-01T19:00:00Z"), "Pacific/Auckland")).toBe("2026-12-02");
  });
});
