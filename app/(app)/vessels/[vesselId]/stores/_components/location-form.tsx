"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { describedBy, Field } from "@/app/_components/forms/field";
import { FormActions } from "@/app/_components/forms/form-actions";
import { useSendForm } from "@/app/_components/forms/use-send-form";
import { LocationInput } from "@/server/parts/contract";
import { useAddLocation } from "./use-stores";

type Values = z.input<typeof LocationInput>;
type Output = z.output<typeof LocationInput>;

export function LocationForm({ vesselId, onDone, onCancel }: { vesselId: string; onDone: (m: string) => void; onCancel: () => void }) {
  const add = useAddLocation(vesselId);
  const form = useForm<Values, unknown, Output>({ resolver: zodResolver(LocationInput), defaultValues: { store: "", rack: "", bin: "" } });
  const { register, formState } = form;
  const { errors, isSubmitting } = formState;
  const { onSubmit, problem } = useSendForm(form, {
    fields: ["store", "rack", "bin"],
    send: async (values) => {
      const made = await add.mutateAsync(values);
      onDone(`Location ${made.place} added.`);
    },
  });
  const text = (name: "store" | "rack" | "bin", label: string, hint: string) => (
    <Field id={`location-${name}`} label={label} hint={hint} error={errors[name]?.message}>
      <input className="field" autoComplete="off" {...describedBy(`location-${name}`, errors[name]?.message, true)} {...register(name)} />
    </Field>
  );
  return (
    <form onSubmit={onSubmit} noValidate className="grid gap-4">
      {text("store", "Store", "e.g. Engine store, Workshop, Deck store")}
      {text("rack", "Rack", "Optional, e.g. 3")}
      {text("bin", "Bin", "Optional, e.g. B")}
      <FormActions submitLabel="Add location" busy={isSubmitting} problem={problem} onCancel={onCancel} />
    </form>
  );
}
