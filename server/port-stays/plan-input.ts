// A stored port stay and the vessel's work orders as the planner's input (server/planning). Pure.
import type { PortWatchRow, CrewOnBoard } from "@/db/schema/port-stays";
import type { PlanJob } from "@/server/planning/job-classes";
import type { CheckStay } from "@/server/planning/package-check";
import type { PackageJob } from "./contract";

type StayFacts = {
  arrivesAt: Date;
  departsAt: Date;
  workdayFrom: number;
  workdayTo: number;
  engineStopFrom: Date | null;
  engineStopTo: Date | null;
  crew: CrewOnBoard[];
  watches: PortWatchRow[];
};

export function planStayOf(stay: StayFacts, timeZone: string): CheckStay {
  return {
    arrivesAt: stay.arrivesAt,
    departsAt: stay.departsAt,
    timeZone,
    workday: { from: stay.workdayFrom, to: stay.workdayTo },
    immobilisation: stay.engineStopFrom && stay.engineStopTo ? { from: stay.engineStopFrom, to: stay.engineStopTo } : null,
    crew: stay.crew,
    watches: stay.watches.map((w) => ({ ...w, from: new Date(w.from), to: new Date(w.to) })),
  };
}

export function planJobOf(job: PackageJob, outOfToleranceAt: Date | null): PlanJob {
  return {
    id: job.workOrderId,
    number: job.number,
    title: job.title,
    // A done job is never proposed; in a package check its state does not matter.
    state: job.state === "done" ? "scheduled" : job.state,
    team: job.team,
    elapsedHours: job.elapsedHours,
    needsEngineStop: job.needsEngineStop,
    needsPort: job.needsPort,
    critical: job.critical,
    classRelated: job.classRelated,
    dueAt: job.dueAt ? new Date(job.dueAt) : null,
    outOfToleranceAt,
    planFrom: job.planFrom,
    planUntil: job.planUntil,
    tiedTo: job.tiedTo,
  };
}
