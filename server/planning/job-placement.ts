// Where on the stay's clock one job can go, and with whom. A job runs on consecutive working slots
// (it stops at the end of the working day and goes on the next morning, so an overhaul may span
// days), always with the same people, all of them free and within their rest hours for every slot.
// Engine-stop work lies wholly inside the engine-stop slot; work tied to the departure or arrival
// wholly inside its window; every job inside the ship's days its own window allows. Pure.
import { book, isFree, keepsRest, type CrewLedger } from "./crew-ledger";
import type { PlanJob } from "./job-classes";
import { dayRange, slotRange, slotsFor, type StayGrid } from "./stay-grid";

export type PlanStay = {
  arrivesAt: Date;
  departsAt: Date;
  timeZone: string;
  /** The main engine's immobilisation, in the stay; null when it may not stop. */
  immobilisation: { from: Date; to: Date } | null;
};

/** Slot indices [lo, hi) a job must lie in, with the limit that binds named. */
export type JobBounds = {
  lo: number;
  hi: number;
  engineStop: [number, number] | null;
  event: [number, number] | null;
  days: [number, number];
};

const HOUR_MS = 3_600_000;
const intersect = (a: [number, number], b: [number, number]): [number, number] => [Math.max(a[0], b[0]), Math.min(a[1], b[1])];

export function boundsOf(job: PlanJob, grid: StayGrid, stay: PlanStay): JobBounds {
  // Work already out of tolerance has no plannable days left by its window: it is due now, and any
  // day of the stay is the soonest it can be done (never "do it before arrival" for what is overdue).
  const overdue = job.state === "out-of-tolerance";
  const days = overdue ? dayRange(grid, null, null) : dayRange(grid, job.planFrom, job.planUntil);
  let range = days;
  let engineStop: [number, number] | null = null;
  if (job.needsEngineStop) {
    const stop = stay.immobilisation;
    engineStop = stop ? slotRange(grid, stop.from.getTime(), stop.to.getTime()) : [0, 0];
    range = intersect(range, engineStop);
  }
  let event: [number, number] | null = null;
  if (job.tiedTo) {
    const within = job.tiedTo.withinHours * HOUR_MS;
    const departs = stay.departsAt.getTime();
    const arrives = stay.arrivesAt.getTime();
    event =
      job.tiedTo.event === "departure"
        ? slotRange(grid, departs - within, departs)
        : slotRange(grid, arrives, arrives + within);
    range = intersect(range, event);
  }
  return { lo: range[0], hi: range[1], engineStop, event, days };
}

/** How many working slots lie in [lo, hi). */
export function workableIn(grid: StayGrid, [lo, hi]: [number, number]): number {
  return grid.workable.filter((t) => t >= lo && t < hi).length;
}

export type Placement = { slots: number[]; people: number[] };

/** The people of the ledger for each rank, in ledger order. */
export function peopleByRank(ledger: CrewLedger): Map<string, number[]> {
  const byRank = new Map<string, number[]>();
  ledger.persons.forEach((p, i) => byRank.set(p.rank, [...(byRank.get(p.rank) ?? []), i]));
  return byRank;
}

/**
 * The job's people for these slots: for each rank of its team the least-worked people who are free
 * and keep their rest (then in crew order), or null when a rank runs short. Taking the least worked
 * spreads the hours and leaves rest in hand for later work.
 */
export function teamFor(
  job: PlanJob,
  slots: number[],
  ledger: CrewLedger,
  byRank: Map<string, number[]>,
  restRules = true,
): number[] | null {
  const people: number[] = [];
  for (const { rank, count } of job.team) {
    const able = (byRank.get(rank) ?? [])
      .filter((i) => !people.includes(i) && isFree(ledger, i, slots) && (!restRules || keepsRest(ledger, i, slots)))
      .sort((a, b) => ledger.total[a]! - ledger.total[b]! || a - b);
    if (able.length < count) return null;
    people.push(...able.slice(0, count));
  }
  return people;
}

/** The slots a job started on the p-th working slot takes, or null when it would run past the stay. */
export function slotsFrom(grid: StayGrid, p: number, need: number): number[] | null {
  return p + need <= grid.workable.length ? grid.workable.slice(p, p + need) : null;
}

/** The earliest placement of the job inside its bounds, or null. */
export function earliestPlacement(
  job: PlanJob,
  bounds: JobBounds,
  grid: StayGrid,
  ledger: CrewLedger,
  byRank: Map<string, number[]>,
  restRules = true,
): Placement | null {
  const need = slotsFor(job.elapsedHours, grid);
  const { workable } = grid;
  let first = 0;
  while (first < workable.length && workable[first]! < bounds.lo) first++;
  for (let p = first; p + need <= workable.length && workable[p + need - 1]! < bounds.hi; p++) {
    const slots = workable.slice(p, p + need);
    const people = teamFor(job, slots, ledger, byRank, restRules);
    if (people) return { slots, people };
  }
  return null;
}

export function commit(ledger: CrewLedger, placement: Placement): void {
  for (const i of placement.people) book(ledger, i, placement.slots);
}

/** Consecutive runs of slots, as instants: the job's working periods. */
export function segmentsOf(grid: StayGrid, slots: number[]): { from: Date; to: Date }[] {
  const runs: { from: Date; to: Date }[] = [];
  let runStart = slots[0]!;
  slots.forEach((t, i) => {
    const next = slots[i + 1];
    if (next === t + 1) return;
    runs.push({ from: new Date(grid.slots[runStart]!.start), to: new Date(grid.slots[t]!.end) });
    if (next !== undefined) runStart = next;
  });
  return runs;
}
