// The sentences the work-package proposal gives for each choice: why a work order was taken, and
// why one that mattered did not fit. Kept apart from the algorithm so that proposal.ts reads as rules.
import { TZDate } from "@date-fns/tz";
import { format, parseISO } from "date-fns";
import { formatHours } from "@/server/format/hours";
import type { Candidate, LeftOutReason, Tier } from "./proposal";

export type WordsContext = {
  /** The year of the stay's first day: dates in that year are written without it. */
  year: number;
  timeZone: string;
  horizon: Date;
  /** null when the horizon is the look-ahead, not a next port stay. */
  lookAheadDays: number | null;
};

function dayMonth(date: Date, ctx: WordsContext): string {
  return format(date, date.getFullYear() === ctx.year ? "d MMM" : "d MMM yyyy");
}

/** A ship's day "2026-12-03" → "3 Dec". The string already is the ship's day, so no zone applies. */
export function dayWords(day: string, ctx: WordsContext): string {
  return dayMonth(parseISO(day), ctx);
}

/** An instant named by the ship's day it falls on. */
export function instantWords(instant: Date, ctx: WordsContext): string {
  return dayMonth(new TZDate(instant, ctx.timeZone), ctx);
}

export const rankWords = (rank: string) => rank.replaceAll("-", " ");

function beforeHorizon(ctx: WordsContext): string {
  const when = instantWords(ctx.horizon, ctx);
  return ctx.lookAheadDays === null
    ? `before the next port stay (${when})`
    : `within the ${ctx.lookAheadDays}-day look-ahead (to ${when})`;
}

function flags(c: Candidate): string {
  const marks = [c.critical && "critical", c.classRelated && "class-related"].filter(Boolean);
  return marks.length ? ` — ${marks.join(", ")}` : "";
}

/** Why the work order is in the package at all: its tier in words, e.g. "Goes out of tolerance on 14 Dec, …". */
export function whyWords(c: Candidate, tier: Tier, ctx: WordsContext): string {
  const due = c.dueAt && instantWords(c.dueAt, ctx);
  let why: string;
  if (tier === "would-go-out-of-tolerance") {
    if (c.state === "out-of-tolerance") {
      why = c.outOfToleranceAt
        ? `Out of tolerance since ${instantWords(c.outOfToleranceAt, ctx)}`
        : "Already out of tolerance";
    } else {
      why = `Goes out of tolerance on ${instantWords(c.outOfToleranceAt!, ctx)}, ${beforeHorizon(ctx)}`;
    }
  } else if (tier === "engine-stop") {
    why = `Needs the engine stopped and falls due on ${due}, ${beforeHorizon(ctx)}`;
  } else if (c.state === "late") {
    why = due ? `Late (was due on ${due})` : "Late";
  } else if (c.state === "window-open") {
    why = due ? `Its window is open (due on ${due})` : "Its window is open";
  } else {
    why = `${c.state === "deferred" ? "Deferred, and falls" : "Falls"} due on ${due}, ${beforeHorizon(ctx)}`;
  }
  return why + flags(c);
}

/** "…; 6 h of second engineer on 3 Dec, with the engine stopped (6 h of the 12 h immobilisation used)." */
export function placedWords(
  why: string,
  c: Candidate,
  day: string,
  immobilisation: { used: number; allowed: number } | null,
  ctx: WordsContext,
): string {
  const work = `${formatHours(c.estimatedManHours)} of ${rankWords(c.rank)} on ${dayWords(day, ctx)}`;
  const stop = immobilisation
    ? `, with the engine stopped (${formatHours(immobilisation.used)} of the ${formatHours(immobilisation.allowed)} immobilisation used)`
    : "";
  return `${why}; ${work}${stop}.`;
}

export type LeftOutFacts = {
  /** The rank is in the crew list (perhaps with 0 h a day). */
  rankOnBoard: boolean;
  /** The rank's man-hours on each day of the stay. */
  perDay: number;
  /** The most hours of the rank left on any day the job may go on. */
  mostLeft: number;
  immobilisationLeft: number;
  immobilisationAllowed: number;
  engineMayStop: boolean;
  firstDay: string;
  lastDay: string;
};

function problemWords(c: Candidate, reason: LeftOutReason, f: LeftOutFacts, ctx: WordsContext): string {
  const need = formatHours(c.estimatedManHours);
  const rank = rankWords(c.rank);
  switch (reason) {
    case "no-rank-on-board":
      return f.rankOnBoard
        ? `the ${rank} has no hours for maintenance in this stay (it needs ${need})`
        : `no ${rank} is on board for this stay (it needs ${need})`;
    case "larger-than-any-day":
      return `it needs ${need} of ${rank}, more than the ${formatHours(f.perDay)} a day on board, and a job is not split across days`;
    case "engine-stop-not-allowed":
      return f.engineMayStop
        ? "it needs the engine stopped, and no immobilisation time is allowed in this stay"
        : "it needs the engine stopped, and the engine may not stop in this stay";
    case "exceeds-immobilisation":
      return c.estimatedManHours > f.immobilisationAllowed
        ? `it needs ${need} with the engine stopped, more than the ${formatHours(f.immobilisationAllowed)} of immobilisation allowed`
        : `it needs ${need} with the engine stopped, and only ${formatHours(f.immobilisationLeft)} of the ${formatHours(f.immobilisationAllowed)} immobilisation is left`;
    case "window-not-open":
      if (c.planFrom && c.planFrom > f.lastDay) {
        return `its window opens on ${dayWords(c.planFrom, ctx)}, after the stay (last day ${dayWords(f.lastDay, ctx)}); consider an early completion or a deferral`;
      }
      return `the days it may be planned on (${c.planFrom ? dayWords(c.planFrom, ctx) : "…"} to ${c.planUntil ? dayWords(c.planUntil, ctx) : "…"}) hold none of the stay's days`;
    case "past-grace":
      return `it may be planned only until ${dayWords(c.planUntil!, ctx)}, before the stay begins (${dayWords(f.firstDay, ctx)}); do it before arrival or request a deferral`;
    case "no-capacity-for-rank":
      return `no day of the stay it may go on has ${need} of ${rank} left (at most ${formatHours(f.mostLeft)}), taken by work ranked before it`;
  }
}

/** "Goes out of tolerance on 14 Dec, before the next port stay (20 Dec), but no second engineer is on board." */
export function leftOutWords(
  why: string,
  c: Candidate,
  reason: LeftOutReason,
  facts: LeftOutFacts,
  ctx: WordsContext,
): string {
  return `${why}, but ${problemWords(c, reason, facts, ctx)}.`;
}
