"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { describedBy, Field } from "@/app/_components/forms/field";
import { FormActions } from "@/app/_components/forms/form-actions";
import { rowFields, useSendForm } from "@/app/_components/forms/use-send-form";
import type { CrewOnBoard } from "@/db/schema/port-stays";
import {
  DEFAULT_WORKDAY,
  PortStayInput,
  type PortStayList,
  type PortStayValues,
  type PortStayView,
  shipTimeMinutes,
} from "@/server/port-stays/contract";
import { RANKS } from "@/server/routines/contract";
import { shiftLocal } from "../[stayId]/_components/timeline-geometry";
import { CrewRows, WatchRows } from "./stay-form-rows";
import { useSaveStay } from "./use-port-stays";

type Props = {
  vesselId: string;
  timeZone: string;
  stay?: PortStayView;
  /** The crew and working day of the latest stay, to start a new stay from. */
  latest: PortStayList["latest"];
  onDone: (message: string, saved: PortStayView) => void;
};

const FIELDS = ["port", "arrivesAt", "departsAt", "workdayFrom", "workdayTo", "engineStop.from", "engineStop.to", "crew", "watches", "remarks"] as const;
const WATCH_KEYS = ["rank", "person", "from", "to", "label"] as const;

/** Stored crew rows as the form's rows (every stored rank passed the contract). */
function crewRows(crew: CrewOnBoard[]): PortStayInput["crew"] {
  return crew.flatMap((c) => {
    const rank = RANKS.find((r) => r === c.rank);
    return rank ? [{ rank, count: c.count }] : [];
  });
}

function defaults(stay: PortStayView | undefined, latest: PortStayList["latest"]): PortStayInput {
  if (!stay) {
    return {
      port: "",
      arrivesAt: "",
      departsAt: "",
      workdayFrom: latest?.workdayFrom ?? DEFAULT_WORKDAY.from,
      workdayTo: latest?.workdayTo ?? DEFAULT_WORKDAY.to,
      engineStop: null,
      crew: crewRows(latest?.crew ?? []),
      watches: [],
      remarks: "",
    };
  }
  return {
    port: stay.port,
    arrivesAt: stay.arrivesLocal,
    departsAt: stay.departsLocal,
    workdayFrom: stay.workdayFrom,
    workdayTo: stay.workdayTo,
    engineStop: stay.engineStop && { from: stay.engineStop.fromLocal, to: stay.engineStop.toLocal },
    crew: crewRows(stay.crew),
    watches: stay.watches.flatMap((w) => {
      const rank = RANKS.find((r) => r === w.rank);
      return rank ? [{ rank, person: w.person, from: w.fromLocal, to: w.toLocal, label: w.label }] : [];
    }),
    remarks: stay.remarks,
  };
}

/** The engine stop a ticked box starts with: the first 24 h of the stay, not past the departure. */
function firstDay(arrivesAt: string, departsAt: string): { from: string; to: string } {
  if (!arrivesAt) return { from: "", to: "" };
  const to = shiftLocal(arrivesAt, 24 * 60);
  const clipped = departsAt && shipTimeMinutes(departsAt) < shipTimeMinutes(to) ? departsAt : to;
  return { from: arrivesAt, to: clipped };
}

export function StayForm({ vesselId, timeZone, stay, latest, onDone }: Props) {
  const save = useSaveStay(vesselId);
  const form = useForm<PortStayInput, unknown, PortStayValues>({
    resolver: zodResolver(PortStayInput),
    defaultValues: defaults(stay, latest),
  });
  const { register, formState, setValue, getValues } = form;
  const { errors, isSubmitting } = formState;
  const [engineMayStop, setEngineMayStop] = useState(Boolean(stay?.engineStop));

  const { onSubmit, problem } = useSendForm(form, {
    // Errors on rows name the row's field (watches.2.from): put them there.
    fields: (values) => [
      ...rowFields("crew", values.crew.length, ["rank", "count"]),
      ...rowFields("watches", values.watches.length, WATCH_KEYS),
      ...FIELDS,
    ],
    send: async (values) => {
      const saved = await save.mutateAsync({ id: stay?.id, values });
      onDone(stay ? `${saved.port} saved.` : `${saved.port} added.`, saved);
    },
  });

  function toggleEngineStop(on: boolean) {
    setEngineMayStop(on);
    setValue("engineStop", on ? firstDay(getValues("arrivesAt"), getValues("departsAt")) : null);
  }

  const hint = `Ship’s time, ${timeZone}`;
  const stopError = errors.engineStop;

  return (
    <form onSubmit={onSubmit} noValidate className="grid gap-4">
      <Field id="stay-port" label="Port" error={errors.port?.message}>
        <input className="field" autoComplete="off" {...describedBy("stay-port", errors.port?.message)} {...register("port")} />
      </Field>
      <div className="grid gap-3 sm:grid-cols-2">
        <Field id="stay-arrivesAt" label="Arrival" error={errors.arrivesAt?.message} hint={hint}>
          <input type="datetime-local" className="field" {...describedBy("stay-arrivesAt", errors.arrivesAt?.message, true)} {...register("arrivesAt")} />
        </Field>
        <Field id="stay-departsAt" label="Departure" error={errors.departsAt?.message} hint={hint}>
          <input type="datetime-local" className="field" {...describedBy("stay-departsAt", errors.departsAt?.message, true)} {...register("departsAt")} />
        </Field>
        <Field id="stay-workdayFrom" label="Working day from" error={errors.workdayFrom?.message}>
          <input type="time" className="field" {...describedBy("stay-workdayFrom", errors.workdayFrom?.message)} {...register("workdayFrom")} />
        </Field>
        <Field id="stay-workdayTo" label="Working day to" error={errors.workdayTo?.message}>
          <input type="time" className="field" {...describedBy("stay-workdayTo", errors.workdayTo?.message)} {...register("workdayTo")} />
        </Field>
      </div>
      <fieldset className="grid gap-3 rounded-md border border-ink-200 p-3 dark:border-ink-800">
        <legend className="px-1 text-xs font-semibold tracking-wide text-ink-600 uppercase dark:text-ink-300">
          Main engine
        </legend>
        <label className="flex min-h-6 items-center gap-2">
          <input type="checkbox" className="size-5" checked={engineMayStop} onChange={(e) => toggleEngineStop(e.target.checked)} />
          Main engine may be immobilised (terminal’s or port authority’s consent)
        </label>
        {engineMayStop && (
          <div className="grid gap-3 sm:grid-cols-2">
            <Field id="stay-engineStop-from" label="Engine stop from" error={stopError?.from?.message ?? stopError?.message} hint={hint}>
              <input
                type="datetime-local"
                className="field"
                {...describedBy("stay-engineStop-from", stopError?.from?.message ?? stopError?.message, true)}
                {...register("engineStop.from")}
              />
            </Field>
            <Field id="stay-engineStop-to" label="Engine stop to" error={stopError?.to?.message} hint={hint}>
              <input type="datetime-local" className="field" {...describedBy("stay-engineStop-to", stopError?.to?.message, true)} {...register("engineStop.to")} />
            </Field>
          </div>
        )}
      </fieldset>
      <CrewRows form={form} />
      <WatchRows form={form} />
      <Field id="stay-remarks" label="Remarks" error={errors.remarks?.message}>
        <textarea rows={3} className="field" {...describedBy("stay-remarks", errors.remarks?.message)} {...register("remarks")} />
      </Field>
      <FormActions submitLabel={stay ? "Save port stay" : "Add port stay"} busy={isSubmitting} problem={problem} />
    </form>
  );
}
