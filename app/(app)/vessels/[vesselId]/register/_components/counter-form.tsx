"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { describedBy, Field } from "@/app/_components/forms/field";
import { FormActions } from "@/app/_components/forms/form-actions";
import { useSendForm } from "@/app/_components/forms/use-send-form";
import { CounterInput, type RegisterCounter } from "@/server/register/contract";
import { useAddCounter, useChangeCounter } from "./use-register";

type Values = z.input<typeof CounterInput>;
type Output = z.output<typeof CounterInput>;

type Props = {
  vesselId: string;
  counter: RegisterCounter | null;
  onDone: (message: string) => void;
  onCancel: () => void;
};

export function CounterForm({ vesselId, counter, onDone, onCancel }: Props) {
  const add = useAddCounter(vesselId);
  const change = useChangeCounter(vesselId);
  const form = useForm<Values, unknown, Output>({
    resolver: zodResolver(CounterInput),
    defaultValues: { name: counter?.name ?? "", plannedHoursPerDay: counter ? String(counter.plannedHoursPerDay) : "" },
  });
  const { register, formState } = form;
  const { errors, isSubmitting } = formState;
  const { onSubmit, problem } = useSendForm(form, {
    fields: ["name", "plannedHoursPerDay"],
    send: async (values) => {
      if (counter) await change.mutateAsync({ id: counter.id, change: values });
      else await add.mutateAsync(values);
      onDone(
        counter ? `Counter ${values.name} saved.` : `Counter ${values.name} added; it now appears in the Hour log.`,
      );
    },
  });

  return (
    <form onSubmit={onSubmit} noValidate className="grid gap-4">
      <Field
        id="counter-name"
        label="Name"
        hint="As the engineers know the meter, e.g. Generator engine 2."
        error={errors.name?.message}
      >
        <input
          className="field"
          autoComplete="off"
          autoFocus
          {...describedBy("counter-name", errors.name?.message, true)}
          {...register("name")}
        />
      </Field>
      <Field
        id="counter-planned"
        label="Planned running hours per day"
        hint="Used to project due dates until there are enough readings for a measured rate."
        error={errors.plannedHoursPerDay?.message}
      >
        <div className="flex items-center gap-2">
          <input
            className="field w-28 text-right tabular-nums"
            inputMode="decimal"
            autoComplete="off"
            placeholder="12"
            {...describedBy("counter-planned", errors.plannedHoursPerDay?.message, true)}
            {...register("plannedHoursPerDay")}
          />
          <span className="text-ink-500">h/day, 0 to 24</span>
        </div>
      </Field>
      <FormActions
        submitLabel={counter ? "Save counter" : "Add counter"}
        busy={isSubmitting}
        problem={problem}
        onCancel={onCancel}
      />
    </form>
  );
}
