// Worked by hand: a plot 100 wide and 48 high at (10, 4); 24 h fills it, 12 h half of it.
import { describe, expect, it } from "vitest";
import { dailyBars, dayTicks, hourY } from "./daily-hours-scale";

const plot = { left: 10, top: 4, width: 100, height: 48 };
const days = (hours: number[]) => hours.map((h, i) => ({ day: `2026-11-${String(i + 1).padStart(2, "0")}`, hours: h }));

describe("dailyBars", () => {
  it("gives each day a slot of equal width and scales hours to a 24 h day", () => {
    const [a, b] = dailyBars(days([24, 12]), plot);
    // Two slots of 50; each bar 40 wide, centred: 5 of gap on either side.
    expect(a).toMatchObject({ x: 15, width: 40, y: 4, height: 48, day: "2026-11-01", hours: 24 });
    expect(b).toMatchObject({ x: 65, width: 40, y: 28, height: 24, hours: 12 });
  });

  it("draws a day outside 0–24 h at the edge of the scale, keeping its true hours for the title", () => {
    const [over, under] = dailyBars(days([25.5, -1]), plot);
    expect(over).toMatchObject({ height: 48, hours: 25.5 });
    expect(under).toMatchObject({ height: 0, y: 52 });
  });
});

describe("hourY", () => {
  it("puts 0 h on the baseline and 24 h on the top", () => {
    expect(hourY(0, plot)).toBe(52);
    expect(hourY(24, plot)).toBe(4);
    expect(hourY(6, plot)).toBe(40);
  });
});

describe("dayTicks", () => {
  it("labels about seven days of ninety, counted back from the last", () => {
    const ticks = dayTicks(days(Array.from({ length: 30 }, () => 8)), plot);
    // 30 days in 7 labels: every 5th day, from the 30th back to the 5th.
    expect(ticks.map((t) => t.label)).toEqual(["5 Nov", "10 Nov", "15 Nov", "20 Nov", "25 Nov", "30 Nov"]);
    expect(ticks.at(-1)!.at).toBeCloseTo(10 + 29 * (100 / 30) + 100 / 60);
  });

  it("labels every day of a short history, and none of an empty one", () => {
    expect(dayTicks(days([1, 2, 3]), plot).map((t) => t.label)).toEqual(["1 Nov", "2 Nov", "3 Nov"]);
    expect(dayTicks([], plot)).toEqual([]);
  });
});
