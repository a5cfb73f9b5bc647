"use client";
// The stay form's two tables: the crew on board per rank, and the port watches that keep people
// from maintenance (cargo, bunkering…).
import { useFieldArray, useWatch, type UseFormReturn } from "react-hook-form";
import { describedBy } from "@/app/_components/forms/field";
import type { PortStayInput, PortStayValues } from "@/server/port-stays/contract";
import { RANKS } from "@/server/routines/contract";
import { useRankWords } from "@/app/_components/rank-words-provider";

type Form = UseFormReturn<PortStayInput, unknown, PortStayValues>;

function RowError({ id, message }: { id: string; message: string | undefined }) {
  return message ? (
    <p id={`${id}-error`} className="field-error">
      {message}
    </p>
  ) : null;
}

const SMALL_LABEL = "text-xs text-ink-600 dark:text-ink-300";

function RankSelect({ form, name, id, label, error, visible = false }: { form: Form; name: `crew.${number}.rank` | `watches.${number}.rank`; id: string; label: string; error?: string; visible?: boolean }) {
  const { label: rankLabel } = useRankWords();
  return (
    <div className="min-w-0">
      <label htmlFor={id} className={visible ? SMALL_LABEL : "sr-only"}>
        {label}
      </label>
      <select className="field" {...describedBy(id, error)} {...form.register(name)}>
        {RANKS.map((r) => (
          <option key={r} value={r}>
            {rankLabel(r)}
          </option>
        ))}
      </select>
      <RowError id={id} message={error} />
    </div>
  );
}

export function CrewRows({ form }: { form: Form }) {
  const { control, register, formState } = form;
  const rows = useFieldArray({ control, name: "crew" });
  const used = new Set((useWatch({ control, name: "crew" }) ?? []).map((c) => c?.rank));
  const errors = formState.errors.crew;
  return (
    <fieldset className="grid gap-2">
      <legend className="label">Crew on board for maintenance</legend>
      {rows.fields.length === 0 && (
        <p className="text-sm text-ink-600 dark:text-ink-300">No ranks yet: add the ranks who do maintenance in port.</p>
      )}
      {rows.fields.map((row, i) => {
        const countError = errors?.[i]?.count?.message;
        return (
          <div key={row.id} className="grid grid-cols-[1fr_6rem_auto] items-start gap-2">
            <RankSelect form={form} name={`crew.${i}.rank`} id={`crew-${i}-rank`} label={`Rank, row ${i + 1}`} error={errors?.[i]?.rank?.message} />
            <div>
              <label htmlFor={`crew-${i}-count`} className="sr-only">
                Number of people, row {i + 1}
              </label>
              <input type="number" min={0} step={1} inputMode="numeric" className="field" {...describedBy(`crew-${i}-count`, countError)} {...register(`crew.${i}.count`, { valueAsNumber: true })} />
              <RowError id={`crew-${i}-count`} message={countError} />
            </div>
            <button type="button" className="btn-quiet min-h-6 px-2" onClick={() => rows.remove(i)}>
              Remove<span className="sr-only"> crew row {i + 1}</span>
            </button>
          </div>
        );
      })}
      {errors?.message && <p className="field-error">{errors.message}</p>}
      <div>
        <button
          type="button"
          className="btn-quiet"
          disabled={used.size >= RANKS.length}
          onClick={() => rows.append({ rank: RANKS.find((r) => !used.has(r)) ?? RANKS[0], count: 1 })}
        >
          Add a rank
        </button>
      </div>
    </fieldset>
  );
}

export function WatchRows({ form }: { form: Form }) {
  const { control, register, formState, getValues } = form;
  const rows = useFieldArray({ control, name: "watches" });
  const errors = formState.errors.watches;
  return (
    <fieldset className="grid gap-2">
      <legend className="label">Port watches</legend>
      <p className="text-xs text-ink-600 dark:text-ink-300">
        Who is on watch when (cargo, bunkering…): the planner keeps their jobs out of those hours.
      </p>
      {rows.fields.map((row, i) => {
        const e = errors?.[i];
        const id = (k: string) => `watches-${i}-${k}`;
        return (
          <div key={row.id} className="grid gap-2 rounded-md border border-ink-200 p-2 sm:grid-cols-[minmax(0,1fr)_6rem_minmax(0,1fr)] dark:border-ink-800">
            <RankSelect form={form} name={`watches.${i}.rank`} id={id("rank")} label={`Watch ${i + 1}: rank`} error={e?.rank?.message} visible />
            <div>
              <label htmlFor={id("person")} className={SMALL_LABEL}>
                Watch {i + 1}: person no.
              </label>
              <input type="number" min={1} step={1} className="field" title="Which one of the rank: 1, 2…" {...describedBy(id("person"), e?.person?.message)} {...register(`watches.${i}.person`, { valueAsNumber: true })} />
              <RowError id={id("person")} message={e?.person?.message} />
            </div>
            <div>
              <label htmlFor={id("label")} className={SMALL_LABEL}>
                Watch {i + 1}: what (cargo, bunkering…)
              </label>
              <input className="field" placeholder="cargo, bunkering…" {...describedBy(id("label"), e?.label?.message)} {...register(`watches.${i}.label`)} />
              <RowError id={id("label")} message={e?.label?.message} />
            </div>
            <div className="grid grid-cols-[minmax(0,1fr)_minmax(0,1fr)_auto] items-start gap-2 sm:col-span-3">
              {(["from", "to"] as const).map((k) => (
                <div key={k}>
                  <label htmlFor={id(k)} className={SMALL_LABEL}>
                    Watch {i + 1} {k}
                  </label>
                  <input type="datetime-local" className="field" {...describedBy(id(k), e?.[k]?.message)} {...register(`watches.${i}.${k}`)} />
                  <RowError id={id(k)} message={e?.[k]?.message} />
                </div>
              ))}
              <button type="button" className="btn-quiet mt-5 min-h-6 px-2" onClick={() => rows.remove(i)}>
                Remove<span className="sr-only"> watch {i + 1}</span>
              </button>
            </div>
          </div>
        );
      })}
      {errors?.message && <p className="field-error">{errors.message}</p>}
      <div>
        <button
          type="button"
          className="btn-quiet"
          onClick={() => {
            const arrival = getValues("arrivesAt");
            rows.append({ rank: getValues("crew")[0]?.rank ?? RANKS[0], person: 1, from: arrival, to: arrival, label: "" });
          }}
        >
          Add a watch
        </button>
      </div>
    </fieldset>
  );
}
