// Who on board is busy when, during a port stay: each person's slots taken by port watches (cargo,
// bunkering) and by planned jobs, and the rest-hour limits every assignment must keep.
//
// Rest hours: MLC 2006 Standard A2.3 §5(a) and the STCW Code A-VIII/1 §2 (memory, not checked
// against the published text this session; ../shared/SOURCES.md): at least 10 hours of rest in any
// 24-hour period and at least 77 hours in any 7-day period. A slot is either work (a watch or a job)
// or rest, so the planner keeps work at or under 14 hours in any 24 and 91 hours in any 168. Work
// changes only at slot boundaries, so the windows that start on a slot boundary are the only ones
// that need checking. The rules' other parts (rest in at most two periods, one of at least 6 hours;
// no more than 14 hours between rest periods) are not checked: the chief's working day is one block.
// Only the stay's own hours count: watches kept at sea before the arrival or after the departure are
// not known to Keelson, and a port watch is cut at the stay's ends.
import type { StayGrid } from "./stay-grid";

export type TeamNeed = { rank: string; count: number };
/** A port watch of one person: the n-th person (from 1) of a rank, from–to as instants. */
export type PortWatch = { rank: string; person: number; from: Date; to: Date; label: string };

export type Person = { key: string; rank: string; number: number };

export const REST_RULES = [
  { windowHours: 24, maxWorkHours: 24 - 10 },
  { windowHours: 7 * 24, maxWorkHours: 7 * 24 - 77 },
] as const;

export type CrewLedger = {
  persons: Person[];
  /** Per person (same order): 1 where the slot is worked (a watch or a job). */
  work: Uint8Array[];
  /** Per person: 1 where the slot is a watch. */
  watch: Uint8Array[];
  /** Per person: total slots worked so far, to spread work evenly. */
  total: number[];
  /** The rules in slots: [window, most work]. */
  rules: [number, number][];
};

export function personKey(rank: string, number: number): string {
  return `${rank}#${number}`;
}

export function buildCrewLedger(grid: StayGrid, crew: TeamNeed[], watches: PortWatch[]): CrewLedger {
  const counts = new Map<string, number>();
  for (const { rank, count } of crew) counts.set(rank, (counts.get(rank) ?? 0) + Math.max(0, Math.floor(count)));
  const persons: Person[] = [...counts].flatMap(([rank, count]) =>
    Array.from({ length: count }, (_, i) => ({ key: personKey(rank, i + 1), rank, number: i + 1 })),
  );
  const n = grid.slots.length;
  const work = persons.map(() => new Uint8Array(n));
  const watch = persons.map(() => new Uint8Array(n));
  const index = new Map(persons.map((p, i) => [p.key, i]));
  for (const w of watches) {
    const i = index.get(personKey(w.rank, w.person));
    if (i === undefined) continue; // a watch of someone not in the crew list takes nobody's time
    // A watch takes every slot it touches, even in part.
    grid.slots.forEach((slot, t) => {
      if (slot.end > w.from.getTime() && slot.start < w.to.getTime()) {
        work[i]![t] = 1;
        watch[i]![t] = 1;
      }
    });
  }
  const slotHours = grid.slotMs / 3_600_000;
  return {
    persons,
    work,
    watch,
    total: work.map((w) => w.reduce((a, b) => a + b, 0)),
    rules: REST_RULES.map((r) => [Math.round(r.windowHours / slotHours), Math.floor(r.maxWorkHours / slotHours + 1e-9)]),
  };
}

/** The person is free on every one of the slots (sorted ascending). */
export function isFree(ledger: CrewLedger, person: number, slots: number[]): boolean {
  const work = ledger.work[person]!;
  return slots.every((t) => work[t] === 0);
}

/** Adding the slots (sorted, all free) keeps every rest rule for the person. */
export function keepsRest(ledger: CrewLedger, person: number, slots: number[]): boolean {
  const work = ledger.work[person]!;
  const n = work.length;
  const first = slots[0]!;
  const last = slots[slots.length - 1]!;
  for (const [window, most] of ledger.rules) {
    const lo = Math.max(0, first - window + 1);
    const hi = Math.min(n, last + window);
    let before = 0;
    for (let t = lo; t < hi; t++) before += work[t]!;
    if (before + slots.length <= most) continue; // no window in reach can pass the limit
    const added = new Uint8Array(hi - lo);
    for (const t of slots) added[t - lo] = 1;
    let sum = 0;
    for (let t = lo; t < hi; t++) {
      sum += work[t]! + added[t - lo]!;
      if (t - window >= lo) sum -= work[t - window]! + added[t - window - lo]!;
      // Only windows holding a slot of the job: a watch alone over the limit is the chief's to see.
      if (t >= first && sum > most) return false;
    }
  }
  return true;
}

/** Most hours worked by the person in any window of the given length (for the proposal's summary). */
export function mostWorkIn(ledger: CrewLedger, person: number, windowSlots: number): number {
  const work = ledger.work[person]!;
  let sum = 0;
  let most = 0;
  for (let t = 0; t < work.length; t++) {
    sum += work[t]!;
    if (t >= windowSlots) sum -= work[t - windowSlots]!;
    most = Math.max(most, sum);
  }
  return most;
}

export function book(ledger: CrewLedger, person: number, slots: number[]): void {
  const work = ledger.work[person]!;
  for (const t of slots) work[t] = 1;
  ledger.total[person]! += slots.length;
}

export function copyLedger(ledger: CrewLedger): CrewLedger {
  return {
    ...ledger,
    work: ledger.work.map((w) => w.slice()),
    watch: ledger.watch,
    total: [...ledger.total],
  };
}
