// The sentences of the port-stay plan: why each job is in it, when and by whom it is done, and why
// one that mattered was left out. Kept apart from the planner so that its files read as rules.
import { TZDate } from "@date-fns/tz";
import { format, parseISO } from "date-fns";
import { formatHours, formatManHours } from "@/server/format/hours";
import { lowerFirst, type RankNames } from "@/server/routines/rank-names";
import type { Classified, PlanJob } from "./job-classes";
import type { PlanStay } from "./job-placement";

export type LeftOutReason =
  | "short-of-rank"
  | "engine-stop-not-allowed"
  | "window-not-open"
  | "past-grace"
  | "longer-than-stay"
  | "longer-than-engine-stop"
  | "longer-than-event-window"
  | "longer-than-window"
  | "watches"
  | "rest-hours"
  | "crew-taken";

export type PlanWordsContext = {
  timeZone: string;
  /** The year of the stay's first day: dates in that year are written without it. */
  year: number;
  horizon: Date;
  stay: PlanStay;
  /** null when the horizon is the look-ahead, not a next port stay. */
  nextStay: Date | null;
  /** The company's own names for its ranks. */
  rankNames?: RankNames;
};

const DAY_MS = 86_400_000;
const rankWords = (rank: string, names?: RankNames) => {
  const own = names?.[rank as keyof RankNames];
  return own ? lowerFirst(own) : rank.replaceAll("-", " ");
};

function dayOf(instant: Date, ctx: PlanWordsContext): string {
  const local = new TZDate(instant, ctx.timeZone);
  return format(local, local.getFullYear() === ctx.year ? "d MMM" : "d MMM yyyy");
}
function clockOf(instant: Date, ctx: PlanWordsContext): string {
  return `${dayOf(instant, ctx)} ${format(new TZDate(instant, ctx.timeZone), "HH:mm")}`;
}
const shipDayWords = (day: string, ctx: PlanWordsContext) =>
  format(parseISO(day), Number(day.slice(0, 4)) === ctx.year ? "d MMM" : "d MMM yyyy");

/** "second engineer, motorman ×2" from the people's keys ("rank#n") or a team. */
export function teamWords(team: { rank: string; count: number }[], names?: RankNames): string {
  return team
    .map(({ rank, count }) => (count > 1 ? `${rankWords(rank, names)} ×${count}` : rankWords(rank, names)))
    .join(", ");
}
function teamOfPeople(people: string[], names?: RankNames): string {
  const counts = new Map<string, number>();
  for (const key of people) {
    const rank = key.slice(0, key.lastIndexOf("#"));
    counts.set(rank, (counts.get(rank) ?? 0) + 1);
  }
  return teamWords([...counts].map(([rank, count]) => ({ rank, count })), names);
}

function nextChance(c: Classified, ctx: PlanWordsContext): string {
  if (c.group === "sea") {
    return `before the end of the first day at sea (${dayOf(new Date(ctx.stay.departsAt.getTime() + DAY_MS), ctx)})`;
  }
  const when = dayOf(ctx.horizon, ctx);
  return ctx.nextStay ? `before the next port stay (${when})` : `within the look-ahead (to ${when})`;
}

/** Why the job is in the proposal at all, e.g. "Goes out of tolerance on 14 Dec, before the next port stay (20 Dec)". */
export function urgencyWords(c: Classified, ctx: PlanWordsContext): string {
  const { job } = c;
  const due = job.dueAt && dayOf(job.dueAt, ctx);
  let why: string;
  switch (c.urgency) {
    case "out-of-tolerance":
      why = job.outOfToleranceAt ? `Out of tolerance since ${dayOf(job.outOfToleranceAt, ctx)}` : "Already out of tolerance";
      break;
    case "event":
      why = `Required within ${formatHours(job.tiedTo!.withinHours)} ${job.tiedTo!.event === "departure" ? "before each departure" : "after each arrival"}`;
      break;
    case "goes-out-of-tolerance":
      why = `${c.group === "sea" ? "Can be done at sea, but goes" : "Goes"} out of tolerance on ${dayOf(job.outOfToleranceAt!, ctx)}, ${nextChance(c, ctx)}`;
      break;
    case "falls-due":
      if (job.state === "late") why = due ? `Late (was due on ${due})` : "Late";
      else if (job.state === "window-open") why = due ? `Its window is open (due on ${due})` : "Its window is open";
      else why = `${job.state === "deferred" ? "Deferred, and falls" : "Falls"} due on ${due}, ${nextChance(c, ctx)}`;
  }
  const marks = [
    c.group === "engine-stop" && "needs the engine stopped",
    c.group === "port-only" && job.needsPort && "needs the ship in port",
    job.critical && "critical",
    job.classRelated && "class-related",
  ].filter(Boolean);
  return marks.length ? `${why} — ${marks.join(", ")}` : why;
}

/** "…; second engineer, motorman ×2 from 3 Dec 08:00 to 4 Dec 12:00 (12 h of work, 36 man-hours), inside the engine stop." */
export function placedWords(
  c: Classified,
  segments: { from: Date; to: Date }[],
  people: string[],
  ctx: PlanWordsContext,
): string {
  const start = segments[0]!.from;
  const end = segments[segments.length - 1]!.to;
  const worked = segments.reduce((sum, s) => sum + (s.to.getTime() - s.from.getTime()) / 3_600_000, 0);
  const days = new Set(segments.map((s) => dayOf(s.from, ctx))).size;
  const span = days > 1 ? `${formatHours(worked)} of work over ${days} days` : `${formatHours(worked)} of work`;
  const stop = ctx.stay.immobilisation;
  const inside =
    c.job.needsEngineStop && stop
      ? `, inside the engine stop (${clockOf(stop.from, ctx)} to ${clockOf(stop.to, ctx)})`
      : "";
  return `${urgencyWords(c, ctx)}; ${teamOfPeople(people, ctx.rankNames)} from ${clockOf(start, ctx)} to ${clockOf(end, ctx)} (${span}, ${formatManHours(c.manHours)})${inside}.`;
}

function problemWords(c: Classified, reason: LeftOutReason, ctx: PlanWordsContext): string {
  const { job } = c;
  const takes = `it takes ${formatHours(job.elapsedHours)} of work`;
  switch (reason) {
    case "short-of-rank":
      return `its team (${teamWords(job.team, ctx.rankNames)}) is more than the crew on board for this stay`;
    case "engine-stop-not-allowed":
      return "it needs the engine stopped, and the engine may not stop in this stay";
    case "window-not-open":
      return `its window opens on ${shipDayWords(job.planFrom!, ctx)}, after the stay; consider an early completion or a deferral`;
    case "past-grace":
      return `it may be planned only until ${job.planUntil ? shipDayWords(job.planUntil, ctx) : "before the stay"}, before the stay's working hours; do it before arrival or request a deferral`;
    case "longer-than-stay":
      return `${takes}, more than the stay's working hours`;
    case "longer-than-engine-stop":
      return `${takes}, more than the working hours inside the engine stop`;
    case "longer-than-event-window":
      return `${takes}, more than the working hours in its window ${job.tiedTo?.event === "arrival" ? "after arrival" : "before departure"}`;
    case "longer-than-window":
      return `${takes}, more than the working hours on the days it may be planned`;
    case "watches":
      return `its team (${teamWords(job.team, ctx.rankNames)}) is on port watches whenever it could be done`;
    case "rest-hours":
      return `its team (${teamWords(job.team, ctx.rankNames)}) would go under the rest-hour minimum (10 h in any 24 h, 77 h in any 7 days: MLC 2006 Standard A2.3)`;
    case "crew-taken":
      return `its team (${teamWords(job.team, ctx.rankNames)}) is busy with work ranked before it whenever it could be done`;
  }
}

/** "Goes out of tolerance on 14 Dec, …, but it takes 14 h of work, more than …." */
export function leftOutWords(c: Classified, reason: LeftOutReason, ctx: PlanWordsContext): string {
  return `${urgencyWords(c, ctx)}, but ${problemWords(c, reason, ctx)}.`;
}

/** Sea work that falls due but can wait for the voyage. */
export function atSeaWords(job: PlanJob, ctx: PlanWordsContext): string {
  const due = job.dueAt ? `falls due on ${dayOf(job.dueAt, ctx)}` : "its window is open";
  const limit = job.outOfToleranceAt
    ? `stays within tolerance until ${dayOf(job.outOfToleranceAt, ctx)}`
    : "has no tolerance limit";
  return `Left for the voyage: it can be done at sea, ${due} and ${limit}, after the first day at sea.`;
}
