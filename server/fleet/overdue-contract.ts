// The fleet's overdue list (GET /api/fleet/overdue and its CSV): every late or out-of-tolerance
// work order of the company's vessels in service, the worst first. Shared by the page and the route.
import { z } from "zod";
import { OVERDUE_STATES } from "@/db/schema/work-order-states";
import { HEADING_FIELDS } from "@/server/work-orders/fields";
import type { WorkOrderView } from "@/server/work-orders/view";

export { OVERDUE_STATES };
export type OverdueState = (typeof OVERDUE_STATES)[number];

export const FleetOverdueQuery = z.object({
  state: z
    .enum(OVERDUE_STATES, { message: `state is ${OVERDUE_STATES.join(" or ")} (or left out for both).` })
    .optional(),
  /** Only critical or class-related work. */
  flagged: z
    .enum(["true", "false"], { message: "flagged is true or false." })
    .transform((v) => v === "true")
    .optional(),
  vesselId: z.uuid({ message: "vesselId must be a vessel id." }).optional(),
});
export type FleetOverdueFilter = z.output<typeof FleetOverdueQuery>;

/** The work order's own columns the overdue list shows as they are stored. */
export const OVERDUE_FIELDS = [...HEADING_FIELDS, "rank", "critical", "classRelated", "plannedDate"] as const;

export type FleetOverdueItem = Omit<WorkOrderView<(typeof OVERDUE_FIELDS)[number]>, "state"> & {
  vessel: { id: string; name: string; code: string };
  component: { code: string; name: string };
  state: OverdueState;
  /** When it became late or out of tolerance. */
  since: string;
  /** The limit in force: the approved deferral's, else the computed one. */
  dueDay: string | null;
  dueHours: number | null;
  /** Whole ship's days past `dueDay`; null when the limit is in hours only. */
  daysOverdue: number | null;
  /** Hours past the due point (positive), when it is hours-based. */
  hoursOverdue: number | null;
  pendingDeferral: boolean;
  awaitingApproval: boolean;
};

export type FleetOverdue = {
  generatedAt: string;
  vessels: { id: string; name: string; code: string }[];
  items: FleetOverdueItem[];
  /** More matched than the list carries (`items` stops at the limit). */
  truncated: boolean;
};
