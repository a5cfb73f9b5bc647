"use client";

import { useFieldArray, useWatch, type UseFormReturn } from "react-hook-form";
import type { z } from "zod";
import type { CompletionInput, WorkOrderDetail } from "@/server/completions/contract";
import { amountText, UNIT_LABEL } from "@/server/parts/contract";

type Values = z.input<typeof CompletionInput>;
type Output = z.output<typeof CompletionInput>;
type Props = { form: UseFormReturn<Values, unknown, Output>; detail: WorkOrderDetail };

/** The rows the form starts with: what was recorded before, or what the routine needs each time. */
export function startingPartsUsed(detail: WorkOrderDetail): NonNullable<Values["partsUsed"]> {
  if (detail.completion) return detail.completion.partsUsed.map((p) => ({ partId: p.partId, quantity: String(p.quantity), counted: "", reason: "" }));
  return detail.partsOnBoard.filter((p) => p.needed !== null).map((p) => ({ partId: p.id, quantity: String(p.needed), counted: "", reason: "" }));
}

const typed = (raw: unknown) => {
  const n = Number(String(raw ?? "").trim().replace(",", "."));
  return Number.isFinite(n) ? n : 0;
};

/**
 * The parts the job used, taken from the stores on board when it is recorded (and put back if the
 * chief returns it). More than the stores record asks for a count before the job, with its reason.
 */
export function CompletionParts({ form, detail }: Props) {
  const { register, control, formState } = form;
  const rows = useFieldArray({ control, name: "partsUsed" });
  const values = useWatch({ control, name: "partsUsed" }) ?? [];
  const errors = formState.errors.partsUsed;
  const choices = detail.partsOnBoard;
  const byId = new Map(choices.map((p) => [p.id, p]));
  const unused = choices.find((p) => !values.some((v) => v.partId === p.id));
  return (
    <fieldset className="grid gap-2">
      <legend className="label">Parts used</legend>
      {choices.length === 0 ? (
        <p className="text-sm text-ink-500">No part of the catalogue fits this component or is listed for its routine; nothing is taken from the stores.</p>
      ) : (
        <p className="text-sm text-ink-500">Taken from the stores on board when you record the job; put back if the chief engineer returns it.</p>
      )}
      {rows.fields.map((row, i) => {
        const chosen = byId.get(values[i]?.partId ?? "");
        const over = chosen ? typed(values[i]?.quantity) > chosen.onBoard : false;
        const e = errors?.[i];
        const rowError = e?.partId?.message ?? e?.quantity?.message;
        const countError = e?.counted?.message ?? e?.reason?.message;
        return (
          <div key={row.id} className="grid gap-1 rounded-md border border-ink-200 p-2 dark:border-ink-800">
            <div className="flex flex-wrap items-center gap-2">
              <select aria-label={`Part used ${i + 1}`} className="field min-w-0 flex-1" {...register(`partsUsed.${i}.partId`)}>
                {choices.map((p) => (
                  <option key={p.id} value={p.id}>
                    {p.number} — {p.description} (on board {amountText(p.onBoard, p.unit)})
                  </option>
                ))}
              </select>
              <input
                aria-label={`Quantity of part used ${i + 1}`}
                className="field w-24 text-right tabular-nums"
                inputMode="decimal"
                autoComplete="off"
                aria-invalid={e?.quantity ? true : undefined}
                {...register(`partsUsed.${i}.quantity`)}
              />
              <span className="w-10 text-sm text-ink-500">{chosen ? UNIT_LABEL[chosen.unit] : ""}</span>
              <button type="button" className="btn-quiet" onClick={() => rows.remove(i)}>
                Remove<span className="sr-only"> part used {i + 1}</span>
              </button>
            </div>
            {rowError && <p className="field-error">{rowError}</p>}
            {(over || e?.counted || e?.reason) && chosen && (
              <div className="grid gap-2 pl-1 sm:grid-cols-[auto_1fr]" role="group" aria-label={`Count of part used ${i + 1}`}>
                <p className="text-sm sm:col-span-2">
                  More than the {amountText(chosen.onBoard, chosen.unit)} the stores record: say what was on board before the job, and why the record differs.
                </p>
                <input
                  aria-label={`Counted on board before the job, part used ${i + 1}`}
                  placeholder="Counted"
                  className="field w-28 text-right tabular-nums"
                  inputMode="decimal"
                  autoComplete="off"
                  {...register(`partsUsed.${i}.counted`)}
                />
                <input
                  aria-label={`Why the record differs, part used ${i + 1}`}
                  placeholder="Why the record differs"
                  className="field"
                  autoComplete="off"
                  {...register(`partsUsed.${i}.reason`)}
                />
                {countError && <p className="field-error sm:col-span-2">{countError}</p>}
              </div>
            )}
          </div>
        );
      })}
      {unused && (
        <div>
          <button type="button" className="btn-quiet" onClick={() => rows.append({ partId: unused.id, quantity: "1", counted: "", reason: "" })}>
            Add a part used
          </button>
        </div>
      )}
      {errors?.message && <p className="field-error">{errors.message}</p>}
      {errors?.root?.message && <p className="field-error">{errors.root.message}</p>}
    </fieldset>
  );
}
