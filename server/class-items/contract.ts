import { z } from "zod";
import type { OpenState } from "@/db/schema/work-order-states";

export const CLASS_ITEM_SORTS = ["reference", "component", "due", "state"] as const;
export type ClassItemSort = (typeof CLASS_ITEM_SORTS)[number];

export const ClassItemsQuery = z.object({
  sort: z.enum(CLASS_ITEM_SORTS, { message: `sort: one of ${CLASS_ITEM_SORTS.join(", ")}.` }).default("reference"),
});

/** One class-related routine as a surveyor goes through it. Days are the ship's, "YYYY-MM-DD". */
export type ClassItem = {
  vessel: { id: string; name: string; code: string };
  routineId: string;
  /** The routine's class item reference, else its component's. */
  reference: string | null;
  title: string;
  critical: boolean;
  component: { code: string; name: string };
  /** "every 12 months", "every 8,000 h" */
  interval: string;
  /** The anniversary an anchored routine keeps ("YYYY-MM-DD"), else null. */
  anniversary: string | null;
  lastDone: { day: string; hours: number | null } | null;
  workOrder: {
    id: string;
    number: string;
    state: OpenState;
    dueDay: string | null;
    dueHours: number | null;
    windowFrom: string | null;
    windowUntil: string | null;
  } | null;
  deferral: { status: "pending" | "approved"; toDay: string | null; toHours: number | null } | null;
};
