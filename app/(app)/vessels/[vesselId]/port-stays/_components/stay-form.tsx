"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useFieldArray, useForm, useWatch } from "react-hook-form";
import { describedBy, Field } from "@/app/_components/forms/field";
import { FormActions } from "@/app/_components/forms/form-actions";
import { rowFields, useSendForm } from "@/app/_components/forms/use-send-form";
import type { CrewCapacity } from "@/db/schema/port-stays";
import { PortStayInput, type PortStayValues, type PortStayView } from "@/server/port-stays/contract";
import { RANKS } from "@/server/routines/contract";
import { rankLabel } from "./stay-words";
import { useSaveStay } from "./use-port-stays";

type Props = {
  vesselId: string;
  timeZone: string;
  stay?: PortStayView;
  /** The crew of the latest stay, to start a new stay from. */
  crew: CrewCapacity[];
  onDone: (message: string, saved: PortStayView) => void;
};

const FIELDS = ["port", "arrivesAt", "departsAt", "engineMayStop", "immobilisationHours", "crew", "remarks"] as const;

/** Stored crew rows as the form's rows (every stored rank passed the contract). */
function crewRows(crew: CrewCapacity[]): PortStayInput["crew"] {
  return crew.flatMap((c) => {
    const rank = RANKS.find((r) => r === c.rank);
    return rank ? [{ rank, manHoursPerDay: c.manHoursPerDay }] : [];
  });
}

export function StayForm({ vesselId, timeZone, stay, crew, onDone }: Props) {
  const save = useSaveStay(vesselId);
  const form = useForm<PortStayInput, unknown, PortStayValues>({
    resolver: zodResolver(PortStayInput),
    defaultValues: stay
      ? {
          port: stay.port,
          arrivesAt: stay.arrivesLocal,
          departsAt: stay.departsLocal,
          engineMayStop: stay.engineMayStop,
          immobilisationHours: stay.immobilisationHours,
          crew: crewRows(stay.crew),
          remarks: stay.remarks,
        }
      : {
          port: "",
          arrivesAt: "",
          departsAt: "",
          engineMayStop: false,
          immobilisationHours: 0,
          crew: crewRows(crew),
          remarks: "",
        },
  });
  const { register, formState, control } = form;
  const rows = useFieldArray({ control, name: "crew" });
  const { errors, isSubmitting } = formState;
  const engineMayStop = useWatch({ control, name: "engineMayStop" });
  const usedRanks = new Set((useWatch({ control, name: "crew" }) ?? []).map((c) => c?.rank));

  const { onSubmit, problem } = useSendForm(form, {
    // Errors on crew rows name the row's field (crew.2.manHoursPerDay): put them there.
    fields: (values) => [...rowFields("crew", values.crew.length, ["rank", "manHoursPerDay"]), ...FIELDS],
    send: async (values) => {
      const saved = await save.mutateAsync({ id: stay?.id, values });
      onDone(stay ? `${saved.port} saved.` : `${saved.port} added.`, saved);
    },
  });

  const described = (field: (typeof FIELDS)[number], hasHint = false) =>
    describedBy(`stay-${field}`, errors[field]?.message, hasHint);

  return (
    <form onSubmit={onSubmit} noValidate className="grid gap-4">
      <Field id="stay-port" label="Port" error={errors.port?.message}>
        <input className="field" autoComplete="off" {...described("port")} {...register("port")} />
      </Field>
      <div className="grid gap-3 sm:grid-cols-2">
        <Field id="stay-arrivesAt" label="Arrival" error={errors.arrivesAt?.message} hint={`Ship’s time, ${timeZone}`}>
          <input type="datetime-local" className="field" {...described("arrivesAt", true)} {...register("arrivesAt")} />
        </Field>
        <Field
          id="stay-departsAt"
          label="Departure"
          error={errors.departsAt?.message}
          hint={`Ship’s time, ${timeZone}`}
        >
          <input type="datetime-local" className="field" {...described("departsAt", true)} {...register("departsAt")} />
        </Field>
      </div>
      <fieldset className="grid gap-3 rounded-md border border-ink-200 p-3 dark:border-ink-800">
        <legend className="px-1 text-xs font-semibold tracking-wide text-ink-600 uppercase dark:text-ink-300">
          Main engine
        </legend>
        <label className="flex items-center gap-2">
          <input
            type="checkbox"
            aria-invalid={errors.engineMayStop ? true : undefined}
            aria-describedby={errors.engineMayStop ? "stay-engineMayStop-error" : undefined}
            {...register("engineMayStop")}
          />
          May be immobilised in this port (terminal’s or port authority’s consent)
        </label>
        {errors.engineMayStop?.message && (
          <p id="stay-engineMayStop-error" className="field-error">
            {errors.engineMayStop.message}
          </p>
        )}
        <Field
          id="stay-immobilisationHours"
          label="Immobilisation allowed (h)"
          error={errors.immobilisationHours?.message}
          hint={
            engineMayStop
              ? "Hours the engine may stay stopped for work, over the whole stay."
              : "0 while the engine may not stop."
          }
        >
          <input
            type="number"
            inputMode="decimal"
            step="0.5"
            min={0}
            className="field w-32"
            {...described("immobilisationHours", true)}
            {...register("immobilisationHours", { valueAsNumber: true })}
          />
        </Field>
      </fieldset>
      <fieldset className="grid gap-2">
        <legend className="label">Crew’s maintenance hours per day</legend>
        {rows.fields.length === 0 && (
          <p className="text-sm text-ink-500 dark:text-ink-400">
            No ranks yet: add the ranks who do maintenance in port.
          </p>
        )}
        {rows.fields.map((row, i) => {
          const rankError = errors.crew?.[i]?.rank?.message;
          const hoursError = errors.crew?.[i]?.manHoursPerDay?.message;
          return (
            <div key={row.id} className="grid grid-cols-[1fr_7rem_auto] items-start gap-2">
              <div>
                <label htmlFor={`crew-${i}-rank`} className="sr-only">
                  Rank, row {i + 1}
                </label>
                <select className="field" {...describedBy(`crew-${i}-rank`, rankError)} {...register(`crew.${i}.rank`)}>
                  {RANKS.map((r) => (
                    <option key={r} value={r}>
                      {rankLabel(r)}
                    </option>
                  ))}
                </select>
                {rankError && (
                  <p id={`crew-${i}-rank-error`} className="field-error">
                    {rankError}
                  </p>
                )}
              </div>
              <div>
                <label htmlFor={`crew-${i}-hours`} className="sr-only">
                  Man-hours a day, row {i + 1}
                </label>
                <div className="flex items-center gap-1">
                  <input
                    type="number"
                    inputMode="decimal"
                    step="0.5"
                    min={0}
                    className="field"
                    {...describedBy(`crew-${i}-hours`, hoursError)}
                    {...register(`crew.${i}.manHoursPerDay`, { valueAsNumber: true })}
                  />
                  <span className="text-sm text-ink-500">h</span>
                </div>
                {hoursError && (
                  <p id={`crew-${i}-hours-error`} className="field-error">
                    {hoursError}
                  </p>
                )}
              </div>
              <button type="button" className="btn-quiet px-2" onClick={() => rows.remove(i)}>
                Remove<span className="sr-only"> row {i + 1}</span>
              </button>
            </div>
          );
        })}
        {errors.crew?.message && <p className="field-error">{errors.crew.message}</p>}
        <div>
          <button
            type="button"
            className="btn-quiet"
            disabled={usedRanks.size >= RANKS.length}
            onClick={() => rows.append({ rank: RANKS.find((r) => !usedRanks.has(r)) ?? RANKS[0], manHoursPerDay: 0 })}
          >
            Add a rank
          </button>
        </div>
      </fieldset>
      <Field id="stay-remarks" label="Remarks" error={errors.remarks?.message}>
        <textarea rows={3} className="field" {...described("remarks")} {...register("remarks")} />
      </Field>
      <FormActions submitLabel={stay ? "Save port stay" : "Add port stay"} busy={isSubmitting} problem={problem} />
    </form>
  );
}
