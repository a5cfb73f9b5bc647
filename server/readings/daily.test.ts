import { describe, expect, it } from "vitest";
import { dailyRunningHours } from "./daily";

const at = (iso: string, totalHours: number) => ({ readAt: new Date(iso), totalHours });

describe("dailyRunningHours (worked examples computed by hand)", () => {
  it("readings at ship's midnight give each day its own difference", () => {
    // UTC vessel; 20 h between the 1st and 2nd, 24 h between the 2nd and 3rd.
    const days = dailyRunningHours(
      [at("2026-03-01T00:00:00Z", 1000), at("2026-03-02T00:00:00Z", 1020), at("2026-03-03T00:00:00Z", 1044)],
      "UTC",
    );
    expect(days).toEqual([
      { day: "2026-03-01", hours: 20 },
      { day: "2026-03-02", hours: 24 },
    ]);
  });

  it("an interval read at noon is shared half and half between two days", () => {
    // 12:00 to 12:00 next day, 18 h run → 9 h on each side of midnight.
    const days = dailyRunningHours([at("2026-03-01T12:00:00Z", 0), at("2026-03-02T12:00:00Z", 18)], "UTC");
    expect(days).toEqual([
      { day: "2026-03-01", hours: 9 },
      { day: "2026-03-02", hours: 9 },
    ]);
  });

  it("uses the vessel's time zone for the ship's day", () => {
    // Asia/Singapore is UTC+8: 16:00Z on 1 March is midnight on 2 March on board.
    const days = dailyRunningHours(
      [at("2026-03-01T16:00:00Z", 100), at("2026-03-02T16:00:00Z", 124)],
      "Asia/Singapore",
    );
    expect(days).toEqual([{ day: "2026-03-02", hours: 24 }]);
  });

  it("a missed day spreads the hours evenly over the gap", () => {
    // 48 h elapsed, 30 h run → 15 h per day.
    const days = dailyRunningHours([at("2026-03-01T00:00:00Z", 0), at("2026-03-03T00:00:00Z", 30)], "UTC");
    expect(days).toEqual([
      { day: "2026-03-01", hours: 15 },
      { day: "2026-03-02", hours: 15 },
    ]);
  });

  it("a 23-hour ship's day gets at most 23 h (Amsterdam, summer time starts 29 Mar 2026)", () => {
    // Local midnights 28 Mar (27 Mar 23:00Z) to 30 Mar (29 Mar 22:00Z): 47 h elapsed, ran all of it.
    const days = dailyRunningHours(
      [at("2026-03-27T23:00:00Z", 0), at("2026-03-29T22:00:00Z", 47)],
      "Europe/Amsterdam",
    );
    expect(days).toEqual([
      { day: "2026-03-28", hours: 24 },
      { day: "2026-03-29", hours: 23 },
    ]);
  });

  it("gives nothing for a single reading", () => {
    expect(dailyRunningHours([at("2026-03-01T00:00:00Z", 5)], "UTC")).toEqual([]);
  });
});

describe("dailyRunningHours with a window start", () => {
  it("shares out only the days from the window's first ship's day", () => {
    // 2000-01-01 to 2026-03-03: 9,558 days at an even rate; from 2 March only two days are wanted.
    const from = at("2000-01-01T00:00:00Z", 0);
    const to = at("2026-03-03T00:00:00Z", 9_558 * 12);
    const days = dailyRunningHours([from, to], "UTC", new Date("2026-03-01T15:00:00Z"));
    expect(days).toEqual([
      { day: "2026-03-01", hours: 12 },
      { day: "2026-03-02", hours: 12 },
    ]);
  });

  it("gives the same figures inside the window as without it", () => {
    const readings = [at("2026-03-01T12:00:00Z", 0), at("2026-03-02T12:00:00Z", 18), at("2026-03-04T00:00:00Z", 40)];
    const whole = dailyRunningHours(readings, "Europe/Amsterdam");
    const clipped = dailyRunningHours(readings, "Europe/Amsterdam", new Date("2026-03-02T05:00:00Z"));
    expect(clipped).toEqual(whole.filter((d) => d.day >= "2026-03-02"));
  });
});
