"use client";

import { type Control, type FieldErrors, useFieldArray, type UseFormRegister, useWatch } from "react-hook-form";
import { describedBy, Field } from "@/app/_components/forms/field";
import { useRankWords } from "@/app/_components/rank-words-provider";
import { formatManHours } from "@/server/format/hours";
import { MAX_TEAM_ROWS, RANKS } from "@/server/routines/contract";
import type { RoutineFormValues } from "./routine-form-values";

type Props = {
  control: Control<RoutineFormValues>;
  register: UseFormRegister<RoutineFormValues>;
  errors: FieldErrors<RoutineFormValues>;
};

/** "2 people × 12 h = 24 man-hours", or null while a figure is not a number yet. */
export function manHoursWords(team: { count: string }[], elapsed: string): string | null {
  const heads = team.reduce((sum, row) => sum + Number(row.count), 0);
  const hours = Number(elapsed.trim().replace(",", "."));
  if (!Number.isFinite(heads) || heads <= 0 || !Number.isFinite(hours) || hours <= 0) return null;
  const people = heads === 1 ? "1 person" : `${heads} people`;
  return `${people} × ${hours} h = ${formatManHours(Math.round(heads * hours * 10) / 10)}`;
}

/** Who does the job — ranks with their number of people — and how long it takes; man-hours follow. */
export function TeamEditor({ control, register, errors }: Props) {
  const { label: rankLabel } = useRankWords();
  const { fields, append, remove } = useFieldArray({ control, name: "team" });
  const team = useWatch({ control, name: "team" });
  const elapsed = useWatch({ control, name: "elapsedHours" });
  const words = manHoursWords(team ?? [], elapsed ?? "");
  const teamError = errors.team?.message ?? errors.team?.root?.message;
  return (
    <fieldset className="grid gap-2">
      <legend className="label">Team (the lead rank first)</legend>
      <ul className="grid gap-1.5">
        {fields.map((field, i) => {
          const error = errors.team?.[i]?.rank?.message ?? errors.team?.[i]?.count?.message;
          return (
            <li key={field.id} className="grid gap-1">
              <div className="flex flex-wrap items-center gap-1.5">
                <select
                  className="field w-56"
                  aria-label={`Rank, row ${i + 1}`}
                  {...describedBy(`team-${i}`, error)}
                  {...register(`team.${i}.rank` as const)}
                >
                  {RANKS.map((r) => (
                    <option key={r} value={r}>
                      {rankLabel(r)}
                    </option>
                  ))}
                </select>
                <span aria-hidden="true">×</span>
                <input
                  className="field w-20 text-right tabular-nums"
                  inputMode="numeric"
                  aria-label={`People of that rank, row ${i + 1}`}
                  {...register(`team.${i}.count` as const)}
                />
                <button
                  type="button"
                  className="btn-quiet px-2 py-1 text-xs"
                  disabled={fields.length === 1}
                  onClick={() => remove(i)}
                >
                  Remove<span className="sr-only"> rank row {i + 1}</span>
                </button>
              </div>
              {error && (
                <p id={`team-${i}-error`} className="field-error">
                  {error}
                </p>
              )}
            </li>
          );
        })}
      </ul>
      {fields.length < MAX_TEAM_ROWS && (
        <div>
          <button type="button" className="btn-quiet px-2 py-1 text-xs" onClick={() => append({ rank: "motorman", count: "1" })}>
            Add a rank
          </button>
        </div>
      )}
      {teamError && <p className="field-error">{teamError}</p>}
      <Field
        id="routine-elapsed"
        label="Elapsed time (hours from start to finish)"
        hint="Man-hours are the elapsed time × the team's people."
        error={errors.elapsedHours?.message}
      >
        <input
          className="field w-32"
          inputMode="decimal"
          {...describedBy("routine-elapsed", errors.elapsedHours?.message, true)}
          {...register("elapsedHours")}
        />
      </Field>
      {words && !errors.elapsedHours && (
        <p className="text-sm" aria-live="polite" data-testid="routine-man-hours">
          {words}
        </p>
      )}
    </fieldset>
  );
}
