// The geometry of the daily running-hours chart: pure, so it is tested without a browser.
import { formatDayMonth } from "@/server/format/dates";

export type DailyHours = { day: string; hours: number };
export type Bar = { x: number; y: number; width: number; height: number; day: string; hours: number };
export type Tick = { at: number; label: string };

/** A ship's day has 24 hours: the scale is fixed, so bars of two counters compare at a glance. */
export const MAX_HOURS = 24;
export const HOUR_TICKS = [0, 6, 12, 18, 24];

export type Plot = { left: number; top: number; width: number; height: number };

/** One bar per day, a fifth of its slot left as a gap; hours outside 0–24 are drawn at the edge. */
export function dailyBars(daily: DailyHours[], plot: Plot): Bar[] {
  const slot = plot.width / Math.max(daily.length, 1);
  const width = Math.max(slot * 0.8, 0.5);
  return daily.map(({ day, hours }, i) => {
    const height = (Math.min(Math.max(hours, 0), MAX_HOURS) / MAX_HOURS) * plot.height;
    return {
      x: plot.left + i * slot + (slot - width) / 2,
      y: plot.top + plot.height - height,
      width,
      height,
      day,
      hours,
    };
  });
}

/** The y position of an hour gridline. */
export function hourY(hours: number, plot: Plot): number {
  return plot.top + plot.height - (hours / MAX_HOURS) * plot.height;
}

/** About `count` day labels (MM-DD) spread evenly, the last day always among them. */
export function dayTicks(daily: DailyHours[], plot: Plot, count = 7): Tick[] {
  if (daily.length === 0) return [];
  const slot = plot.width / daily.length;
  const step = Math.max(1, Math.ceil(daily.length / count));
  const ticks: Tick[] = [];
  for (let i = daily.length - 1; i >= 0; i -= step) {
    ticks.unshift({ at: plot.left + i * slot + slot / 2, label: formatDayMonth(daily[i]!.day) });
  }
  return ticks;
}
