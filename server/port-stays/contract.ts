// A port stay and its work package: what the chief engineer sends (stay form, edited package) and
// what the pages get back. Shared by the forms (react-hook-form + zod) and the route handlers.
// Arrival and departure are typed as the ship's clock shows them ("2026-12-04T07:00", vessel zone);
// the server turns them into instants with the vessel's zone (queries.ts).
import { z } from "zod";
import type { CrewCapacity } from "@/db/schema/port-stays";
import { dayRangeProblem, enteredDay } from "@/server/http/dates";
import { optionalText, requiredText } from "@/server/http/text-fields";
import type { DayUsage, LeftOutReason, PlanningState, Tier } from "@/server/planning/proposal";
import { SHIP_DAY_FORMAT } from "@/server/readings/contract";
import { RANKS } from "@/server/routines/contract";

export const MAX_STAY_DAYS = 30;
export const MAX_IMMOBILISATION_HOURS = 720;
/** A rank's maintenance hours on one day: 24 h for each of up to about eight people of the rank. */
export const MAX_RANK_HOURS_PER_DAY = 200;
export const MAX_PACKAGE_ITEMS = 500;

const SHIP_TIME = /^(\d{4})-(\d{2})-(\d{2})T([01]\d|2[0-3]):([0-5]\d)$/;

/** A ship's clock date-time "YYYY-MM-DDTHH:mm" (the value of an <input type="datetime-local">). */
function shipTime(what: string) {
  return z
    .string({ message: `Enter the ${what} as a date and ship’s time.` })
    .min(1, { message: `Enter the ${what}: date and ship’s time.`, abort: true })
    .refine(
      (raw) => {
        const m = SHIP_TIME.exec(raw);
        if (!m) return false;
        const [y, mo, d] = [Number(m[1]), Number(m[2]), Number(m[3])];
        const date = new Date(Date.UTC(y, mo - 1, d));
        return date.getUTCFullYear() === y && date.getUTCMonth() === mo - 1 && date.getUTCDate() === d;
      },
      { message: `Enter the ${what} as a date and 24-hour ship’s time, e.g. 2026-12-04T07:00.`, abort: true },
    )
    .superRefine((raw, ctx) => {
      const problem = dayRangeProblem("planned", `The ${what}`, raw.slice(0, 10));
      if (problem) ctx.addIssue({ code: "custom", message: problem });
    });
}

/** A number of hours with at most one decimal, as Keelson stores hours (tenths). */
function tenthsOfHours(what: string, max: number) {
  const message = `${what}: enter hours from 0 to ${max}, with at most one decimal.`;
  return z
    .number({ message })
    .min(0, { message })
    .max(max, { message })
    .refine((v) => Math.abs(v * 10 - Math.round(v * 10)) < 1e-6, { message });
}

export const CrewRow = z.object({
  rank: z.enum(RANKS, { message: "Choose the rank." }),
  manHoursPerDay: tenthsOfHours("Man-hours a day", MAX_RANK_HOURS_PER_DAY),
});

/** Wall-clock minutes between two ship's times, ignoring clock changes (enough for "after" and "30 days"). */
export function shipTimeMinutes(value: string): number {
  const m = SHIP_TIME.exec(value);
  if (!m) return Number.NaN;
  return Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3]), Number(m[4]), Number(m[5])) / 60_000;
}

const PortStayFields = z.object({
  port: requiredText("port name", 80),
  arrivesAt: shipTime("arrival"),
  departsAt: shipTime("departure"),
  engineMayStop: z.boolean({ message: "Say whether the main engine may be immobilised." }),
  immobilisationHours: tenthsOfHours("Immobilisation", MAX_IMMOBILISATION_HOURS),
  crew: z.array(CrewRow, { message: "List the crew’s man-hours per rank." }).max(RANKS.length, {
    message: `At most one row per rank (${RANKS.length}).`,
  }),
  remarks: optionalText("remarks", 2000).transform((v) => v ?? ""),
});

/** The rules between fields, each naming the field to correct. */
function checkStay(stay: z.output<typeof PortStayFields>, ctx: z.RefinementCtx) {
  const minutes = shipTimeMinutes(stay.departsAt) - shipTimeMinutes(stay.arrivesAt);
  if (minutes <= 0) {
    ctx.addIssue({ code: "custom", path: ["departsAt"], message: "The departure must be after the arrival." });
  } else if (minutes > MAX_STAY_DAYS * 24 * 60) {
    ctx.addIssue({
      code: "custom",
      path: ["departsAt"],
      message: `A port stay lasts at most ${MAX_STAY_DAYS} days; enter a longer call as several stays.`,
    });
  }
  if (!stay.engineMayStop && stay.immobilisationHours > 0) {
    ctx.addIssue({
      code: "custom",
      path: ["immobilisationHours"],
      message: "The engine may not be immobilised in this stay: set the immobilisation to 0 h, or allow it.",
    });
  }
  const seen = new Map<string, number>();
  stay.crew.forEach((row, i) => {
    const first = seen.get(row.rank);
    if (first !== undefined) {
      ctx.addIssue({
        code: "custom",
        path: ["crew", i, "rank"],
        message: `This rank is already on row ${first + 1}: give each rank one row with its total hours.`,
      });
    } else {
      seen.set(row.rank, i);
    }
  });
}

export const PortStayInput = PortStayFields.superRefine(checkStay);
export type PortStayInput = z.input<typeof PortStayInput>;
export type PortStayValues = z.output<typeof PortStayInput>;

/** A change to some fields; the server merges it with the stay and checks the whole again. */
export const PortStayPatch = PortStayFields.partial();
export type PortStayPatch = z.input<typeof PortStayPatch>;

export const DeleteStayQuery = z.object({
  /** "true" to delete a stay whose package was accepted, releasing its work orders' planned dates. */
  releasePackage: z.enum(["true", "false"]).optional(),
});

export const PackageItemInput = z.object({
  workOrderId: z.uuid({ message: "This is not a work-order id." }),
  date: enteredDay("planned", "The job’s day in the stay", SHIP_DAY_FORMAT),
  /** Why the work is in the package: the proposal's sentence, or the chief's own words. */
  reason: optionalText("reason", 500),
});

export const PackageInput = z
  .object({
    items: z
      .array(PackageItemInput, { message: "Send the package as a list of items." })
      .max(MAX_PACKAGE_ITEMS, { message: `A package holds at most ${MAX_PACKAGE_ITEMS} jobs.` }),
  })
  .superRefine((pkg, ctx) => {
    const seen = new Map<string, number>();
    pkg.items.forEach((item, i) => {
      const first = seen.get(item.workOrderId);
      if (first !== undefined) {
        ctx.addIssue({
          code: "custom",
          path: ["items", i, "workOrderId"],
          message: `This work order is already item ${first + 1} of the package; a job goes on one day.`,
        });
      } else {
        seen.set(item.workOrderId, i);
      }
    });
  });
export type PackageInput = z.input<typeof PackageInput>;

/* ---- What the pages get back ---- */

export type PortStayView = {
  id: string;
  port: string;
  arrivesAt: string;
  departsAt: string;
  /** The ship's clock values, as the form edits them. */
  arrivesLocal: string;
  departsLocal: string;
  /** The stay's ship's days, first to last. */
  days: string[];
  engineMayStop: boolean;
  immobilisationHours: number;
  crew: CrewCapacity[];
  remarks: string;
  packageAcceptedAt: string | null;
  packageAcceptedBy: string | null;
  itemCount: number;
};

export type PortStayList = {
  timeZone: string;
  upcoming: PortStayView[];
  past: PortStayView[];
  /** The crew table of the latest stay, to start a new one from. */
  latestCrew: CrewCapacity[];
  may: { plan: boolean };
};

/** A work order as the package shows it, on a day, with the facts the page checks capacity with. */
export type PackageJob = {
  workOrderId: string;
  number: string;
  title: string;
  componentCode: string;
  componentName: string;
  state: PlanningState | "done";
  rank: string;
  manHours: number;
  needsEngineStop: boolean;
  critical: boolean;
  classRelated: boolean;
  dueAt: string | null;
  planFrom: string | null;
  planUntil: string | null;
};

export type PackageItemView = PackageJob & { date: string; reason: string; tier: Tier | null };

export type PortStayDetail = {
  vessel: { id: string; name: string; code: string; timeZone: string };
  stay: PortStayView;
  /** The accepted package, in its order. */
  items: PackageItemView[];
  now: string;
  may: { plan: boolean };
};

export type LeftOutView = PackageJob & { tier: Tier; reason: LeftOutReason; message: string };

export type ProposalView = {
  horizon: string;
  /** The next stay that sets the horizon, or null when the look-ahead does. */
  nextStay: { port: string; arrivesAt: string } | null;
  lookAheadDays: number | null;
  items: PackageItemView[];
  leftOut: LeftOutView[];
  usage: DayUsage[];
  immobilisation: { allowed: number; used: number };
};

export type PackageResult = { acceptedAt: string; items: number; cleared: number };
