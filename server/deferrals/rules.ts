// Whether a proposed new limit is one a deferral may set. Pure: no I/O, tested beside the file.
import { formatHours } from "@/server/format/hours";
import type { FieldError } from "@/server/http/problem";
import { addShipMonths, shipDateFromKey, shipDateKey } from "@/server/scheduling/ship-date";

/**
 * A deferral bridges to the next opportunity to do the work: spares arriving, a port stay, a class
 * surveyor's attendance, at most the next dry-docking (class schedules two in a five-year cycle, so
 * they are some 30 months apart). Two years covers all of these; postponing longer is a change of
 * the routine, not a deferral (common practice).
 */
export const MAX_DEFERRAL_MONTHS = 24;

export type LimitContext = {
  /** The ship's day today (YYYY-MM-DD). */
  today: string;
  /** The ship's day of the limit in force (a deferral's, else the due date), when there is one. */
  currentDueDay: string | null;
  /** The running-hours limit in force, or null when the work order does not fall due by hours. */
  currentDueHours: number | null;
  /** The routine's interval in hours, when it has one. */
  intervalHours: number | null;
};

export function latestDeferralDay(today: string): string {
  return shipDateKey(addShipMonths(shipDateFromKey(today), MAX_DEFERRAL_MONTHS));
}

/** More than one interval beyond the current limit would skip a whole occurrence of the job. */
export function highestDeferralHours(ctx: Pick<LimitContext, "currentDueHours" | "intervalHours">): number | null {
  if (ctx.currentDueHours === null || ctx.intervalHours === null) return null;
  return Math.round((ctx.currentDueHours + ctx.intervalHours) * 10) / 10;
}

/** Each reason the proposed limits cannot be accepted, naming the field. Empty when they can. */
export function deferralLimitProblems(
  proposed: { proposedDueDay: string | null; proposedDueHours: number | null },
  ctx: LimitContext,
): FieldError[] {
  const problems: FieldError[] = [];
  const day = proposed.proposedDueDay;
  if (day !== null) {
    const latest = latestDeferralDay(ctx.today);
    // ISO dates compare as strings.
    if (day <= ctx.today) {
      problems.push({
        field: "proposedDueDay",
        message: `The new due day must be after today (the ship’s day is ${ctx.today}).`,
      });
    } else if (ctx.currentDueDay !== null && day <= ctx.currentDueDay) {
      problems.push({
        field: "proposedDueDay",
        message: `The new due day must be after the current due day, ${ctx.currentDueDay}: a deferral moves the limit later.`,
      });
    } else if (day > latest) {
      problems.push({
        field: "proposedDueDay",
        message: `Propose a day at most two years ahead (up to ${latest}): a longer postponement is a change of the routine, not a deferral.`,
      });
    }
  }
  const hours = proposed.proposedDueHours;
  if (hours !== null) {
    const highest = highestDeferralHours(ctx);
    if (ctx.currentDueHours === null) {
      problems.push({
        field: "proposedDueHours",
        message: "This work order has no running-hours limit: propose a new due day instead.",
      });
    } else if (hours <= ctx.currentDueHours) {
      problems.push({
        field: "proposedDueHours",
        message: `The new limit must be above the current one, ${formatHours(ctx.currentDueHours)}.`,
      });
    } else if (highest !== null && hours > highest) {
      problems.push({
        field: "proposedDueHours",
        message: `Propose at most one interval beyond the current limit (up to ${formatHours(highest)}): a longer postponement skips a whole occurrence of the job.`,
      });
    }
  }
  return problems;
}
