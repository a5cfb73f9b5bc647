// A port stay and its work package: what the chief engineer sends (stay form, edited package) and
// what the pages get back. Shared by the forms (react-hook-form + zod) and the route handlers.
// Arrival and departure are typed as the ship's clock shows them ("2026-12-04T07:00", vessel zone);
// the server turns them into instants with the vessel's zone (queries.ts).
import { z } from "zod";
import type { CrewOnBoard, PortWatchRow } from "@/db/schema/port-stays";
import { dayRangeProblem } from "@/server/http/dates";
import { optionalText, requiredText } from "@/server/http/text-fields";
import type { Group, Urgency } from "@/server/planning/job-classes";
import type { StayPlan } from "@/server/planning/stay-planner";
import type { LeftOutReason } from "@/server/planning/stay-plan-words";
import type { OpenState } from "@/db/schema/work-order-states";
import { RANKS } from "@/server/routines/contract";

export const MAX_STAY_DAYS = 30;
/** People of one rank on board for maintenance: more than any engine department has. */
export const MAX_HEADS_PER_RANK = 20;
export const MAX_WATCHES = 60;
export const MAX_PACKAGE_ITEMS = 500;
export const DEFAULT_WORKDAY = { from: "08:00", to: "17:00" } as const;

const SHIP_TIME = /^(\d{4})-(\d{2})-(\d{2})T([01]\d|2[0-3]):([0-5]\d)$/;
const CLOCK = /^([01]\d|2[0-3]):([0-5]\d)$|^24:00$/;

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

/** A time of the ship's day "HH:mm" ("24:00" for the end of the day). */
function clock(what: string) {
  return z
    .string({ message: `Enter the ${what} as a ship’s time, e.g. 08:00.` })
    .regex(CLOCK, { message: `Enter the ${what} as a 24-hour ship’s time, e.g. 08:00.` });
}

/** "08:30" → 510 minutes after the ship's midnight. */
export function clockMinutes(value: string): number {
  const [h, m] = value.split(":").map(Number) as [number, number];
  return h * 60 + m;
}

export const CrewRow = z.object({
  rank: z.enum(RANKS, { message: "Choose the rank." }),
  count: z
    .number({ message: "People: enter a whole number." })
    .int({ message: "People: enter a whole number." })
    .min(0, { message: "People: enter 0 or more." })
    .max(MAX_HEADS_PER_RANK, { message: `People: at most ${MAX_HEADS_PER_RANK} of one rank.` }),
});

export const WatchRow = z.object({
  rank: z.enum(RANKS, { message: "Choose the rank who keeps the watch." }),
  person: z
    .number({ message: "Person: enter which one of the rank (1, 2, …)." })
    .int({ message: "Person: enter a whole number." })
    .min(1, { message: "Person: the first of a rank is 1." })
    .max(MAX_HEADS_PER_RANK, { message: `Person: at most ${MAX_HEADS_PER_RANK}.` }),
  from: shipTime("watch's start"),
  to: shipTime("watch's end"),
  label: requiredText("watch (cargo, bunkering…)", 60),
});

/** Wall-clock minutes of a ship's time, ignoring clock changes (enough for "after" and "30 days"). */
export function shipTimeMinutes(value: string): number {
  const m = SHIP_TIME.exec(value);
  if (!m) return Number.NaN;
  return Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3]), Number(m[4]), Number(m[5])) / 60_000;
}

const EngineStop = z.object({ from: shipTime("engine stop's start"), to: shipTime("engine stop's end") });

const PortStayFields = z.object({
  port: requiredText("port name", 80),
  arrivesAt: shipTime("arrival"),
  departsAt: shipTime("departure"),
  workdayFrom: clock("working day's start"),
  workdayTo: clock("working day's end"),
  /** When the main engine may be immobilised, in the stay; null when it may not. */
  engineStop: EngineStop.nullable(),
  crew: z.array(CrewRow, { message: "List the crew on board per rank." }).max(RANKS.length, {
    message: `At most one row per rank (${RANKS.length}).`,
  }),
  watches: z
    .array(WatchRow, { message: "List the port watches." })
    .max(MAX_WATCHES, { message: `At most ${MAX_WATCHES} port watches in a stay.` }),
  remarks: optionalText("remarks", 2000).transform((v) => v ?? ""),
});

type Fields = z.output<typeof PortStayFields>;

function within(stay: Fields, from: string, to: string): boolean {
  return shipTimeMinutes(from) >= shipTimeMinutes(stay.arrivesAt) && shipTimeMinutes(to) <= shipTimeMinutes(stay.departsAt);
}

/** The rules between fields, each naming the field to correct. */
function checkStay(stay: Fields, ctx: z.RefinementCtx) {
  const issue = (path: (string | number)[], message: string) => ctx.addIssue({ code: "custom", path, message });
  const minutes = shipTimeMinutes(stay.departsAt) - shipTimeMinutes(stay.arrivesAt);
  if (minutes <= 0) issue(["departsAt"], "The departure must be after the arrival.");
  else if (minutes > MAX_STAY_DAYS * 24 * 60) {
    issue(["departsAt"], `A port stay lasts at most ${MAX_STAY_DAYS} days; enter a longer call as several stays.`);
  }
  if (clockMinutes(stay.workdayTo) <= clockMinutes(stay.workdayFrom)) {
    issue(["workdayTo"], "The working day ends after it starts, on the same day.");
  }
  if (stay.engineStop) {
    const { from, to } = stay.engineStop;
    if (shipTimeMinutes(to) <= shipTimeMinutes(from)) issue(["engineStop", "to"], "The engine stop ends after it starts.");
    else if (minutes > 0 && !within(stay, from, to)) {
      issue(["engineStop", "from"], "The engine stop lies within the stay, between arrival and departure.");
    }
  }
  const seen = new Map<string, number>();
  stay.crew.forEach((row, i) => {
    const first = seen.get(row.rank);
    if (first !== undefined) issue(["crew", i, "rank"], `This rank is already on row ${first + 1}: give each rank one row.`);
    else seen.set(row.rank, i);
  });
  // A repeated rank is reported above; its first row counts here.
  const heads = new Map([...stay.crew].reverse().map((row) => [row.rank, row.count]));
  stay.watches.forEach((w, i) => {
    const count = heads.get(w.rank) ?? 0;
    if (w.person > count) {
      issue(["watches", i, "person"], count === 0 ? "No one of this rank is in the crew list." : `The crew list has ${count} of this rank.`);
    }
    if (shipTimeMinutes(w.to) <= shipTimeMinutes(w.from)) issue(["watches", i, "to"], "The watch ends after it starts.");
    else if (minutes > 0 && !within(stay, w.from, w.to)) {
      issue(["watches", i, "from"], "A port watch lies within the stay, between arrival and departure.");
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

const PERSON_KEY = /^[a-z-]{1,40}#([1-9]|1\d|20)$/;

export const PackageItemInput = z.object({
  workOrderId: z.uuid({ message: "This is not a work-order id." }),
  /** When the job starts, on the ship's clock; it runs on the next working hours until done. */
  start: shipTime("job's start"),
  /** Who does it ("motorman#2"); the server picks the least-worked free people when left out. */
  people: z
    .array(z.string().regex(PERSON_KEY, { message: "Name a person as rank#number, e.g. motorman#2." }), {
      message: "List the people as rank#number.",
    })
    .max(MAX_HEADS_PER_RANK, { message: `At most ${MAX_HEADS_PER_RANK} people on one job.` })
    .optional(),
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
          message: `This work order is already item ${first + 1} of the package; a job goes in once.`,
        });
      } else {
        seen.set(item.workOrderId, i);
      }
    });
  });
export type PackageInput = z.input<typeof PackageInput>;

/* ---- What the pages get back ---- */

export type WatchView = PortWatchRow & { fromLocal: string; toLocal: string };

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
  workdayFrom: string;
  workdayTo: string;
  engineStop: { from: string; to: string; fromLocal: string; toLocal: string } | null;
  crew: CrewOnBoard[];
  watches: WatchView[];
  remarks: string;
  packageAcceptedAt: string | null;
  packageAcceptedBy: string | null;
  itemCount: number;
};

export type PortStayList = {
  timeZone: string;
  upcoming: PortStayView[];
  past: PortStayView[];
  /** The crew table and working day of the latest stay, to start a new one from. */
  latest: { crew: CrewOnBoard[]; workdayFrom: string; workdayTo: string } | null;
  may: { plan: boolean };
};

/** A work order as the package shows it, with the facts the planner and the page use. */
export type PackageJob = {
  workOrderId: string;
  number: string;
  title: string;
  componentCode: string;
  componentName: string;
  state: OpenState | "done";
  team: CrewOnBoard[];
  elapsedHours: number;
  manHours: number;
  needsEngineStop: boolean;
  needsPort: boolean;
  /** Falls due at this event of every stay (the steering-gear test before departure). */
  tiedTo: { event: "departure" | "arrival"; withinHours: number } | null;
  critical: boolean;
  classRelated: boolean;
  dueAt: string | null;
  planFrom: string | null;
  planUntil: string | null;
};

/** A job on the stay's clock: its working periods and its people. */
export type PlacedView = PackageJob & {
  start: string;
  end: string;
  /** The ship's clock value of the start, as the timeline moves it. */
  startLocal: string;
  segments: { from: string; to: string }[];
  people: string[];
  reason: string;
  /** Why the proposal took it; null for a job added by hand. */
  urgency: Urgency | null;
  group: Group;
};

export type PortStayDetail = {
  vessel: { id: string; name: string; code: string; timeZone: string };
  stay: PortStayView;
  /** The accepted package, by start. */
  items: PlacedView[];
  now: string;
  may: { plan: boolean };
};

export type LeftOutView = PackageJob & { urgency: Urgency; group: Group; reason: LeftOutReason; message: string };

export type ProposalView = {
  horizon: string;
  /** The next stay that sets the horizon, or null when the look-ahead does. */
  nextStay: { port: string; arrivesAt: string } | null;
  lookAheadDays: number | null;
  items: PlacedView[];
  leftOut: LeftOutView[];
  atSea: StayPlan["atSea"];
  people: StayPlan["people"];
  /** The priority-weighted work placed, and what placing every considered job would be worth. */
  value: number;
  possible: number;
  slotMinutes: number;
};

/** A problem with one item of a package (the timeline shows it on the job). */
export type PackageProblem = { item: number; field: "start" | "people" | "workOrderId"; message: string };

/** The package as the server would store it: each item placed, or the problems that refuse it. */
export type PackageCheck = { items: PlacedView[]; problems: PackageProblem[] };

export type PackageResult = { acceptedAt: string; items: number; cleared: number };
