// The Hour log form's schema: the same pieces as the route handler's contract, per counter.
import { z } from "zod";
import { CorrectionReason, MeterValue, type ReadingBatchInput, ShipClock, ShipDay } from "@/server/readings/contract";

export const HourLogForm = z
  .object({
    shipDay: ShipDay,
    time: ShipClock,
    values: z.record(z.string(), z.string()),
  })
  .superRefine((form, ctx) => {
    let filled = 0;
    for (const [counterId, raw] of Object.entries(form.values)) {
      if (!raw.trim()) continue;
      filled++;
      const parsed = MeterValue.safeParse(raw);
      if (!parsed.success) {
        ctx.addIssue({ code: "custom", path: ["values", counterId], message: parsed.error.issues[0]!.message });
      }
    }
    if (filled === 0) ctx.addIssue({ code: "custom", path: ["values"], message: "Enter at least one reading." });
  });
export type HourLogForm = z.infer<typeof HourLogForm>;

/** The batch the route handler takes: the filled rows, in the page's order. */
export function toBatch(form: HourLogForm, order: string[]): ReadingBatchInput {
  return {
    shipDay: form.shipDay,
    time: form.time,
    entries: order
      .filter((id) => form.values[id]?.trim())
      .map((counterId) => ({ counterId, value: form.values[counterId]!.trim() })),
  };
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
