// Whether a stay's work package fits its crew and its immobilisation time: the check accepting a
// package makes for each item, and the one a changed stay (fewer hours, no engine stop) makes
// against the package already accepted. Pure: no I/O.
import { format, parseISO } from "date-fns";
import { formatHours } from "@/server/format/hours";

export type StayCapacity = {
  crew: readonly { rank: string; manHoursPerDay: number }[];
  engineMayStop: boolean;
  immobilisationHours: number;
};

export type PackageJob = { number: string; rank: string; manHours: number; needsEngineStop: boolean; date: string };

export type CapacityProblem = {
  /** The job's index in the list given. */
  index: number;
  /** `crew`: the rank's hours that day run over; `engine-stop`: the immobilisation time does. */
  kind: "crew" | "engine-stop";
  message: string;
};

// Hours in tenths, as the planner counts them (server/planning/proposal.ts): capacity rounded down,
// work rounded up, so sums of decimals never let a day run over.
const capacityTenths = (h: number) => (h > 0 ? Math.floor(h * 10 + 1e-6) : 0);
const needTenths = (h: number) => (h > 0 ? Math.ceil(h * 10 - 1e-6) : 0);

const rankWords = (rank: string) => rank.replaceAll("-", " ");
export const packageDay = (d: string) => format(parseISO(d), "d MMM yyyy");

/** Jobs in package order; a job that does not fit takes none of the capacity. */
export function capacityProblems(stay: StayCapacity, jobs: readonly PackageJob[]): CapacityProblem[] {
  const perDay = new Map<string, number>();
  for (const { rank, manHoursPerDay } of stay.crew) perDay.set(rank, (perDay.get(rank) ?? 0) + capacityTenths(manHoursPerDay));
  const allowedStop = stay.engineMayStop ? capacityTenths(stay.immobilisationHours) : 0;
  const used = new Map<string, number>();
  let stopUsed = 0;
  const problems: CapacityProblem[] = [];

  jobs.forEach((job, index) => {
    const key = `${job.date}|${job.rank}`;
    const need = needTenths(job.manHours);
    const total = (used.get(key) ?? 0) + need;
    const available = perDay.get(job.rank) ?? 0;
    if (total > available) {
      problems.push({
        index,
        kind: "crew",
        message: `On ${packageDay(job.date)} the ${rankWords(job.rank)} would have ${formatHours(total / 10)} of work, more than the ${formatHours(available / 10)} on board.`,
      });
      return;
    }
    used.set(key, total);
    if (!job.needsEngineStop) return;
    if (stopUsed + need > allowedStop) {
      problems.push({
        index,
        kind: "engine-stop",
        message:
          allowedStop === 0
            ? `${job.number} needs the engine stopped, and no immobilisation is allowed in this stay.`
            : `${job.number} needs the engine stopped: with it the package would take ${formatHours((stopUsed + need) / 10)} of the ${formatHours(allowedStop / 10)} immobilisation allowed.`,
      });
      return;
    }
    stopUsed += need;
  });
  return problems;
}
