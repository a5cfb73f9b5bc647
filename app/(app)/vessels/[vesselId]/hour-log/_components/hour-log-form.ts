// The Hour log form's schema: the batch contract's shape (day, time, `entries[]`), with a row for
// every counter; a row left empty is not sent.
import { z } from "zod";
import {
  CorrectionReason,
  MeterValue,
  ReadingEntry,
  type ReadingBatchInput,
  ShipClock,
  ShipDay,
} from "@/server/readings/contract";

const isFilled = (entry: { value: string }) => entry.value.trim() !== "";

const HourLogEntry = z.object({
  counterId: ReadingEntry.shape.counterId,
  value: z.string().superRefine((raw, ctx) => {
    if (!raw.trim()) return;
    const parsed = MeterValue.safeParse(raw);
    if (!parsed.success) ctx.addIssue({ code: "custom", message: parsed.error.issues[0]!.message });
  }),
});

export const HourLogForm = z.object({
  shipDay: ShipDay,
  time: ShipClock,
  entries: z
    .array(HourLogEntry)
    .refine((entries) => entries.some(isFilled), { message: "Enter at least one reading." }),
});
export type HourLogForm = z.infer<typeof HourLogForm>;

/** A row per counter, in the page's order, nothing typed yet. */
export function emptyEntries(counterIds: readonly string[]): HourLogForm["entries"] {
  return counterIds.map((counterId) => ({ counterId, value: "" }));
}

/** The batch the route handler takes: the filled rows, in the page's order. */
export function toBatch(form: HourLogForm): ReadingBatchInput {
  return {
    shipDay: form.shipDay,
    time: form.time,
    entries: form.entries.filter(isFilled).map(({ counterId, value }) => ({ counterId, value: value.trim() })),
  };
}

/**
 * The form's field for a field of the batch: the batch's row N is the form's Nth filled row, and
 * whatever the server says of a row (its value, its counter) goes beside the row's one input.
 */
export function formFieldOfBatch(field: string, form: HourLogForm): string {
  const row = /^entries\.(\d+)\./.exec(field)?.[1];
  if (row === undefined) return field;
  const filled = form.entries.flatMap((entry, index) => (isFilled(entry) ? [index] : []));
  const index = filled[Number(row)];
  return index === undefined ? field : `entries.${index}.value`;
}

/**
 * The correction panel's schema: a corrected value, or the removal of the reading; a reason either
 * way (the same rule as the route handler's contract).
 */
export const CorrectionForm = z
  .object({
    remove: z.boolean(),
    value: z.string(),
    remark: z.string(),
    reason: CorrectionReason,
  })
  .superRefine((form, ctx) => {
    if (form.remove) return;
    const parsed = MeterValue.safeParse(form.value);
    if (!parsed.success) ctx.addIssue({ code: "custom", path: ["value"], message: parsed.error.issues[0]!.message });
  });
export type CorrectionFormValues = z.input<typeof CorrectionForm>;
export type CorrectionFormOutput = z.output<typeof CorrectionForm>;
