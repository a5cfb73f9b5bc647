"use client";

import { type Control, type FieldErrors, useFieldArray, type UseFormRegister } from "react-hook-form";
import type { RoutineFormValues } from "./routine-form-values";

type Props = {
  control: Control<RoutineFormValues>;
  register: UseFormRegister<RoutineFormValues>;
  errors: FieldErrors<RoutineFormValues>;
};

/** What is measured on the job, with the maker's limits; a recorded value outside them is flagged. */
export function MeasurementsEditor({ control, register, errors }: Props) {
  const { fields, append, remove } = useFieldArray({ control, name: "measurements" });
  return (
    <fieldset className="grid gap-2">
      <legend className="label">Measurements to record</legend>
      {fields.length > 0 && (
        <div className="grid grid-cols-[1fr_5rem_5.5rem_5.5rem_4.5rem] gap-1.5 text-xs text-ink-500 dark:text-ink-400">
          <span>Name</span>
          <span>Unit</span>
          <span>Lower limit</span>
          <span>Upper limit</span>
          <span />
        </div>
      )}
      {fields.map((field, i) => {
        const rowErrors = errors.measurements?.[i];
        const message =
          rowErrors?.name?.message ??
          rowErrors?.unit?.message ??
          rowErrors?.lower?.message ??
          rowErrors?.upper?.message;
        return (
          <div key={field.id} className="grid gap-1">
            <div className="grid grid-cols-[1fr_5rem_5.5rem_5.5rem_4.5rem] gap-1.5">
              <input
                className="field"
                aria-label={`Measurement ${i + 1} name`}
                aria-invalid={rowErrors?.name ? true : undefined}
                {...register(`measurements.${i}.name` as const)}
              />
              <input
                className="field"
                aria-label={`Measurement ${i + 1} unit`}
                {...register(`measurements.${i}.unit` as const)}
              />
              <input
                className="field"
                inputMode="decimal"
                aria-label={`Measurement ${i + 1} lower limit`}
                aria-invalid={rowErrors?.lower ? true : undefined}
                {...register(`measurements.${i}.lower` as const)}
              />
              <input
                className="field"
                inputMode="decimal"
                aria-label={`Measurement ${i + 1} upper limit`}
                aria-invalid={rowErrors?.upper ? true : undefined}
                {...register(`measurements.${i}.upper` as const)}
              />
              <button
                type="button"
                className="btn-quiet px-2 py-1 text-xs"
                aria-label={`Remove measurement ${i + 1}`}
                onClick={() => remove(i)}
              >
                Remove
              </button>
            </div>
            {message && <p className="field-error">{message}</p>}
          </div>
        );
      })}
      <div>
        <button
          type="button"
          className="btn-quiet text-xs"
          onClick={() => append({ name: "", unit: "mm", lower: "", upper: "" })}
        >
          Add measurement
        </button>
      </div>
      <p className="text-xs text-ink-500 dark:text-ink-400">
        Limits from the maker’s instruction manual; leave one empty where only the other applies.
      </p>
    </fieldset>
  );
}
