// The port-stay planner on the clock (issue 11; PRODUCT.md point 4): from the stay (its hours, the
// working day, the engine-stop slot, the crew by rank and their port watches) and the vessel's open
// work, propose who does what when, and say why for every job placed and every job left out.
// A pure function: no I/O, no clock; the same input gives the same plan.
//
// Which work and in what order: job-classes.ts. Where a job can go: job-placement.ts. Rest hours:
// crew-ledger.ts.
//
// The heuristic: list scheduling. Jobs are taken one by one and each goes at its earliest feasible
// start with the least-worked people of its ranks. It runs over a few orders — the fill
// order (engine-stop, port-only, sea; most urgent first), then by weight, by value, and by weight
// with short jobs first — and keeps the plan of the highest value (ties: the earliest order, so the
// fill order wins when nothing is gained). Then a seeded local search moves jobs (mostly ones left
// out) to earlier places in the order, keeping a move when the value grows (at most 200 passes, fewer
// on big vessels: 20,000 / jobs). Each pass is at most jobs × starts × people
// checks; tests compare the result with HiGHS's exact optimum (server/planning/optimum.test.ts).
import type { RankNames } from "@/server/routines/rank-names";
import { TZDate } from "@date-fns/tz";
import { invalidInput } from "@/server/http/problem";
import { seededRandom } from "@/server/seeded-random";
import { buildCrewLedger, copyLedger, type CrewLedger, type PortWatch, type TeamNeed } from "./crew-ledger";
import { classify, valueOf, type Classified, type Group, type PlanJob, type Urgency } from "./job-classes";
import {
  boundsOf,
  commit,
  earliestPlacement,
  peopleByRank,
  segmentsOf,
  workableIn,
  type PlanStay,
  type Placement,
} from "./job-placement";
import { buildStayGrid, slotsFor, type StayGrid, type Workday } from "./stay-grid";
import { atSeaWords, leftOutWords, placedWords, type LeftOutReason } from "./stay-plan-words";

export type StayPlanInput = {
  stay: PlanStay & { workday: Workday; crew: TeamNeed[]; watches: PortWatch[] };
  /** Arrival of the next planned port stay; null → the departure plus the look-ahead. */
  nextStayArrivesAt: Date | null;
  /** Days after departure that count as "before the next chance" when no next stay is planned. */
  lookAheadDays?: number;
  jobs: PlanJob[];
  slotMinutes?: number;
  /** The company's own names for its ranks, for the reasons' words. */
  rankNames?: RankNames;
};

export type PlacedJob = {
  workOrderId: string;
  number: string;
  title: string;
  group: Group;
  urgency: Urgency;
  value: number;
  start: Date;
  end: Date;
  /** The working periods, split where the working day ends. */
  segments: { from: Date; to: Date }[];
  /** "rank#n" of each person on the job. */
  people: string[];
  elapsedHours: number;
  manHours: number;
  needsEngineStop: boolean;
  reason: string;
};
export type LeftOutJob = {
  workOrderId: string;
  number: string;
  title: string;
  group: Group;
  urgency: Urgency;
  reason: LeftOutReason;
  message: string;
};
export type StayPlan = {
  horizon: Date;
  /** Σ value of the placed jobs; `possible` is the value if every considered job were placed. */
  value: number;
  possible: number;
  placed: PlacedJob[];
  leftOut: LeftOutJob[];
  /** Sea work falling due that the stay leaves for the voyage. */
  atSea: { workOrderId: string; number: string; title: string; message: string }[];
  people: { key: string; rank: string; number: number; jobHours: number; watchHours: number }[];
  /** Which order of the heuristic gave the plan (see the top of this file). */
  order: "fill" | "weight" | "value" | "weight-short-first" | "searched";
};

export const DEFAULT_LOOK_AHEAD_DAYS = 30;
const DAY_MS = 86_400_000;
/** The local search: at most this many passes, and at most MOVE_BUDGET / jobs of them. */
const MAX_MOVES = 2_000;
const MOVE_BUDGET = 100_000;
/** Steps without a gain before the search starts again from a shaken best order. */
const RESTART_AFTER = 150;

const ORDERS: { name: StayPlan["order"]; sort: ((a: Classified, b: Classified) => number) | null }[] = [
  { name: "fill", sort: null },
  { name: "weight", sort: (a, b) => b.weight - a.weight },
  { name: "value", sort: (a, b) => valueOf(b) - valueOf(a) },
  { name: "weight-short-first", sort: (a, b) => b.weight - a.weight || a.manHours - b.manHours },
];

type Pass = { placements: Map<Classified, Placement>; ledger: CrewLedger; value: number };

function runPass(order: Classified[], grid: StayGrid, stay: PlanStay, base: CrewLedger): Pass {
  const ledger = copyLedger(base);
  const byRank = peopleByRank(ledger);
  const placements = new Map<Classified, Placement>();
  let value = 0;
  for (const c of order) {
    const placement = earliestPlacement(c.job, boundsOf(c.job, grid, stay), grid, ledger, byRank);
    if (!placement) continue;
    commit(ledger, placement);
    placements.set(c, placement);
    value += valueOf(c);
  }
  return { placements, ledger, value };
}

/** The most specific reason a considered job is not in the plan. */
function whyLeftOut(c: Classified, grid: StayGrid, stay: PlanStay, pass: Pass): LeftOutReason {
  const { job } = c;
  const byRank = peopleByRank(pass.ledger);
  if (job.team.some(({ rank, count }) => (byRank.get(rank)?.length ?? 0) < count)) return "short-of-rank";
  const bounds = boundsOf(job, grid, stay);
  const need = slotsFor(job.elapsedHours, grid);
  if (job.needsEngineStop && !stay.immobilisation) return "engine-stop-not-allowed";
  if (grid.workable.length === 0) return "longer-than-stay";
  if (bounds.days[0] >= bounds.days[1] || workableIn(grid, bounds.days) === 0) {
    const lastDay = grid.slots.at(-1)?.day ?? "";
    return job.planFrom !== null && job.planFrom > lastDay ? "window-not-open" : "past-grace";
  }
  if (need > grid.workable.length) return "longer-than-stay";
  if (bounds.engineStop && need > workableIn(grid, bounds.engineStop)) return "longer-than-engine-stop";
  if (bounds.event && need > workableIn(grid, bounds.event)) return "longer-than-event-window";
  if (need > workableIn(grid, [bounds.lo, bounds.hi])) return "longer-than-window";
  // The crew with only its port watches: can the job go at all, and with or without rest rules?
  const watchesOnly = { ...pass.ledger, work: pass.ledger.watch.map((w) => w.slice()), total: pass.ledger.total.map(() => 0) };
  if (!earliestPlacement(job, bounds, grid, watchesOnly, byRank)) {
    return earliestPlacement(job, bounds, grid, watchesOnly, byRank, false) ? "rest-hours" : "watches";
  }
  if (earliestPlacement(job, bounds, grid, pass.ledger, byRank, false)) return "rest-hours";
  return "crew-taken";
}

type Found = Pass & { name: StayPlan["order"]; order: Classified[] };

/** The fixed orders, then the seeded local search: the pass of the highest value. */
function bestPass(considered: Classified[], grid: StayGrid, stay: PlanStay, base: CrewLedger, possible: number): Found {
  const rank = new Map(considered.map((c, i) => [c, i]));
  let best: Found | null = null;
  for (const { name, sort } of ORDERS) {
    const order = sort ? [...considered].sort((a, b) => sort(a, b) || rank.get(a)! - rank.get(b)!) : considered;
    const pass = runPass(order, grid, stay, base);
    if (!best || pass.value > best.value + 1e-9) best = { ...pass, name, order };
  }
  // A job moved to an earlier place in the order can unlock a better plan (one placed before it
  // took the only start it had). A step moves one job, mostly one left out, or two at once; it is
  // kept when the value does not fall (so the search crosses plateaus), and the best plan seen is
  // the answer. Seeded, so the same input gives the same plan; bounded so a big vessel stays fast.
  const random = seededRandom(considered.length);
  const moves = Math.min(MAX_MOVES, Math.floor(MOVE_BUDGET / Math.max(1, considered.length)));
  let current = best!;
  let sinceGain = 0;
  for (let m = 0; m < moves && best!.value < possible - 1e-9; m++) {
    // Stuck on a plateau: start again from the best order with a few jobs pulled to the front.
    if (++sinceGain > RESTART_AFTER) {
      const pulled = best!.order.filter(() => random() < 0.2);
      current = { ...best!, order: [...pulled, ...best!.order.filter((c) => !pulled.includes(c))] };
      sinceGain = 0;
    }
    let order = current.order;
    for (let k = random() < 0.3 ? 2 : 1; k > 0; k--) {
      const left = order.filter((c) => !current.placements.has(c));
      const pool = left.length > 0 && random() < 0.7 ? left : order;
      const c = pool[Math.floor(random() * pool.length)]!;
      const from = order.indexOf(c);
      const to = Math.floor(random() * from);
      if (from > 0) order = [...order.slice(0, to), c, ...order.slice(to, from), ...order.slice(from + 1)];
    }
    const pass = runPass(order, grid, stay, base);
    if (pass.value < current.value - 1e-9) continue;
    current = { ...pass, name: "searched", order };
    if (pass.value > best!.value + 1e-9) {
      best = current;
      sinceGain = 0;
    }
  }
  return best!;
}

export function horizonOf(input: StayPlanInput): Date {
  const lookAhead = input.lookAheadDays ?? DEFAULT_LOOK_AHEAD_DAYS;
  return input.nextStayArrivesAt ?? new Date(input.stay.departsAt.getTime() + lookAhead * DAY_MS);
}

export function planPortStay(input: StayPlanInput): StayPlan {
  const { stay } = input;
  const grid = buildStayGrid(stay.arrivesAt, stay.departsAt, stay.timeZone, stay.workday, input.slotMinutes);
  if (stay.immobilisation && !(stay.immobilisation.from < stay.immobilisation.to)) {
    throw invalidInput([{ field: "stay.immobilisation", message: "The engine stop ends after it starts." }]);
  }
  const horizon = horizonOf(input);
  const { considered, atSea } = classify(input.jobs, { departsAt: stay.departsAt, horizon });
  const base = buildCrewLedger(grid, stay.crew, stay.watches);
  const possible = considered.reduce((sum, c) => sum + valueOf(c), 0);

  const pass = bestPass(considered, grid, stay, base, possible);
  const year = new TZDate(stay.arrivesAt, stay.timeZone).getFullYear();
  const ctx = { timeZone: stay.timeZone, year, horizon, stay, nextStay: input.nextStayArrivesAt, rankNames: input.rankNames };

  const placed: PlacedJob[] = [];
  const leftOut: LeftOutJob[] = [];
  for (const c of considered) {
    const placement = pass.placements.get(c);
    const base = { workOrderId: c.job.id, number: c.job.number, title: c.job.title, group: c.group, urgency: c.urgency };
    if (!placement) {
      const reason = whyLeftOut(c, grid, stay, pass);
      leftOut.push({ ...base, reason, message: leftOutWords(c, reason, ctx) });
      continue;
    }
    const segments = segmentsOf(grid, placement.slots);
    const people = placement.people.map((i) => pass.ledger.persons[i]!.key);
    placed.push({
      ...base,
      value: valueOf(c),
      start: segments[0]!.from,
      end: segments[segments.length - 1]!.to,
      segments,
      people,
      elapsedHours: c.job.elapsedHours,
      manHours: c.manHours,
      needsEngineStop: c.job.needsEngineStop,
      reason: placedWords(c, segments, people, ctx),
    });
  }
  placed.sort((a, b) => a.start.getTime() - b.start.getTime() || (a.number < b.number ? -1 : 1));
  const slotHours = grid.slotMs / 3_600_000;
  return {
    horizon,
    value: pass.value,
    possible,
    placed,
    leftOut,
    atSea: atSea.map((job) => ({ workOrderId: job.id, number: job.number, title: job.title, message: atSeaWords(job, ctx) })),
    people: pass.ledger.persons.map((p, i) => {
      const watchSlots = pass.ledger.watch[i]!.reduce((a, b) => a + b, 0);
      return { ...p, jobHours: (pass.ledger.total[i]! - watchSlots) * slotHours, watchHours: watchSlots * slotHours };
    }),
    order: pass.name,
  };
}
