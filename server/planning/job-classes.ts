// Which open work a port stay's proposal considers, in what order, and what placing it is worth.
//
// Groups, filled in this order (issue 11): engine-stop work (it can only be done while the main
// engine is immobilised), other port-only work (needs the ship in port, or is tied to an event of
// the stay such as the departure), then sea work that cannot wait. Work that can be done at sea is
// proposed only when it is out of tolerance already or goes out of tolerance before the end of the
// first day at sea (departure + 24 h: the departure day's manoeuvring and sea watches leave no time
// for it, Keelson's assumption); otherwise it is left at sea and the proposal says so.
//
// Urgency, inside a group: out of tolerance now; tied to this stay's event (a statutory test before
// departure); goes out of tolerance before the next chance to do it (port-only work: the next port
// stay's arrival, or the look-ahead; sea work: the first day at sea); falls due before the next
// chance, or its window is open, or it is late. Then critical first, class-related first, the
// earliest date, the work-order number, the id.
//
// The proposal's value is the priority-weighted work placed: Σ weight × man-hours over placed jobs
// (a job of under half an hour counts as half an hour, so short tests are worth placing). The weight
// follows the fill order: the group first — engine-stop work 100, other port-only work 10, sea work
// 1, because port time and above all the engine stop are what the stay is for — times the urgency —
// 8 out of tolerance or tied to the stay's event, 4 going out of tolerance before the next chance,
// 1 falling due — doubled for critical or class-related work. Keelson's own definition, used by the
// heuristic and by the exact solver alike.
import { OPEN_STATES_BY_URGENCY, type OpenState } from "@/db/schema/work-order-states";
import type { TeamNeed } from "./crew-ledger";

export type PortEvent = "departure" | "arrival";
export type PlanJob = {
  id: string;
  number: string;
  title: string;
  state: OpenState;
  team: TeamNeed[];
  elapsedHours: number;
  needsEngineStop: boolean;
  /** Needs the ship in port: shore crane, service engineer, surveyor, parts delivered in port. */
  needsPort: boolean;
  critical: boolean;
  classRelated: boolean;
  dueAt: Date | null;
  outOfToleranceAt: Date | null;
  /** First ship's day it may be planned on; null = no lower bound. */
  planFrom: string | null;
  /** Last ship's day it may be planned on; null = no upper bound. */
  planUntil: string | null;
  /** Falls due at an event of every port stay: within `withinHours` before departure / after arrival. */
  tiedTo: { event: PortEvent; withinHours: number } | null;
};

export type Group = "engine-stop" | "port-only" | "sea";
export type Urgency = "out-of-tolerance" | "event" | "goes-out-of-tolerance" | "falls-due";
export type Classified = { job: PlanJob; group: Group; urgency: Urgency; weight: number; manHours: number };

const GROUPS: readonly Group[] = ["engine-stop", "port-only", "sea"];
const URGENCIES: readonly Urgency[] = ["out-of-tolerance", "event", "goes-out-of-tolerance", "falls-due"];
const GROUP_WEIGHT: Record<Group, number> = { "engine-stop": 100, "port-only": 10, sea: 1 };
const URGENCY_WEIGHT: Record<Urgency, number> = { "out-of-tolerance": 8, event: 8, "goes-out-of-tolerance": 4, "falls-due": 1 };
const DAY_MS = 86_400_000;

export const heads = (team: TeamNeed[]) => team.reduce((sum, t) => sum + t.count, 0);
export const manHoursOf = (job: PlanJob) => Math.max(0, job.elapsedHours) * heads(job.team);

export function groupOf(job: Pick<PlanJob, "needsEngineStop" | "needsPort" | "tiedTo">): Group {
  if (job.needsEngineStop) return "engine-stop";
  return job.needsPort || job.tiedTo ? "port-only" : "sea";
}

export type Chances = { departsAt: Date; horizon: Date };

/** The job's urgency for this stay, or null when the stay need not consider it. */
export function urgencyOf(job: PlanJob, group: Group, chances: Chances): Urgency | "at-sea" | null {
  if (job.state === "out-of-tolerance") return "out-of-tolerance";
  if (job.tiedTo) return "event";
  const before = (d: Date | null, limit: number) => d !== null && d.getTime() < limit;
  const seaLimit = chances.departsAt.getTime() + DAY_MS;
  if (group === "sea") {
    if (before(job.outOfToleranceAt, seaLimit)) return "goes-out-of-tolerance";
    const dueNow = before(job.dueAt, chances.horizon.getTime()) || job.state === "late" || job.state === "window-open";
    return dueNow ? "at-sea" : null;
  }
  const next = chances.horizon.getTime();
  if (before(job.outOfToleranceAt, next)) return "goes-out-of-tolerance";
  if (before(job.dueAt, next) || job.state === "late" || job.state === "window-open") return "falls-due";
  return null;
}

export function weightOf(job: PlanJob, group: Group, urgency: Urgency): number {
  return GROUP_WEIGHT[group] * URGENCY_WEIGHT[urgency] * (job.critical || job.classRelated ? 2 : 1);
}

/** What placing the job adds to the proposal's value. */
export function valueOf(c: Pick<Classified, "weight" | "manHours">): number {
  return c.weight * Math.max(c.manHours, 0.5);
}

function dateKey(c: Classified): number {
  const date = c.urgency === "goes-out-of-tolerance" ? (c.job.outOfToleranceAt ?? c.job.dueAt) : c.job.dueAt;
  return date?.getTime() ?? Number.POSITIVE_INFINITY;
}

const text = (x: string, y: string) => (x < y ? -1 : x > y ? 1 : 0);

/** The fill order: group, urgency, state, critical, class, date, number, id. */
export function byFillOrder(a: Classified, b: Classified): number {
  return (
    GROUPS.indexOf(a.group) - GROUPS.indexOf(b.group) ||
    URGENCIES.indexOf(a.urgency) - URGENCIES.indexOf(b.urgency) ||
    OPEN_STATES_BY_URGENCY.indexOf(a.job.state) - OPEN_STATES_BY_URGENCY.indexOf(b.job.state) ||
    Number(b.job.critical) - Number(a.job.critical) ||
    Number(b.job.classRelated) - Number(a.job.classRelated) ||
    (dateKey(a) === dateKey(b) ? 0 : dateKey(a) < dateKey(b) ? -1 : 1) ||
    text(a.job.number, b.job.number) ||
    text(a.job.id, b.job.id)
  );
}

export type Sorted = { considered: Classified[]; atSea: PlanJob[] };

export function classify(jobs: PlanJob[], chances: Chances): Sorted {
  const considered: Classified[] = [];
  const atSea: PlanJob[] = [];
  for (const job of jobs) {
    const group = groupOf(job);
    const urgency = urgencyOf(job, group, chances);
    if (urgency === null) continue;
    if (urgency === "at-sea") atSea.push(job);
    else considered.push({ job, group, urgency, weight: weightOf(job, group, urgency), manHours: manHoursOf(job) });
  }
  considered.sort(byFillOrder);
  return { considered, atSea };
}
