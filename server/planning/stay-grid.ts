// The clock of a port stay as the planner sees it: the stay cut into equal slots (30 minutes by
// default), each with its ship's day and whether it lies in the working day. Jobs are placed on
// these slots; a job's own limits (the engine-stop slot, an event's window, the days its window
// allows) become a range of slot indices. Pure.
import { TZDate } from "@date-fns/tz";
import { invalidInput } from "@/server/http/problem";

export type Workday = {
  /** Minutes after the ship's midnight when maintenance work starts, e.g. 480 for 08:00. */
  from: number;
  /** Minutes after the ship's midnight when it stops (exclusive), at most 1440. */
  to: number;
};

export type Slot = {
  start: number;
  end: number;
  /** "YYYY-MM-DD" in the vessel's zone. */
  day: string;
  /** The whole slot lies in the working day on the ship's clock. */
  workable: boolean;
};

export type StayGrid = {
  slotMs: number;
  slots: Slot[];
  /** Indices of the workable slots, in order: a job runs on consecutive entries of this list. */
  workable: number[];
};

export const DEFAULT_SLOT_MINUTES = 30;
/** A stay is at most 31 days (the port-stay contract) plus the arrival's part day. */
export const MAX_GRID_DAYS = 32;

const pad = (n: number) => String(n).padStart(2, "0");

export function buildStayGrid(
  arrivesAt: Date,
  departsAt: Date,
  timeZone: string,
  workday: Workday,
  slotMinutes = DEFAULT_SLOT_MINUTES,
): StayGrid {
  if (!(workday.from >= 0 && workday.from < workday.to && workday.to <= 1440)) {
    throw invalidInput([{ field: "stay.workday", message: "The working day starts before it ends, within one day." }]);
  }
  const slotMs = slotMinutes * 60_000;
  const first = Math.ceil(arrivesAt.getTime() / slotMs) * slotMs;
  const span = Math.floor((departsAt.getTime() - first) / slotMs);
  if (Number.isNaN(span)) throw invalidInput([{ field: "stay.departsAt", message: "The stay needs an arrival and a departure." }]);
  // A stay longer than the contract allows can only be old or bad data: it is planned over its
  // first MAX_GRID_DAYS days, never walked to its end.
  // A stay shorter than one slot has no working time: every job is left out, saying so.
  const count = Math.max(0, Math.min(span, (MAX_GRID_DAYS * 1440) / slotMinutes));
  const slots: Slot[] = [];
  const workable: number[] = [];
  for (let i = 0; i < count; i++) {
    const start = first + i * slotMs;
    const local = new TZDate(start, timeZone);
    const minute = local.getHours() * 60 + local.getMinutes();
    const fits = minute >= workday.from && minute + slotMinutes <= workday.to;
    slots.push({
      start,
      end: start + slotMs,
      day: `${local.getFullYear()}-${pad(local.getMonth() + 1)}-${pad(local.getDate())}`,
      workable: fits,
    });
    if (fits) workable.push(i);
  }
  return { slotMs, slots, workable };
}

/** Slot indices [lo, hi) whose slots lie wholly inside [from, to) (instants in ms; null = open). */
export function slotRange(grid: StayGrid, from: number | null, to: number | null): [number, number] {
  const { slots } = grid;
  let lo = 0;
  let hi = slots.length;
  if (from !== null) while (lo < hi && slots[lo]!.start < from) lo++;
  if (to !== null) while (hi > lo && slots[hi - 1]!.end > to) hi--;
  return [lo, hi];
}

/** Slot indices [lo, hi) whose ship's day lies in [firstDay, lastDay] (null = open). */
export function dayRange(grid: StayGrid, firstDay: string | null, lastDay: string | null): [number, number] {
  const { slots } = grid;
  let lo = 0;
  let hi = slots.length;
  if (firstDay !== null) while (lo < hi && slots[lo]!.day < firstDay) lo++;
  if (lastDay !== null) while (hi > lo && slots[hi - 1]!.day > lastDay) hi--;
  return [lo, hi];
}

/** Slots needed for an elapsed time: rounded up to whole slots, at least one. */
export function slotsFor(elapsedHours: number, grid: StayGrid): number {
  const minutes = Number.isFinite(elapsedHours) && elapsedHours > 0 ? elapsedHours * 60 : 0;
  return Math.max(1, Math.ceil(minutes / (grid.slotMs / 60_000) - 1e-9));
}
