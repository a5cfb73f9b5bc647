// The Backlog's query and answer, shared by the page and the route handler.
import { z } from "zod";
import { OPEN_STATES_BY_URGENCY, STATES_BY_URGENCY, type WorkOrderState } from "@/db/schema/work-order-states";
import { DUE_FIELDS, HEADING_FIELDS, JOB_FIELDS } from "@/server/work-orders/fields";
import type { WorkOrderView } from "@/server/work-orders/view";

/** The Backlog's state tabs, most urgent first; open work unless the filter says otherwise. */
export const OPEN_STATES = OPEN_STATES_BY_URGENCY;
export const ALL_STATES = STATES_BY_URGENCY;
export type BacklogState = WorkOrderState;

export const BACKLOG_SORTS = ["urgency", "due", "-due", "number", "component", "remaining-hours"] as const;

const flag = z
  .enum(["true", "false"], { message: "Use true or false." })
  .transform((v) => v === "true")
  .optional();

export const BacklogQuery = z.object({
  state: z
    .string()
    .optional()
    .transform((v, ctx) => {
      if (!v) return [...OPEN_STATES] as BacklogState[];
      const states = v
        .split(",")
        .map((s) => s.trim())
        .filter(Boolean);
      const unknown = states.filter((s) => !(ALL_STATES as readonly string[]).includes(s));
      if (unknown.length) {
        ctx.addIssue({ code: "custom", message: `Unknown state ${unknown.join(", ")}; use ${ALL_STATES.join(", ")}.` });
        return z.NEVER;
      }
      return states as BacklogState[];
    }),
  component: z.string().uuid({ message: "component must be a component id." }).optional(),
  rank: z.string().trim().min(1).max(40).optional(),
  engineStop: flag,
  critical: flag,
  classRelated: flag,
  /** Only unplanned work: defect reports (and the follow-ups of measurements out of limits). */
  defects: flag,
  dueBefore: z.iso.date({ message: "dueBefore is a date, YYYY-MM-DD." }).optional(),
  /** Only work orders with a deferral request awaiting a decision. */
  deferral: z.enum(["pending"], { message: "deferral is pending (or left out)." }).optional(),
  q: z.string().trim().max(80, { message: "Search at most 80 characters." }).optional(),
  sort: z.enum(BACKLOG_SORTS, { message: `sort is one of ${BACKLOG_SORTS.join(", ")}.` }).default("urgency"),
  // A vessel's backlog is thousands of rows, not millions: 10,000 pages keeps the offset small.
  page: z.coerce
    .number({ message: "page is a number." })
    .int()
    .min(1, { message: "page starts at 1." })
    .max(10_000, { message: "page is at most 10,000." })
    .default(1),
  pageSize: z.coerce
    .number({ message: "pageSize is a number." })
    .int()
    .min(1, { message: "pageSize is at least 1." })
    .max(200, { message: "pageSize is at most 200." })
    .default(50),
});
export type BacklogQueryInput = z.input<typeof BacklogQuery>;
export type BacklogFilter = z.output<typeof BacklogQuery>;

/** The work order's own columns a Backlog row carries. */
export const BACKLOG_FIELDS = [
  ...HEADING_FIELDS,
  "kind",
  "stateChangedAt",
  ...DUE_FIELDS,
  "plannedDate",
  ...JOB_FIELDS,
  "computedAt",
  "completedAt",
] as const;

export type BacklogItem = WorkOrderView<(typeof BACKLOG_FIELDS)[number]> & {
  component: { id: string; code: string; name: string };
  /** A completion is recorded and waits for the chief engineer's approval. */
  awaitingApproval: boolean;
  /** A deferral request waits for the chief's or the superintendent's decision. */
  pendingDeferral: boolean;
};

export type BacklogPage = {
  items: BacklogItem[];
  /** Per state, under every filter but the state filter: the tabs' figures. */
  counts: Record<BacklogState, number>;
  total: number;
  page: number;
  pageSize: number;
  /** Open work orders of the vessel with a deferral request awaiting a decision, under no filter. */
  pendingDeferrals: number;
  /** When the worker last wrote these rows. */
  computedAt: string | null;
};
