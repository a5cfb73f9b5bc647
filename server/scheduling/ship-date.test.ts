import { describe, expect, it } from "vitest";
import {
  addShipMonths,
  endOfShipDate,
  shipDateFromKey,
  shipDateKey,
  shipDateOf,
  shipDaysBetween,
  startOfShipDate,
} from "./ship-date";

const day = shipDateFromKey;

// Time-zone rules from the IANA database as shipped with Node's ICU (common practice).
describe("ship's days as floating dates", () => {
  it("an instant's ship's day depends on the vessel's zone: 1 Dec 19:00Z is 1 Dec in New York, 2 Dec in Auckland", () => {
    const instant = new Date("2026-12-01T19:00:00Z");
    expect(shipDateKey(shipDateOf(instant, "America/New_York"))).toBe("2026-12-01");
    expect(shipDateKey(shipDateOf(instant, "Pacific/Auckland"))).toBe("2026-12-02");
  });

  it("Amsterdam’s 23-hour day, 29 Mar 2026: from 28 Mar 23:00Z to 29 Mar 21:59:59.999Z", () => {
    expect(startOfShipDate(day("2026-03-29"), "Europe/Amsterdam").toISOString()).toBe("2026-03-28T23:00:00.000Z");
    expect(endOfShipDate(day("2026-03-29"), "Europe/Amsterdam").toISOString()).toBe("2026-03-29T21:59:59.999Z");
  });

  it("Amsterdam’s 25-hour day, 25 Oct 2026, ends at 24:00 CET = 23:00Z", () => {
    expect(endOfShipDate(day("2026-10-25"), "Europe/Amsterdam").toISOString()).toBe("2026-10-25T22:59:59.999Z");
  });

  it("the due instant formats as its own day on board", () => {
    const end = endOfShipDate(day("2026-04-15"), "Asia/Kolkata");
    expect(shipDateKey(shipDateOf(end, "Asia/Kolkata"))).toBe("2026-04-15");
  });

  it("months clamp at month ends (date-fns): 31 May − 3 → 28 Feb 2025, 29 Feb 2024; 30 Nov + 3 → 28 Feb 2026", () => {
    expect(shipDateKey(addShipMonths(day("2025-05-31"), -3))).toBe("2025-02-28");
    expect(shipDateKey(addShipMonths(day("2024-05-31"), -3))).toBe("2024-02-29");
    expect(shipDateKey(addShipMonths(day("2025-11-30"), 3))).toBe("2026-02-28");
  });

  it("counts whole days, leap day included", () => {
    expect(shipDaysBetween(day("2028-02-28"), day("2028-03-01"))).toBe(2);
    expect(shipDaysBetween(day("2026-03-01"), day("2026-02-14"))).toBe(-15);
  });
});
