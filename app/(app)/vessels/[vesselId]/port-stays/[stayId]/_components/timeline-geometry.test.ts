import { describe, expect, it } from "vitest";
import { buildAxis, dropStart, laneKeys, movedReason, moveMinutes, shiftLocal, spanOf, xOf } from "./timeline-geometry";

// Two days in Port Kelang (UTC+8): arrival 06:00 on the 4th, departure 12:00 on the 5th.
const stay = {
  days: ["2026-12-04", "2026-12-05"],
  workdayFrom: "08:00",
  workdayTo: "17:00",
  arrivesAt: "2026-12-03T22:00:00.000Z",
  departsAt: "2026-12-05T04:00:00.000Z",
  timeZone: "Asia/Kuala_Lumpur",
};
const at = (iso: string) => Date.parse(iso);

describe("the timeline's axis", () => {
  const axis = buildAxis(stay, 10, 1);

  it("is wide in the working day and narrow outside it, from arrival to departure", () => {
    // Day 1: 06–08 (2 h × 1), 08–17 (9 h × 10), 17–24 (7 h × 1); day 2: 00–08 (8 × 1), 08–12 (4 × 10).
    expect(axis.pieces.map((p) => [p.day, p.working, p.width])).toEqual([
      ["2026-12-04", false, 2],
      ["2026-12-04", true, 90],
      ["2026-12-04", false, 7],
      ["2026-12-05", false, 8],
      ["2026-12-05", true, 40],
    ]);
    expect(axis.width).toBe(147);
  });

  it("puts a slot at its place: 08:30 ship's time on day 1, and noon of day 2 at the end", () => {
    expect(xOf(axis, at("2026-12-04T00:30:00Z"))).toBe(2 + 5);
    expect(xOf(axis, at("2026-12-05T01:00:00Z"))).toBe(2 + 90 + 7 + 8 + 10);
    expect(xOf(axis, at("2026-12-06T00:00:00Z"))).toBe(147);
    expect(xOf(axis, at("2026-12-01T00:00:00Z"))).toBe(0);
  });

  it("gives a period its left and width", () => {
    expect(spanOf(axis, "2026-12-04T01:00:00Z", "2026-12-04T03:00:00Z")).toEqual({ left: 12, width: 20 });
  });
});

describe("lanes, moves", () => {
  it("gives one lane per person, ranks in the department's order, unknown people last", () => {
    expect(laneKeys([{ rank: "motorman", count: 2 }, { rank: "second-engineer", count: 1 }], ["fitter#1", "motorman#1"])).toEqual([
      "second-engineer#1",
      "motorman#1",
      "motorman#2",
      "fitter#1",
    ]);
  });

  it("moves a start a slot, an hour or a day, across midnight and months", () => {
    expect(shiftLocal("2026-12-31T23:30", 30)).toBe("2027-01-01T00:00");
    expect(shiftLocal("2026-12-04T08:00", -30)).toBe("2026-12-04T07:30");
    expect(moveMinutes("ArrowRight", false, 30)).toBe(30);
    expect(moveMinutes("ArrowLeft", true, 30)).toBe(-60);
    expect(moveMinutes("PageDown", false, 30)).toBe(1440);
    expect(moveMinutes("Enter", false, 30)).toBeNull();
  });
});

describe("where a dragged job lands", () => {
  const axis = buildAxis(stay, 10, 1);
  const local = (ms: number | null) => (ms === null ? null : new Date(ms + 8 * 3_600_000).toISOString().slice(0, 16));

  it("starts on the slot under the drop, within the working day", () => {
    // Day 1's working day starts at x = 2 (10 px an hour): x = 27 is 10:30, x = 29 rounds to 10:30 (30-min slots).
    expect(local(dropStart(axis, 27, 30))).toBe("2026-12-04T10:30");
    expect(local(dropStart(axis, 29, 30))).toBe("2026-12-04T10:30");
    expect(local(dropStart(axis, 30, 30))).toBe("2026-12-04T11:00");
    // The end of day 1's working day keeps one slot: 16:30.
    expect(local(dropStart(axis, 91.9, 30))).toBe("2026-12-04T16:30");
  });

  it("moves a drop on the hours outside the working day to the next working day's start", () => {
    expect(local(dropStart(axis, 0.5, 30))).toBe("2026-12-04T08:00");
    expect(local(dropStart(axis, 95, 30))).toBe("2026-12-05T08:00");
    // Past the end: the last slot of the last working day (departure at noon).
    expect(local(dropStart(axis, 500, 30))).toBe("2026-12-05T11:30");
  });
});

describe("a moved job's reason", () => {
  it("keeps why the job is in the package and drops the proposal's when and who, once", () => {
    const proposed = "Out of tolerance since 26 Sep — critical; motorman from 9 Dec 11:00 to 9 Dec 11:30 (0.5 h of work, 0.5 man-hours).";
    const once = movedReason(proposed);
    expect(once).toBe("Out of tolerance since 26 Sep — critical; moved on the timeline by hand.");
    expect(movedReason(once)).toBe(once);
    expect(movedReason("Added to the package by hand.")).toBe("Added to the package by hand.");
    expect(movedReason(undefined)).toBeUndefined();
  });
});
