// Completing a work order: the form's input, the record the chief approves, and the pure check of
// measurements against the routine's limits. Shared by the form (react-hook-form + zod) and the
// route handlers.
import { z } from "zod";
import type { RecordedMeasurement, RoutineCaution, RoutineMeasurement, UsedPart } from "@/db/schema";
import { enteredDay } from "@/server/http/dates";
import { MeterValue, SHIP_DAY_FORMAT, ShipClock } from "@/server/readings/contract";
import { RANKS } from "@/server/routines/ranks";
import { DUE_FIELDS, HEADING_FIELDS, JOB_FIELDS } from "@/server/work-orders/fields";
import type { WorkOrderView } from "@/server/work-orders/view";
import { type FittingPart, MAX_PARTS_USED, PartUsedRow } from "@/server/parts/contract";
import type { DefectView } from "@/server/defects/contract";

/** The most man-hours one job may take, spent or estimated (a routine's estimate has the same limit). */
export const MAX_JOB_MAN_HOURS = 9_999;

/** A number as typed on a tablet: "0.42", "0,42" or a number; a blank is not 0. */
function typedNumber(message: string) {
  return z.union([z.number(), z.string()], { message }).transform((raw, ctx) => {
    const text = typeof raw === "number" ? String(raw) : raw.trim().replace(",", ".");
    // A string of 400 digits is Infinity, which JSON would store as null.
    const ok = Number.isFinite(Number(text)) && (typeof raw === "number" || /^-?\d+(\.\d+)?$/.test(text));
    if (!ok) {
      ctx.addIssue({ code: "custom", message });
      return z.NEVER;
    }
    return Number(text);
  });
}

const Remark = z.string().trim().max(500, { message: "Keep the remark under 500 characters." });

export const MAX_WORKED_BY = 20;

export const WorkedByRow = z.object({
  rank: z.enum(RANKS, { message: "Choose the rank of the person who did the work." }),
  name: z.string({ message: "The name must be text." }).trim().max(80, { message: "Keep the name under 80 characters." }).default(""),
});

export const ChecklistTick = z.object({
  step: z.string().trim().min(1, { message: "A checklist step needs its text." }).max(500),
  done: z.boolean({ message: "Say whether the step was done." }),
  /** Why a step was not done: an unticked step without one is refused. */
  remark: Remark.optional(),
});
export type ChecklistTick = z.infer<typeof ChecklistTick>;

export const MeasurementValue = z.object({
  name: z.string().trim().min(1, { message: "A measurement needs its name." }).max(200),
  value: typedNumber("Enter the measured value as a number, e.g. 0.42."),
});
export type MeasurementValue = z.infer<typeof MeasurementValue>;

export const CompletionInput = z
  .object({
    doneOn: enteredDay("recorded", "The day the job was done", SHIP_DAY_FORMAT),
    time: ShipClock,
    /** The counter's total hours when the job was done; required for an hours routine (checked by the server). */
    counterHours: z.union([z.literal("").transform(() => null), MeterValue]).nullish(),
    manHours: typedNumber("Enter the man-hours spent as a number, e.g. 6.5.").pipe(
      z
        .number()
        .positive({ message: "Man-hours must be more than 0." })
        .max(MAX_JOB_MAN_HOURS, { message: "That is more man-hours than one job takes (at most 9,999)." }),
    ),
    checklist: z.array(ChecklistTick).max(200, { message: "At most 200 checklist steps." }),
    measurements: z.array(MeasurementValue).max(100, { message: "At most 100 measurements." }),
    remarks: z.string().trim().max(4_000, { message: "Keep the remarks under 4,000 characters." }).default(""),
    /** Who answers for the job; the person recording when left out. */
    responsibleId: z
      .union([z.literal("").transform(() => null), z.string().trim().min(1).max(100)], {
        message: "Choose the person responsible.",
      })
      .nullish(),
    workedBy: z
      .array(WorkedByRow, { message: "List who did the work by rank and name." })
      .max(MAX_WORKED_BY, { message: `At most ${MAX_WORKED_BY} people on one job.` })
      .default([]),
    /** The parts used, taken from the stores on board (prefilled from the routine's list). */
    partsUsed: z
      .array(PartUsedRow, { message: "List the parts used by part and quantity." })
      .max(MAX_PARTS_USED, { message: `At most ${MAX_PARTS_USED} different parts on one job.` })
      .default([]),
  })
  .superRefine((input, ctx) => {
    input.checklist.forEach((tick, index) => {
      if (!tick.done && !tick.remark) {
        ctx.addIssue({
          code: "custom",
          path: ["checklist", index, "remark"],
          message: `Step ${index + 1} is not ticked: tick it, or say in a remark why it was not done.`,
        });
      }
    });
  });
export type CompletionInput = z.input<typeof CompletionInput>;
export type Completion = z.output<typeof CompletionInput>;

export const DecisionInput = z
  .object({
    decision: z.enum(["approve", "return"], { message: "The decision is approve or return." }),
    note: z.string().trim().max(2_000, { message: "Keep the note under 2,000 characters." }).default(""),
    /** A defect's repair approved closes the defect: what caused it, and what prevents a repeat. */
    cause: z.string().trim().max(2_000, { message: "Keep the cause under 2,000 characters." }).default(""),
    action: z.string().trim().max(2_000, { message: "Keep the action under 2,000 characters." }).default(""),
  })
  .superRefine((input, ctx) => {
    if (input.decision === "return" && !input.note) {
      ctx.addIssue({ code: "custom", path: ["note"], message: "Say what needs correcting before returning it." });
    }
  });
export type DecisionInput = z.input<typeof DecisionInput>;

/** Where a value lies against its limits; null limits are open-ended. Limits themselves are inside. */
export function limitSide(m: Pick<RoutineMeasurement, "lower" | "upper">, value: number): "low" | "high" | null {
  if (m.lower !== null && value < m.lower) return "low";
  if (m.upper !== null && value > m.upper) return "high";
  return null;
}

/** Each value of a known measurement with its unit and limits, flagged when outside them. */
export function assessMeasurements(
  routineMeasurements: readonly RoutineMeasurement[],
  values: readonly MeasurementValue[],
): RecordedMeasurement[] {
  const byName = new Map(routineMeasurements.map((m) => [m.name, m]));
  return values.flatMap((v) => {
    const m = byName.get(v.name);
    if (!m) return [];
    return [
      {
        name: m.name,
        unit: m.unit,
        value: v.value,
        lower: m.lower,
        upper: m.upper,
        outOfLimits: limitSide(m, v.value) !== null,
      },
    ];
  });
}

/** Values that do not match the routine's measurements: unknown, repeated, or missing names. */
export function measurementMismatches(
  routineMeasurements: readonly RoutineMeasurement[],
  values: readonly MeasurementValue[],
): { field: string; message: string }[] {
  const known = new Set(routineMeasurements.map((m) => m.name));
  const seen = new Set<string>();
  const problems: { field: string; message: string }[] = [];
  values.forEach((v, index) => {
    if (!known.has(v.name)) {
      problems.push({
        field: `measurements.${index}.name`,
        message: `“${v.name}” is not a measurement of this routine.`,
      });
    } else if (seen.has(v.name)) {
      problems.push({ field: `measurements.${index}.name`, message: `“${v.name}” is entered twice.` });
    }
    seen.add(v.name);
  });
  for (const m of routineMeasurements) {
    if (!seen.has(m.name)) problems.push({ field: "measurements", message: `Enter the value of “${m.name}”.` });
  }
  return problems;
}

export type CompletionStatus = "awaiting-approval" | "approved" | "returned";

export type CompletionRecord = {
  id: string;
  status: CompletionStatus;
  doneAt: string;
  counterHours: number | null;
  manHours: number;
  checklist: ChecklistTick[];
  measurements: RecordedMeasurement[];
  remarks: string;
  doneBy: string | null;
  responsibleId: string | null;
  responsible: string | null;
  workedBy: { rank: string; name: string }[];
  partsUsed: UsedPart[];
  decidedBy: string | null;
  decidedAt: string | null;
  decisionNote: string | null;
};

export type ComponentHistoryEntry = {
  workOrderId: string;
  number: string;
  title: string;
  kind: "planned" | "corrective";
  doneAt: string;
  counterHours: number | null;
  manHours: number;
  doneBy: string | null;
  outOfLimits: string[];
  remarks: string;
};

/** The work order's own columns the work-order page shows. */
export const DETAIL_FIELDS = [
  ...HEADING_FIELDS,
  "kind",
  "occurrence",
  ...DUE_FIELDS,
  ...JOB_FIELDS,
  "completedAt",
] as const;

export type WorkOrderDetail = {
  vessel: { id: string; name: string; code: string; timeZone: string };
  now: string;
  workOrder: WorkOrderView<(typeof DETAIL_FIELDS)[number]>;
  component: { id: string; code: string; name: string };
  routine: {
    id: string;
    description: string;
    checklist: string[];
    intervalHours: number | null;
    calendarRule: string | null;
    measurements: RoutineMeasurement[];
    cautions: RoutineCaution[];
    spareParts: string;
  } | null;
  counter: { id: string; name: string; latest: { readAt: string; totalHours: number } | null } | null;
  /** An hours routine cannot be scheduled again without the counter value at completion. */
  counterRequired: boolean;
  completion: CompletionRecord | null;
  history: ComponentHistoryEntry[];
  may: { record: boolean; approve: boolean };
  /** The people of the company on this vessel who may answer for a job: the responsible person's choices. */
  responsibleChoices: { id: string; name: string; role: string; rank: string | null }[];
  /** The catalogue's parts that fit the component (or those above it), with what is on board. */
  partsOnBoard: FittingPart[];
  /** The defect report this work order repairs, if it is one. */
  defect: DefectView | null;
};

export type CompletionResult = { completionId: string; status: CompletionStatus; followUpNumber: string | null };
