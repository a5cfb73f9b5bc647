"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useMemo } from "react";
import { useForm } from "react-hook-form";
import { describedBy, Field } from "@/app/_components/forms/field";
import { FormActions } from "@/app/_components/forms/form-actions";
import { useSendForm } from "@/app/_components/forms/use-send-form";
import { type AdminVessel, VesselInput, type VesselValues } from "@/server/admin/contract";
import { useSaveVessel } from "./use-admin";

const FIELDS = ["name", "imoNumber", "code", "timeZone"] as const;

type Props = { vessel?: AdminVessel; onDone: (message: string) => void };

export function VesselForm({ vessel, onDone }: Props) {
  const save = useSaveVessel();
  const zones = useMemo(() => ["UTC", ...Intl.supportedValuesOf("timeZone")], []);
  const form = useForm<VesselInput, unknown, VesselValues>({
    resolver: zodResolver(VesselInput),
    defaultValues: vessel
      ? { name: vessel.name, imoNumber: vessel.imoNumber, code: vessel.code, timeZone: vessel.timeZone }
      : { name: "", imoNumber: "", code: "", timeZone: "UTC" },
  });
  const { register, formState } = form;
  const { errors, isSubmitting } = formState;
  const { onSubmit, problem } = useSendForm(form, {
    fields: FIELDS,
    send: async (values) => {
      const saved = await save.mutateAsync({ id: vessel?.id, values });
      onDone(vessel ? `${saved.name} saved.` : `${saved.name} (${saved.code}) added.`);
    },
  });

  const described = (field: (typeof FIELDS)[number], hasHint = false) =>
    describedBy(`vessel-${field}`, errors[field]?.message, hasHint);

  return (
    <form onSubmit={onSubmit} noValidate className="grid gap-4">
      <Field id="vessel-name" label="Name" error={errors.name?.message}>
        <input className="field" autoComplete="off" {...described("name")} {...register("name")} />
      </Field>
      <div className="grid grid-cols-[1fr_8rem] gap-3">
        <Field
          id="vessel-imoNumber"
          label="IMO number"
          error={errors.imoNumber?.message}
          hint="Seven digits; the last is a check digit."
        >
          <input
            className="field font-mono"
            autoComplete="off"
            placeholder="IMO 9074729"
            {...described("imoNumber", true)}
            {...register("imoNumber")}
          />
        </Field>
        <Field id="vessel-code" label="Code" error={errors.code?.message} hint="Starts work-order numbers.">
          <input
            className="field font-mono uppercase"
            autoComplete="off"
            maxLength={6}
            placeholder="AG"
            {...described("code", true)}
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
          className="field"
          list="vessel-time-zones"
          autoComplete="off"
          {...described("timeZone", true)}
          {...register("timeZone")}
        />
        <datalist id="vessel-time-zones">
          {zones.map((zone) => (
            <option key={zone} value={zone} />
          ))}
        </datalist>
      </Field>
      <FormActions submitLabel={vessel ? "Save vessel" : "Add vessel"} busy={isSubmitting} problem={problem} />
    </form>
  );
}
