// A work package as the chief engineer edited it on the timeline, checked against the same rules the
// planner keeps: each job starts at a working time of the stay, runs on the next working hours until
// done and is finished before departure; engine-stop work lies in the engine stop, event work in its
// window, every job in the days its window allows; its people are of its team's ranks and head
// counts, on no other job or watch at the time, and keep their rest hours. Items are taken in order;
// one that fails takes nobody's time. Pure.
import { TZDate } from "@date-fns/tz";
import { format } from "date-fns";
import { formatHours } from "@/server/format/hours";
import { buildCrewLedger, keepsRest, type PortWatch, type TeamNeed } from "./crew-ledger";
import type { RankNames } from "@/server/routines/rank-names";
import type { PlanJob } from "./job-classes";
import { boundsOf, commit, peopleByRank, segmentsOf, slotsFrom, teamFor, type PlanStay } from "./job-placement";
import { buildStayGrid, slotsFor, type Workday } from "./stay-grid";
import { teamWords } from "./stay-plan-words";

export type CheckStay = PlanStay & { workday: Workday; crew: TeamNeed[]; watches: PortWatch[] };
export type PackageItem = { job: PlanJob; start: Date; people?: string[] };
export type CheckedItem = { segments: { from: Date; to: Date }[]; people: string[] };
export type ItemProblem = { item: number; field: "start" | "people"; message: string };

export function checkPackage(
  stay: CheckStay,
  items: PackageItem[],
  slotMinutes?: number,
  rankNames?: RankNames,
): { placed: (CheckedItem | null)[]; problems: ItemProblem[] } {
  const grid = buildStayGrid(stay.arrivesAt, stay.departsAt, stay.timeZone, stay.workday, slotMinutes);
  const ledger = buildCrewLedger(grid, stay.crew, stay.watches);
  const byRank = peopleByRank(ledger);
  const index = new Map(ledger.persons.map((p, i) => [p.key, i]));
  const clock = (ms: number) => format(new TZDate(ms, stay.timeZone), "d MMM HH:mm");
  const hhmm = (minutes: number) => `${String(Math.floor(minutes / 60)).padStart(2, "0")}:${String(minutes % 60).padStart(2, "0")}`;
  const workday = `${hhmm(stay.workday.from)}–${hhmm(stay.workday.to)}`;
  const placed: (CheckedItem | null)[] = [];
  const problems: ItemProblem[] = [];

  items.forEach(({ job, start, people }, item) => {
    const problem = (field: ItemProblem["field"], message: string) => {
      problems.push({ item, field, message: `${job.number}: ${message}` });
      placed.push(null);
    };
    const p = grid.workable.findIndex((t) => grid.slots[t]!.start === start.getTime());
    if (p < 0) {
      return problem(
        "start",
        `${clock(start.getTime())} is not a working time of this stay (working day ${workday}, in steps of ${grid.slotMs / 60_000} minutes, from arrival to departure).`,
      );
    }
    const slots = slotsFrom(grid, p, slotsFor(job.elapsedHours, grid));
    if (!slots) return problem("start", `started at ${clock(start.getTime())}, its ${formatHours(job.elapsedHours)} of work would not be done before departure.`);
    const [first, last] = [slots[0]!, slots[slots.length - 1]!];
    const end = grid.slots[last]!.end;
    const bounds = boundsOf(job, grid, stay);
    const inside = (range: [number, number]) => first >= range[0] && last < range[1];
    if (bounds.engineStop && !inside(bounds.engineStop)) {
      return problem(
        "start",
        stay.immobilisation
          ? `it needs the engine stopped, and ${clock(start.getTime())}–${clock(end)} is not inside the engine stop (${clock(stay.immobilisation.from.getTime())}–${clock(stay.immobilisation.to.getTime())}).`
          : "it needs the engine stopped, and the engine may not stop in this stay.",
      );
    }
    if (bounds.event && !inside(bounds.event)) {
      const tie = job.tiedTo!;
      return problem("start", `it is done within ${formatHours(tie.withinHours)} ${tie.event === "departure" ? "before departure" : "after arrival"}; ${clock(start.getTime())}–${clock(end)} is not.`);
    }
    if (!inside(bounds.days)) {
      return problem("start", `it may be planned only ${job.planFrom ? `from ${job.planFrom} ` : ""}${job.planUntil ? `until ${job.planUntil}` : ""}, inside its tolerance window.`);
    }

    let team: number[] | null;
    if (people && people.length > 0) {
      const chosen = people.map((key) => index.get(key));
      const unknown = people.find((_, k) => chosen[k] === undefined);
      if (unknown) return problem("people", `${unknown} is not in this stay's crew list.`);
      const ranks = new Map<string, number>();
      for (const i of chosen) ranks.set(ledger.persons[i!]!.rank, (ranks.get(ledger.persons[i!]!.rank) ?? 0) + 1);
      const fits = job.team.length === ranks.size && job.team.every((t) => ranks.get(t.rank) === t.count);
      if (!fits || new Set(people).size !== people.length) {
        return problem("people", `its team is ${teamWords(job.team, rankNames)}; ${people.join(", ")} is not.`);
      }
      const ids = chosen as number[];
      const busy = ids.find((i) => slots.some((t) => ledger.work[i]![t] === 1));
      if (busy !== undefined) {
        return problem("people", `${ledger.persons[busy]!.key} is on another job or a watch between ${clock(start.getTime())} and ${clock(end)}.`);
      }
      team = ids;
    } else {
      team = teamFor(job, slots, ledger, byRank) ?? teamFor(job, slots, ledger, byRank, false);
      if (!team) return problem("people", `not enough of its team (${teamWords(job.team, rankNames)}) is free between ${clock(start.getTime())} and ${clock(end)}.`);
    }
    // Rest hours last, so that the message names the rule only when it is what bites.
    const tired = team.find((i) => !keepsRest(ledger, i, slots));
    if (tired !== undefined) {
      return problem(
        "people",
        `${ledger.persons[tired]!.key} would go under the rest-hour minimum (10 h in any 24 h, 77 h in any 7 days: MLC 2006 Standard A2.3).`,
      );
    }
    commit(ledger, { slots, people: team });
    placed.push({ segments: segmentsOf(grid, slots), people: team.map((i) => ledger.persons[i]!.key) });
  });
  return { placed, problems };
}


