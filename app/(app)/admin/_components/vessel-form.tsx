"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useMemo, useState } from "react";
import { useForm } from "react-hook-form";
import { type AdminVessel, VesselInput, type VesselValues } from "@/server/admin/contract";
import { Field, describedBy } from "./field";
import { showProblem } from "./form-problem";
import { useSaveVessel } from "./use-admin";

const FIELDS = ["name", "imoNumber", "code", "timeZone"] as const;

type Props = { vessel?: AdminVessel; onDone: (message: string) => void };

export function VesselForm({ vessel, onDone }: Props) {
  const save = useSaveVessel();
  const [problem, setProblem] = useState<string | null>(null);
  const zones = useMemo(() => ["UTC", ...Intl.supportedValuesOf("timeZone")], []);
  const { register, handleSubmit, formState, setError } = useForm<VesselInput, unknown, VesselValues>({
    resolver: zodResolver(VesselInput),
    defaultValues: vessel
      ? { name: vessel.name, imoNumber: vessel.imoNumber, code: vessel.code, timeZone: vessel.timeZone }
      : { name: "", imoNumber: "", code: "", timeZone: "UTC" },
  });
  const { errors, isSubmitting } = formState;

  async function onSubmit(values: VesselValues) {
    setProblem(null);
    try {
      const saved = await save.mutateAsync({ id: vessel?.id, values });
      onDone(vessel ? `${saved.name} saved.` : `${saved.name} (${saved.code}) added.`);
    } catch (error) {
      setProblem(showProblem(error, setError, FIELDS));
    }
  }

  const described = (field: (typeof FIELDS)[number]) => describedBy(`vessel-${field}`, errors[field]?.message);

  return (
    <form onSubmit={handleSubmit(onSubmit)} noValidate className="grid gap-4">
      <Field id="vessel-name" label="Name" error={errors.name?.message}>
        <input id="vessel-name" className="field" autoComplete="off" {...described("name")} {...register("name")} />
      </Field>
      <div className="grid grid-cols-[1fr_8rem] gap-3">
        <Field
          id="vessel-imoNumber"
          label="IMO number"
          error={errors.imoNumber?.message}
          hint="Seven digits; the last is a check digit."
        >
          <input
            id="vessel-imoNumber"
            className="field font-mono"
            autoComplete="off"
            placeholder="IMO 9074729"
            {...described("imoNumber")}
            {...register("imoNumber")}
          />
        </Field>
        <Field id="vessel-code" label="Code" error={errors.code?.message} hint="Starts work-order numbers.">
          <input
            id="vessel-code"
            className="field font-mono uppercase"
            autoComplete="off"
            maxLength={6}
            placeholder="AG"
            {...described("code")}
            {...register("code")}
          />
        </Field>
      </div>
      <Field
        id="vessel-timeZone"
        label="Ship’s time zone"
        error={errors.timeZone?.message}
        hint="The ship’s day and its Hour log follow this zone. Change it when the ship changes its clocks for a new trading area."
      >
        <input
          id="vessel-timeZone"
          className="field"
          list="vessel-time-zones"
          autoComplete="off"
          {...described("timeZone")}
          {...register("timeZone")}
        />
        <datalist id="vessel-time-zones">
          {zones.map((zone) => (
            <option key={zone} value={zone} />
          ))}
        </datalist>
      </Field>
      {problem && (
        <p
          role="alert"
          className="rounded-md bg-alarm-50 px-3 py-2 font-medium text-alarm-700 dark:bg-alarm-700/20 dark:text-alarm-300"
        >
          {problem}
        </p>
      )}
      <div className="flex gap-2">
        <button type="submit" className="btn-primary" disabled={isSubmitting}>
          {isSubmitting ? "Saving…" : vessel ? "Save vessel" : "Add vessel"}
        </button>
      </div>
    </form>
  );
}
