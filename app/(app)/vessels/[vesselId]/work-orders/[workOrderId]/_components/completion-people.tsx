"use client";

import { useFieldArray, type UseFormReturn } from "react-hook-form";
import type { z } from "zod";
import { Field } from "@/app/_components/forms/field";
import { useRankWords } from "@/app/_components/rank-words-provider";
import type { CompletionInput, WorkOrderDetail } from "@/server/completions/contract";
import { RANKS } from "@/server/routines/contract";

type Values = z.input<typeof CompletionInput>;
type Output = z.output<typeof CompletionInput>;
type Props = { form: UseFormReturn<Values, unknown, Output>; detail: WorkOrderDetail };

/** Who answers for the job and who did it: two different things on board, kept apart (issue 11). */
export function CompletionPeople({ form, detail }: Props) {
  const { label: rankLabel } = useRankWords();
  const { register, control, formState } = form;
  const rows = useFieldArray({ control, name: "workedBy" });
  const errors = formState.errors;
  const choices = detail.responsibleChoices;
  return (
    <fieldset className="grid gap-3">
      <legend className="label">Who answers for it, and who did the work</legend>
      <Field
        id="responsible"
        label="Responsible"
        hint="Often the chief engineer: kept apart from the people who did the work."
        error={errors.responsibleId?.message}
      >
        <select id="responsible" className="field" {...register("responsibleId")}>
          <option value="">Me (who records it)</option>
          {choices.map((c) => (
            <option key={c.id} value={c.id}>
              {c.name} — {c.rank ? rankLabel(c.rank) : c.role.replaceAll("-", " ")}
            </option>
          ))}
        </select>
      </Field>
      <div className="grid gap-2" role="group" aria-labelledby="worked-by-label">
        <p id="worked-by-label" className="text-sm">
          Done by
        </p>
        {rows.fields.map((row, i) => {
          const error = errors.workedBy?.[i]?.rank?.message ?? errors.workedBy?.[i]?.name?.message;
          return (
            <div key={row.id} className="grid gap-1">
              <div className="flex flex-wrap items-center gap-2">
                <select aria-label={`Rank of person ${i + 1}`} className="field w-48" {...register(`workedBy.${i}.rank`)}>
                  {RANKS.map((rank) => (
                    <option key={rank} value={rank}>
                      {rankLabel(rank)}
                    </option>
                  ))}
                </select>
                <input
                  aria-label={`Name of person ${i + 1}`}
                  placeholder="Name"
                  className="field w-56"
                  autoComplete="off"
                  {...register(`workedBy.${i}.name`)}
                />
                <button type="button" className="btn-quiet" onClick={() => rows.remove(i)}>
                  Remove<span className="sr-only"> person {i + 1}</span>
                </button>
              </div>
              {error && <p className="field-error">{error}</p>}
            </div>
          );
        })}
        <div>
          <button type="button" className="btn-quiet" onClick={() => rows.append({ rank: RANKS[0], name: "" })}>
            Add a person
          </button>
        </div>
        {errors.workedBy?.message && <p className="field-error">{errors.workedBy.message}</p>}
      </div>
    </fieldset>
  );
}
