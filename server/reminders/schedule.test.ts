import { describe, expect, it } from "vitest";
import { dueDigest, dueFleetSummary, isoWeekKey, missingReadingsSteps, reminderKeys, shipDayLabel } from "./schedule";

const SGT = "Asia/Singapore"; // UTC+8 all year, no daylight saving

describe("dueDigest", () => {
  it("is due from the digest hour of the ship's day, not before", () => {
    // 06:00 on 2 Dec in Singapore = 2 Dec 06:00 − 8 h = 1 Dec 22:00 UTC.
    expect(dueDigest(new Date("2026-12-01T21:59:59Z"), SGT, 6)).toBeNull();
    const occasion = dueDigest(new Date("2026-12-01T22:00:00Z"), SGT, 6);
    expect(occasion).toEqual({
      shipDay: "2026-12-02",
      cutOff: new Date("2026-12-01T22:00:00Z"),
      // the day before at 06:00 SGT: 30 Nov 22:00 UTC, so the window is exactly 24 h
      previousCutOff: new Date("2026-11-30T22:00:00Z"),
      dueFrom: "2026-12-02",
      dueUntil: "2026-12-08", // the digest's day and 6 more: 2, 3, … 8 Dec
    });
  });

  it("later the same ship's day it is still the same digest (one key per day)", () => {
    // 23:30 SGT on 2 Dec = 15:30 UTC: still ship's day 2 Dec.
    expect(dueDigest(new Date("2026-12-02T15:30:00Z"), SGT, 6)?.shipDay).toBe("2026-12-02");
    // 00:10 SGT on 3 Dec = 16:10 UTC: a new ship's day whose hour has not come: nothing due.
    expect(dueDigest(new Date("2026-12-02T16:10:00Z"), SGT, 6)).toBeNull();
  });

  it("spans 23 hours on the day the clocks go forward", () => {
    // London, 29 Mar 2026: 01:00 GMT becomes 02:00 BST. 06:00 BST = 05:00 UTC; the day before
    // 06:00 GMT = 06:00 UTC: 23 hours between the two cut-offs.
    const occasion = dueDigest(new Date("2026-03-29T05:00:00Z"), "Europe/London", 6)!;
    expect(occasion.cutOff).toEqual(new Date("2026-03-29T05:00:00Z"));
    expect(occasion.previousCutOff).toEqual(new Date("2026-03-28T06:00:00Z"));
  });
});

describe("missingReadingsSteps", () => {
  // Latest reading 30 Nov 09:00 SGT = 01:00 UTC; defaults 36 h, then 24 h between steps.
  const latest = new Date("2026-11-30T01:00:00Z");
  const at = (hours: number) => new Date(latest.getTime() + hours * 3_600_000);
  it("climbs engineers → chief → superintendents at 36, 60 and 84 hours", () => {
    expect(missingReadingsSteps(latest, at(35.99), 36, 24)).toEqual([]);
    expect(missingReadingsSteps(latest, at(36), 36, 24)).toEqual([1]);
    expect(missingReadingsSteps(latest, at(59.99), 36, 24)).toEqual([1]);
    expect(missingReadingsSteps(latest, at(60), 36, 24)).toEqual([1, 2]); // 36 + 24
    expect(missingReadingsSteps(latest, at(84), 36, 24)).toEqual([1, 2, 3]); // 36 + 2 × 24
    expect(missingReadingsSteps(latest, at(500), 36, 24)).toEqual([1, 2, 3]);
  });
  it("follows the company's own figures", () => {
    // 12 h, then 6 h: steps at 12, 18, 24 h.
    expect(missingReadingsSteps(latest, at(18), 12, 6)).toEqual([1, 2]);
    expect(missingReadingsSteps(latest, at(24), 12, 6)).toEqual([1, 2, 3]);
  });
  it("keys each step of each gap once", () => {
    expect(reminderKeys.missingReadings("v1", latest, 2, "u1")).toBe(
      "missing-readings:v1:2026-11-30T01:00:00.000Z:2:u1",
    );
  });
});

describe("weeks and labels", () => {
  it("numbers ISO weeks", () => {
    // 1 Jan 2026 is a Thursday, so week 1 starts Mon 29 Dec 2025; 1 Dec 2026 is 337 days
    // later: 337 / 7 = 48 whole weeks → week 49.
    expect(isoWeekKey(new Date("2026-12-01T12:00:00Z"))).toBe("2026-W49");
    // A year starting on a Thursday has 53 ISO weeks: Fri 1 Jan 2027 is in 2026-W53.
    expect(isoWeekKey(new Date("2027-01-01T12:00:00Z"))).toBe("2026-W53");
  });
  it("queues the fleet summary on Mondays from the digest hour (UTC)", () => {
    expect(dueFleetSummary(new Date("2026-11-30T05:59:00Z"), 6)).toBeNull(); // Monday, before 06:00
    expect(dueFleetSummary(new Date("2026-11-30T06:00:00Z"), 6)).toBe("2026-W49");
    expect(dueFleetSummary(new Date("2026-12-01T06:00:00Z"), 6)).toBeNull(); // Tuesday
  });
  it("writes a ship's day as the subject line does", () => {
    expect(shipDayLabel("2026-12-02")).toBe("Wed 2 Dec");
  });
});
