// The package the chief is editing, checked in the browser the way the server checks it on accepting
// (server/port-stays/accept.ts): a job on a day of the stay inside its plannable days, no rank over
// its hours on a day, engine-stop work within the immobilisation allowed. Hours in tenths.
import type { PackageItemView, PackageJob, PortStayView } from "@/server/port-stays/contract";
import { formatHours } from "@/server/format/hours";
import { rankLabel } from "../../_components/stay-words";

export type DraftItem = PackageItemView;

const capacityTenths = (h: number) => (h > 0 ? Math.floor(h * 10 + 1e-6) : 0);
const needTenths = (h: number) => (h > 0 ? Math.ceil(h * 10 - 1e-6) : 0);

export type RankUsage = { rank: string; available: number; used: number };

function perDayOf(stay: PortStayView): Map<string, number> {
  const perDay = new Map<string, number>();
  for (const c of stay.crew) perDay.set(c.rank, (perDay.get(c.rank) ?? 0) + capacityTenths(c.manHoursPerDay));
  return perDay;
}

/** Each rank's hours on a day: every crew rank, and any rank the day's work needs that is not on board. */
export function dayUsage(stay: PortStayView, items: readonly DraftItem[], day: string): RankUsage[] {
  const perDay = perDayOf(stay);
  const used = new Map<string, number>([...perDay.keys()].map((r) => [r, 0]));
  for (const i of items) if (i.date === day) used.set(i.rank, (used.get(i.rank) ?? 0) + needTenths(i.manHours));
  return [...used].map(([rank, u]) => ({ rank, available: (perDay.get(rank) ?? 0) / 10, used: u / 10 }));
}

export function immobilisation(stay: PortStayView, items: readonly DraftItem[]) {
  const allowed = stay.engineMayStop ? capacityTenths(stay.immobilisationHours) : 0;
  const used = items.filter((i) => i.needsEngineStop).reduce((sum, i) => sum + needTenths(i.manHours), 0);
  return { allowed: allowed / 10, used: used / 10 };
}

/** Why the job cannot go on that day beside the other items, or null when it fits. */
export function whyNotOn(stay: PortStayView, others: readonly DraftItem[], job: PackageJob, day: string): string | null {
  if (!stay.days.includes(day)) return "not a day of this stay";
  if ((job.planFrom && day < job.planFrom) || (job.planUntil && day > job.planUntil)) return "outside its tolerance window";
  const available = perDayOf(stay).get(job.rank) ?? 0;
  const used = others
    .filter((i) => i.date === day && i.rank === job.rank && i.workOrderId !== job.workOrderId)
    .reduce((sum, i) => sum + needTenths(i.manHours), 0);
  if (used + needTenths(job.manHours) > available) {
    return `${rankLabel(job.rank).toLowerCase()} has ${formatHours(Math.max(0, available - used) / 10)} left that day`;
  }
  if (job.needsEngineStop) {
    const stop = immobilisation(
      stay,
      others.filter((i) => i.workOrderId !== job.workOrderId),
    );
    if (stop.used + job.manHours > stop.allowed + 1e-9) {
      return `not enough immobilisation left (${formatHours(Math.max(0, stop.allowed - stop.used))} of ${formatHours(stop.allowed)})`;
    }
  }
  return null;
}

/** The earliest day of the stay the job fits on, or null. */
export function firstFittingDay(stay: PortStayView, items: readonly DraftItem[], job: PackageJob): string | null {
  return stay.days.find((day) => whyNotOn(stay, items, job, day) === null) ?? null;
}
