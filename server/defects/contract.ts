// Defect reports: what the report form, the planning panel and the list send and get back, shared
// by the forms and the route handlers.
import { z } from "zod";
import type { DefectSource } from "@/db/schema/defects";
import type { PartUnit } from "@/db/schema/parts";
import { enteredDay } from "@/server/http/dates";
import { Quantity } from "@/server/parts/contract";
import { SHIP_DAY_FORMAT, ShipClock } from "@/server/readings/contract";
import { RANKS } from "@/server/routines/ranks";

export const DEFECT_STATES = ["reported", "planned", "done", "closed"] as const;
export type DefectState = (typeof DEFECT_STATES)[number];

export const DEFECT_STATE_WORDS: Record<DefectState, string> = {
  reported: "Reported",
  planned: "Planned",
  done: "Done, awaiting the chief",
  closed: "Closed",
};

const flag = (what: string) => z.boolean({ message: `${what}: true or false.` }).default(false);

export const DefectInput = z.object({
  componentId: z.uuid({ message: "Choose the component from the register." }),
  title: z
    .string({ message: "Say in a line what was found." })
    .trim()
    .min(3, { message: "Say in a line what was found, e.g. “Oil leak at the turbocharger drain”." })
    .max(200, { message: "Keep the line under 200 characters; say more in the details." }),
  description: z.string({ message: "Details: enter text." }).trim().max(4_000, { message: "Keep the details under 4,000 characters." }).default(""),
  foundOn: enteredDay("recorded", "The day it was found", SHIP_DAY_FORMAT),
  time: ShipClock,
  affectsCritical: flag("Critical equipment"),
  affectsSafety: flag("Safety"),
  affectsClass: flag("Class"),
  needsEngineStop: flag("Engine stop"),
});
export type DefectInput = z.input<typeof DefectInput>;
export type DefectValues = z.output<typeof DefectInput>;

/** A number as typed on a tablet: "6", "6.5" or "6,5". */
const ManHours = z
  .union([z.number(), z.string()], { message: "Enter the man-hours as a number, e.g. 6.5." })
  .transform((raw, ctx) => {
    const n = typeof raw === "number" ? raw : Number(raw.trim().replace(",", "."));
    if (!Number.isFinite(n) || n <= 0 || n > 9_999 || (typeof raw === "string" && !/^\d+([.,]\d)?$/.test(raw.trim()))) {
      ctx.addIssue({ code: "custom", message: "Enter the man-hours as a number more than 0, e.g. 6.5 (at most 9,999)." });
      return z.NEVER;
    }
    return Math.round(n * 10) / 10;
  });

export const DefectPlanInput = z.object({
  targetDay: enteredDay("planned", "The target day", "Pick the target day as a date (YYYY-MM-DD)."),
  rank: z.enum(RANKS, { message: "Choose the rank who does the repair." }),
  manHours: ManHours,
  parts: z
    .array(z.object({ partId: z.uuid({ message: "Choose the part from the catalogue." }), quantity: Quantity }), { message: "parts: a list of { partId, quantity }." })
    .max(50, { message: "At most 50 parts on one repair." })
    .default([]),
});
export type DefectPlanInput = z.input<typeof DefectPlanInput>;
export type DefectPlanValues = z.output<typeof DefectPlanInput>;

export const DefectListQuery = z.object({
  state: z.enum(["open", "all"], { message: "state: open or all." }).default("open"),
});

export type DefectView = {
  id: string;
  number: string;
  title: string;
  description: string;
  component: { id: string; code: string; name: string };
  foundAt: string;
  reportedBy: string | null;
  source: DefectSource;
  affectsCritical: boolean;
  affectsSafety: boolean;
  affectsClass: boolean;
  needsEngineStop: boolean;
  state: DefectState;
  /** The target ship's day once planned. */
  targetDay: string | null;
  rank: string;
  manHours: number;
  workOrder: { id: string; number: string; state: string };
  parts: { partId: string; number: string; description: string; unit: PartUnit; quantity: number }[];
  cause: string | null;
  action: string | null;
  closedAt: string | null;
  closedBy: string | null;
  /** Whole days since it was found. */
  ageDays: number;
};

export type DefectList = {
  vessel: { id: string; name: string; code: string; timeZone: string };
  defects: DefectView[];
  components: { id: string; code: string; name: string }[];
  canReport: boolean;
  canPlan: boolean;
};
