// The port-stay planner (PRODUCT.md point 4): from the stay's days, the crew's man-hours per rank
// and day, and the vessel's open work orders, propose a work package and say why for every choice.
// A pure function: no I/O, no clock; the same input gives the same proposal.
//
// Horizon: the arrival of the next planned port stay, or, when none is planned, the departure plus
// the look-ahead (default 30 days of 24 h).
//
// Which work orders take part, in three tiers, strictly in this order:
//   1. would-go-out-of-tolerance: already out of tolerance, or out of tolerance before the horizon;
//   2. engine-stop: needs the engine stopped and falls due before the horizon (not already tier 1);
//   3. urgency: falls due before the horizon, or its window is open, or it is late.
// Anything else is not a candidate at all (neither proposed nor left out). A deferred work order
// takes part by its dates like any other. "Before" is strict: due exactly at the horizon is not before.
// Inside a tier: state (out-of-tolerance, late, window-open, deferred, scheduled), critical first,
// class-related first, earliest date (tier 1 its out-of-tolerance instant, else its due instant;
// none last), then work-order number, then id.
//
// Fitting is greedy and never splits a job across days: each job goes on the earliest stay day
// within its [planFrom, planUntil] on which its rank still has at least its man-hours. A job of
// 0 man-hours fits on any such day, but its rank must still be on board. An engine-stop job also
// needs the engine allowed to stop and immobilisation hours left of at least its man-hours:
// Keelson's own assumption, conservative — a job is taken as one person's work, so it keeps the
// engine stopped for as long as its man-hours, and engine-stop jobs are not assumed to overlap.
// The immobilisation allowance is one budget for the whole stay.
//
// A job that does not fit is left out with the most specific reason, checked in this order:
// no-rank-on-board (rank not in the crew, or 0 h a day), larger-than-any-day, engine-stop-not-allowed
// (engine may not stop, or 0 h allowed), exceeds-immobilisation, window-not-open (its window opens
// after the stay's last day, or holds none of the stay's days), past-grace (its last plannable day is
// before the stay), no-capacity-for-rank.
//
// Hours are counted in tenths, as Keelson stores them: a rank's hours a day are rounded down to the
// tenth and a job's man-hours up, so that float sums never let a day run over. Several crew entries
// of one rank add up. Items and left-out work come in the order they were considered (priority).
// The immobilisation allowed is 0 when the engine may not stop. A stay without days, or with days
// not in order, is refused as invalid input (stay.days).
import type { CrewCapacity } from "@/db/schema/port-stays";
import { OPEN_STATES_BY_URGENCY, type OpenState } from "@/db/schema/work-order-states";
import { invalidInput } from "@/server/http/problem";
import { leftOutWords, placedWords, whyWords, type LeftOutFacts, type WordsContext } from "./proposal-words";

export type PlanningState = OpenState;
export type Candidate = {
  id: string;
  number: string;
  title: string;
  state: PlanningState;
  /** Who does it, e.g. "second-engineer" (server/routines/contract.ts RANKS). */
  rank: string;
  estimatedManHours: number;
  needsEngineStop: boolean;
  critical: boolean;
  classRelated: boolean;
  /** Effective due instant (calendar due or projected hours date). */
  dueAt: Date | null;
  /** When it goes past its grace (null = unknown / never). */
  outOfToleranceAt: Date | null;
  /** First ship's day ("YYYY-MM-DD") it may be planned on; null = no lower bound. */
  planFrom: string | null;
  /** Last ship's day it may be planned on; null = no upper bound. */
  planUntil: string | null;
};
export type ProposalInput = {
  stay: {
    /** The stay's ship's days in order ("YYYY-MM-DD", vessel zone), at least one. */
    days: string[];
    departsAt: Date;
    engineMayStop: boolean;
    immobilisationHours: number;
  };
  /** Arrival of the next planned port stay after this one; null → horizon = departsAt + lookAheadDays. */
  nextStayArrivesAt: Date | null;
  /** Default 30. */
  lookAheadDays?: number;
  /** Man-hours each rank has on EACH day of the stay. */
  crew: CrewCapacity[];
  /** Open work orders of the vessel (not done). */
  candidates: Candidate[];
  /** The vessel's IANA time zone, to name instants (due, out of tolerance) by ship's day; default UTC. */
  timeZone?: string;
};
export type Tier = "would-go-out-of-tolerance" | "engine-stop" | "urgency";
export type ProposedItem = {
  workOrderId: string;
  number: string;
  date: string;
  rank: string;
  manHours: number;
  needsEngineStop: boolean;
  tier: Tier;
  /** One sentence, for people. */
  reason: string;
};
export type LeftOutReason =
  | "no-rank-on-board"
  | "no-capacity-for-rank"
  | "larger-than-any-day"
  | "engine-stop-not-allowed"
  | "exceeds-immobilisation"
  | "window-not-open"
  | "past-grace";
export type LeftOutItem = { workOrderId: string; number: string; tier: Tier; reason: LeftOutReason; message: string };
export type DayUsage = { date: string; rank: string; available: number; used: number };
export type Proposal = {
  horizon: Date;
  items: ProposedItem[];
  leftOut: LeftOutItem[];
  usage: DayUsage[];
  immobilisation: { allowed: number; used: number };
};

export const DEFAULT_LOOK_AHEAD_DAYS = 30;
const DAY_MS = 86_400_000;
const TIERS: readonly Tier[] = ["would-go-out-of-tolerance", "engine-stop", "urgency"];
const SHIP_DAY = /^\d{4}-\d{2}-\d{2}$/;

const capacityTenths = (hours: number) => (Number.isFinite(hours) && hours > 0 ? Math.floor(hours * 10 + 1e-6) : 0);
const needTenths = (hours: number) => (Number.isFinite(hours) && hours > 0 ? Math.ceil(hours * 10 - 1e-6) : 0);

export function tierOf(c: Candidate, horizon: Date): Tier | null {
  const before = (d: Date | null) => d !== null && d.getTime() < horizon.getTime();
  if (c.state === "out-of-tolerance" || before(c.outOfToleranceAt)) return "would-go-out-of-tolerance";
  if (c.needsEngineStop && before(c.dueAt)) return "engine-stop";
  if (before(c.dueAt) || c.state === "window-open" || c.state === "late") return "urgency";
  return null;
}

type Ranked = { c: Candidate; tier: Tier };

function sortKey(r: Ranked): number {
  const date = r.tier === "would-go-out-of-tolerance" ? (r.c.outOfToleranceAt ?? r.c.dueAt) : r.c.dueAt;
  return date?.getTime() ?? Number.POSITIVE_INFINITY;
}

function byPriority(a: Ranked, b: Ranked): number {
  const text = (x: string, y: string) => (x < y ? -1 : x > y ? 1 : 0);
  return (
    TIERS.indexOf(a.tier) - TIERS.indexOf(b.tier) ||
    OPEN_STATES_BY_URGENCY.indexOf(a.c.state) - OPEN_STATES_BY_URGENCY.indexOf(b.c.state) ||
    Number(b.c.critical) - Number(a.c.critical) ||
    Number(b.c.classRelated) - Number(a.c.classRelated) ||
    (sortKey(a) === sortKey(b) ? 0 : sortKey(a) < sortKey(b) ? -1 : 1) ||
    text(a.c.number, b.c.number) ||
    text(a.c.id, b.c.id)
  );
}

function checkStayDays(days: string[]): void {
  if (days.length === 0) throw invalidInput([{ field: "stay.days", message: "A port stay has at least one day." }]);
  days.forEach((day, i) => {
    if (!SHIP_DAY.test(day)) {
      throw invalidInput([{ field: `stay.days.${i}`, message: `“${day}” is not a ship's day (YYYY-MM-DD).` }]);
    }
    const previous = days[i - 1];
    if (previous !== undefined && day <= previous) {
      throw invalidInput([
        { field: `stay.days.${i}`, message: `The stay's days must be in order: ${day} follows ${previous}.` },
      ]);
    }
  });
}

type Fit = {
  c: Candidate;
  need: number;
  rankPerDay: number;
  immobilisationLeft: number;
  allowedImmobilisation: number;
  open: { day: string }[];
  fits: boolean;
  firstDay: string;
  lastDay: string;
};

/** The most specific reason a job cannot go in the package, or null when it fits. */
function whyNot(f: Fit): LeftOutReason | null {
  if (f.rankPerDay === 0) return "no-rank-on-board";
  if (f.need > f.rankPerDay) return "larger-than-any-day";
  if (f.c.needsEngineStop && f.allowedImmobilisation === 0) return "engine-stop-not-allowed";
  if (f.c.needsEngineStop && f.need > f.immobilisationLeft) return "exceeds-immobilisation";
  if (f.open.length === 0) {
    if (f.c.planFrom !== null && f.c.planFrom > f.lastDay) return "window-not-open";
    if (f.c.planUntil !== null && f.c.planUntil < f.firstDay) return "past-grace";
    return "window-not-open"; // a window between two stay days, or one that ends before it opens
  }
  return f.fits ? null : "no-capacity-for-rank";
}

export function horizonOf(input: ProposalInput): Date {
  const lookAhead = input.lookAheadDays ?? DEFAULT_LOOK_AHEAD_DAYS;
  return input.nextStayArrivesAt ?? new Date(input.stay.departsAt.getTime() + lookAhead * DAY_MS);
}

export function proposeWorkPackage(input: ProposalInput): Proposal {
  const { stay } = input;
  checkStayDays(stay.days);
  const days = stay.days;
  const firstDay = days[0]!;
  const lastDay = days[days.length - 1]!;
  const horizon = horizonOf(input);
  const ctx: WordsContext = {
    year: Number(firstDay.slice(0, 4)),
    timeZone: input.timeZone ?? "UTC",
    horizon,
    lookAheadDays: input.nextStayArrivesAt ? null : (input.lookAheadDays ?? DEFAULT_LOOK_AHEAD_DAYS),
  };

  const perDay = new Map<string, number>();
  for (const { rank, manHoursPerDay } of input.crew) {
    perDay.set(rank, (perDay.get(rank) ?? 0) + capacityTenths(manHoursPerDay));
  }
  const left = new Map([...perDay].map(([rank, tenths]) => [rank, days.map(() => tenths)]));
  const allowedImmobilisation = stay.engineMayStop ? capacityTenths(stay.immobilisationHours) : 0;
  let immobilisationLeft = allowedImmobilisation;

  const ranked = input.candidates
    .map((c) => ({ c, tier: tierOf(c, horizon) }))
    .filter((r): r is Ranked => r.tier !== null)
    .sort(byPriority);

  const items: ProposedItem[] = [];
  const leftOut: LeftOutItem[] = [];
  for (const { c, tier } of ranked) {
    const need = needTenths(c.estimatedManHours);
    const rankDays = left.get(c.rank);
    const rankPerDay = perDay.get(c.rank) ?? 0;
    const open = days
      .map((day, i) => ({ day, i }))
      .filter(({ day }) => (c.planFrom === null || day >= c.planFrom) && (c.planUntil === null || day <= c.planUntil));
    const free = open.find(({ i }) => (rankDays?.[i] ?? 0) >= need);

    const why = whyWords(c, tier, ctx);
    const reason = whyNot({
      c,
      need,
      rankPerDay,
      immobilisationLeft,
      allowedImmobilisation,
      open,
      fits: free !== undefined,
      firstDay,
      lastDay,
    });
    if (reason !== null) {
      const facts: LeftOutFacts = {
        rankOnBoard: perDay.has(c.rank),
        perDay: rankPerDay / 10,
        mostLeft: Math.max(0, ...open.map(({ i }) => rankDays?.[i] ?? 0)) / 10,
        immobilisationLeft: immobilisationLeft / 10,
        immobilisationAllowed: allowedImmobilisation / 10,
        engineMayStop: stay.engineMayStop,
        firstDay,
        lastDay,
      };
      leftOut.push({
        workOrderId: c.id,
        number: c.number,
        tier,
        reason,
        message: leftOutWords(why, c, reason, facts, ctx),
      });
      continue;
    }

    // whyNot gives null only with a free day, and only for a rank in the crew.
    rankDays![free!.i]! -= need;
    if (c.needsEngineStop) immobilisationLeft -= need;
    const stop = c.needsEngineStop
      ? { used: (allowedImmobilisation - immobilisationLeft) / 10, allowed: allowedImmobilisation / 10 }
      : null;
    items.push({
      workOrderId: c.id,
      number: c.number,
      date: free!.day,
      rank: c.rank,
      manHours: c.estimatedManHours,
      needsEngineStop: c.needsEngineStop,
      tier,
      reason: placedWords(why, c, free!.day, stop, ctx),
    });
  }

  const usage: DayUsage[] = days.flatMap((date, i) =>
    [...perDay].map(([rank, available]) => ({
      date,
      rank,
      available: available / 10,
      used: (available - left.get(rank)![i]!) / 10,
    })),
  );
  return {
    horizon,
    items,
    leftOut,
    usage,
    immobilisation: { allowed: allowedImmobilisation / 10, used: (allowedImmobilisation - immobilisationLeft) / 10 },
  };
}
