// Deferrals: the chief engineer's request to postpone a work order's limit, the decision on it,
// and what the pages show. Shared by the forms and the route handlers.
import { z } from "zod";
import type { WorkOrderState } from "@/db/schema/work-order-states";
import type { WorkOrderDetail } from "@/server/completions/contract";
import { enteredDay } from "@/server/http/dates";
import { MAX_METER_HOURS, SHIP_DAY_FORMAT } from "@/server/readings/contract";
import { HEADING_FIELDS } from "@/server/work-orders/fields";
import type { WorkOrderView } from "@/server/work-orders/view";

export const REASON_MIN = 10;
export const REASON_MAX = 2_000;
export const REJECT_NOTE_MIN = 3;

/** Running hours as typed on a tablet: "24500", "24,500" or "24500.5"; a blank is no value. */
const LimitHours = z.union([z.number(), z.string()]).transform((raw, ctx) => {
  const text = typeof raw === "number" ? String(raw) : raw.trim().replace(/[\s_]/g, "");
  const normalised = /^\d{1,3}(,\d{3})+(\.\d+)?$/.test(text) ? text.replace(/,/g, "") : text.replace(",", ".");
  // No higher than a meter can show (the readings' limit, well inside the hours column).
  if (Number(normalised) > MAX_METER_HOURS) {
    ctx.addIssue({ code: "custom", message: "That is more running hours than a meter can show (9,999,999.9 h)." });
    return z.NEVER;
  }
  if (!/^\d+(\.\d)?$/.test(normalised) || Number(normalised) <= 0) {
    ctx.addIssue({
      code: "custom",
      message: "Enter the new limit in running hours, with at most one decimal (e.g. 24500).",
    });
    return z.NEVER;
  }
  return Number(normalised);
});

/** A field left blank (or out) is no value. */
function orBlank<T extends z.ZodType>(schema: T) {
  return z.preprocess((v) => (v === "" || v === undefined ? null : v), schema.nullable());
}

export const DeferralRequestInput = z
  .object({
    reason: z
      .string({ message: "Say why the work cannot be done by its limit." })
      .trim()
      .min(REASON_MIN, {
        message: `Give the reason in at least ${REASON_MIN} characters: what is missing, who is awaited, and why it is safe to wait.`,
      })
      .max(REASON_MAX, { message: `Keep the reason to ${REASON_MAX.toLocaleString("en-GB")} characters or fewer.` }),
    proposedDueDay: orBlank(enteredDay("planned", "The proposed due day", SHIP_DAY_FORMAT)),
    proposedDueHours: orBlank(LimitHours),
  })
  .superRefine((input, ctx) => {
    if (input.proposedDueDay === null && input.proposedDueHours === null) {
      ctx.addIssue({
        code: "custom",
        path: ["proposedDueDay"],
        message: "Propose a new due day, a new running-hours limit, or both.",
      });
    }
  });
export type DeferralRequestInput = z.input<typeof DeferralRequestInput>;
export type DeferralRequest = z.output<typeof DeferralRequestInput>;

export const DeferralDecisionInput = z
  .object({
    decision: z.enum(["approve", "reject"], { message: "The decision is approve or reject." }),
    note: z
      .string({ message: "The note must be text." })
      .trim()
      .max(REASON_MAX, { message: `Keep the note to ${REASON_MAX.toLocaleString("en-GB")} characters or fewer.` })
      .default(""),
  })
  .superRefine((input, ctx) => {
    if (input.decision === "reject" && input.note.length < REJECT_NOTE_MIN) {
      ctx.addIssue({
        code: "custom",
        path: ["note"],
        message: "Say why the deferral is rejected, so the chief engineer knows what to do instead.",
      });
    }
  });
export type DeferralDecisionInput = z.input<typeof DeferralDecisionInput>;
export type DeferralDecision = z.output<typeof DeferralDecisionInput>;

export const DeferralListQuery = z.object({
  status: z.enum(["pending", "all"], { message: "status is pending or all." }).default("pending"),
});

export const CompanySettingsInput = z.object({
  chiefDecidesDeferrals: z.boolean({ message: "Say true or false: may the chief engineer decide plain deferrals?" }),
});
export type CompanySettingsInput = z.infer<typeof CompanySettingsInput>;
export type CompanySettings = CompanySettingsInput;

export type DeferralStatus = "pending" | "approved" | "rejected" | "withdrawn";

export type DeferralEntry = {
  id: string;
  workOrderId: string;
  status: DeferralStatus;
  reason: string;
  proposedDueDay: string | null;
  proposedDueHours: number | null;
  needsOffice: boolean;
  requestedBy: string | null;
  requestedAt: string;
  /** Who decided, or who withdrew the request. */
  decidedBy: string | null;
  decidedAt: string | null;
  decisionNote: string | null;
};

/** The work order's own columns a list of requests shows beside each. */
export const DEFERRAL_LIST_FIELDS = [...HEADING_FIELDS, "critical", "classRelated"] as const;

/** A request as a list of a vessel's (or the fleet's) requests shows it, with its work order. */
export type DeferralListItem = DeferralEntry & {
  vessel: { id: string; name: string; code: string };
  workOrder: WorkOrderView<(typeof DEFERRAL_LIST_FIELDS)[number]>;
};

/** The work order page's Deferral section. */
export type WorkOrderDeferrals = {
  /** Newest first. */
  history: DeferralEntry[];
  /** The ship's day today, in the vessel's zone. */
  today: string;
  /** The limits in force: a deferral's when one was approved, else the computed due point. */
  current: { dueDate: string | null; dueHours: number | null; deferred: boolean; projected: boolean };
  /** Whether the work order falls due by running hours at all (only then may hours be proposed). */
  hasHoursLimit: boolean;
  /** The latest day a new request may propose. */
  latestDay: string;
  /** The highest running hours a new request may propose, or null when unbounded. */
  highestHours: number | null;
  /** How far the grace now runs past the due point: the same rule is applied to a new limit. */
  grace: { days: number | null; hours: number | null };
  /** A request now, or the pending one, needs the technical superintendent. */
  needsOffice: boolean;
  may: { request: boolean; decide: boolean; withdraw: boolean };
};

export type WorkOrderWithDeferrals = WorkOrderDetail & { deferrals: WorkOrderDeferrals };

export type DeferralResult = { id: string; status: DeferralStatus; workOrderState: WorkOrderState };
export type DeferralRequestResult = DeferralResult & { needsOffice: boolean };

export const DEFERRAL_STATUS_WORDS: Record<DeferralStatus, { glyph: string; words: string }> = {
  pending: { glyph: "◷", words: "awaiting a decision" },
  approved: { glyph: "✓", words: "approved" },
  rejected: { glyph: "✕", words: "rejected" },
  withdrawn: { glyph: "↩", words: "withdrawn" },
};

export const OFFICE_ONLY_MESSAGE =
  "This deferral needs the technical superintendent’s decision (critical / class-related work).";
export const COMPANY_OFFICE_MESSAGE =
  "This deferral needs the technical superintendent’s decision: your company has the office decide deferrals (company settings).";
