// The geometry of the Fleet board's trend chart: pure, so it is tested without a browser.
// Days sit in slots of equal width; the counts are stacked as steps across each day's slot (the
// figure holds all day, from one snapshot to the next), the on-time rate is a line through the
// slots' centres.
import { formatDayMonth } from "@/server/format/dates";

export type Plot = { left: number; top: number; width: number; height: number };
export type TrendDay = {
  day: string;
  outOfTolerance: number | null;
  late: number | null;
  /** 0–1. */
  onTimeRate: number | null;
};
export type Tick = { at: number; label: string };
export type DaySlot = { x: number; width: number; day: TrendDay };

/** Gridlines cut both scales into quarters, so the count's and the rate's ticks share them. */
export const QUARTERS = [0, 0.25, 0.5, 0.75, 1];

// Steps whose quarters stay whole numbers of work orders and read easily: 4 × 30 = 120.
const STEPS = [1, 2, 3, 4, 5, 6, 8];

/** The board's parallel arrays (`FleetBoard.days` and `.fleet`) as one row per day. */
export function trendDays(days: string[], fleet: Record<keyof Omit<TrendDay, "day">, (number | null)[]>): TrendDay[] {
  return days.map((day, i) => ({
    day,
    outOfTolerance: fleet.outOfTolerance[i] ?? null,
    late: fleet.late[i] ?? null,
    onTimeRate: fleet.onTimeRate[i] ?? null,
  }));
}

/** The count scale's top: four equal whole steps at least as high as the tallest day's stack. */
export function countTop(days: TrendDay[]): number {
  const highest = Math.max(0, ...days.map((d) => (d.outOfTolerance ?? 0) + (d.late ?? 0)));
  for (let magnitude = 1; ; magnitude *= 10) {
    const step = STEPS.map((s) => s * magnitude).find((s) => 4 * s >= highest);
    if (step !== undefined) return 4 * step;
  }
}

/** The y of a share (0–1) of the plot's height, 0 on the baseline. */
export function shareY(share: number, plot: Plot): number {
  return plot.top + plot.height - Math.min(Math.max(share, 0), 1) * plot.height;
}

export function daySlots(days: TrendDay[], plot: Plot): DaySlot[] {
  const width = plot.width / Math.max(days.length, 1);
  return days.map((day, i) => ({ x: plot.left + i * width, width, day }));
}

/** Runs of consecutive days that have a snapshot: an area breaks where the worker took none. */
function runs(slots: DaySlot[]): DaySlot[][] {
  const out: DaySlot[][] = [];
  let current: DaySlot[] = [];
  for (const s of slots) {
    if (s.day.outOfTolerance === null) {
      if (current.length > 0) out.push(current);
      current = [];
    } else current.push(s);
  }
  if (current.length > 0) out.push(current);
  return out;
}

const point = (x: number, y: number) => `${round(x)} ${round(y)}`;
const round = (n: number) => Math.round(n * 100) / 100;

/** One closed path per run: the upper edge stepped forward, then the lower edge stepped back. */
function band(run: DaySlot[], lower: (d: TrendDay) => number, upper: (d: TrendDay) => number, top: number, plot: Plot) {
  const y = (n: number) => shareY(n / top, plot);
  const forward = run.flatMap((s) => [point(s.x, y(upper(s.day))), point(s.x + s.width, y(upper(s.day)))]);
  const backward = [...run]
    .reverse()
    .flatMap((s) => [point(s.x + s.width, y(lower(s.day))), point(s.x, y(lower(s.day)))]);
  return `M ${[...forward, ...backward].join(" L ")} Z`;
}

/** The stacked areas: out of tolerance on the baseline, late on top of it. */
export function stackedAreas(days: TrendDay[], top: number, plot: Plot): { outOfTolerance: string[]; late: string[] } {
  const all = runs(daySlots(days, plot));
  const oot = (d: TrendDay) => d.outOfTolerance ?? 0;
  return {
    outOfTolerance: all.map((run) => band(run, () => 0, oot, top, plot)),
    late: all.map((run) => band(run, oot, (d) => oot(d) + (d.late ?? 0), top, plot)),
  };
}

/** The on-time line through the centres of the days that have a rate, across days without. */
export function onTimePath(days: TrendDay[], plot: Plot): string {
  const points = daySlots(days, plot).flatMap((s) =>
    s.day.onTimeRate === null ? [] : [point(s.x + s.width / 2, shareY(s.day.onTimeRate, plot))],
  );
  return points.length === 0 ? "" : `M ${points.join(" L ")}`;
}

/** Day labels (MM-DD) at least `gap` apart, counted back from the last day, which always has one. */
export function trendTicks(days: TrendDay[], plot: Plot, gap = 72): Tick[] {
  const slots = daySlots(days, plot);
  if (slots.length === 0) return [];
  const every = Math.max(1, Math.ceil(gap / slots[0]!.width));
  return slots
    .filter((_, i) => (slots.length - 1 - i) % every === 0)
    .map((s) => ({ at: s.x + s.width / 2, label: formatDayMonth(s.day.day) }));
}
