"use client";

import { type Control, useFieldArray, type UseFormRegister } from "react-hook-form";
import type { RoutineFormValues } from "./routine-form-values";

type Props = { control: Control<RoutineFormValues>; register: UseFormRegister<RoutineFormValues>; error?: string };

/** The ordered steps of the job: add, remove and move up or down. */
export function ChecklistEditor({ control, register, error }: Props) {
  const { fields, append, remove, move } = useFieldArray({ control, name: "checklist" });
  return (
    <fieldset className="grid gap-2" aria-describedby={error ? "routine-checklist-error" : undefined}>
      <legend className="label">Checklist</legend>
      {fields.length === 0 && (
        <p className="text-xs text-ink-500 dark:text-ink-400">No steps yet: add them in the order the job is done.</p>
      )}
      <ol className="grid gap-1.5">
        {fields.map((field, i) => (
          <li key={field.id} className="flex items-center gap-1.5">
            <span className="w-6 text-right text-xs text-ink-500 tabular-nums dark:text-ink-400">{i + 1}.</span>
            <input
              className="field"
              aria-label={`Step ${i + 1}`}
              autoComplete="off"
              {...register(`checklist.${i}.text` as const)}
            />
            <button
              type="button"
              className="btn-quiet px-2 py-1 text-xs"
              aria-label={`Move step ${i + 1} up`}
              disabled={i === 0}
              onClick={() => move(i, i - 1)}
            >
              ↑
            </button>
            <button
              type="button"
              className="btn-quiet px-2 py-1 text-xs"
              aria-label={`Move step ${i + 1} down`}
              disabled={i === fields.length - 1}
              onClick={() => move(i, i + 1)}
            >
              ↓
            </button>
            <button
              type="button"
              className="btn-quiet px-2 py-1 text-xs"
              aria-label={`Remove step ${i + 1}`}
              onClick={() => remove(i)}
            >
              Remove
            </button>
          </li>
        ))}
      </ol>
      <div>
        <button type="button" className="btn-quiet text-xs" onClick={() => append({ text: "" })}>
          Add step
        </button>
      </div>
      {error && (
        <p id="routine-checklist-error" className="field-error">
          {error}
        </p>
      )}
    </fieldset>
  );
}
