"use client";
// A defect found on board: the component, what was found, when, and what it affects. It becomes a
// corrective work order at once; photos are added on that work order's page.
import { zodResolver } from "@hookform/resolvers/zod";
import { type Resolver, useForm } from "react-hook-form";
import { describedBy, Field } from "@/app/_components/forms/field";
import { FormActions } from "@/app/_components/forms/form-actions";
import { useSendForm } from "@/app/_components/forms/use-send-form";
import { DefectInput, type DefectList, type DefectValues, type DefectView } from "@/server/defects/contract";
import { shipClock, shipDay } from "@/server/format/hours";
import { useReportDefect } from "./use-defects";

type Values = {
  componentId: string;
  title: string;
  description: string;
  foundOn: string;
  time: string;
  affectsCritical: boolean;
  affectsSafety: boolean;
  affectsClass: boolean;
  needsEngineStop: boolean;
};

type Props = { list: DefectList; onDone: (saved: DefectView) => void; onCancel: () => void };

const FLAGS = [
  ["affectsCritical", "It affects critical equipment"],
  ["affectsSafety", "It affects safety"],
  ["affectsClass", "It concerns a class item"],
  ["needsEngineStop", "The main engine must stop to repair it"],
] as const;

export function ReportForm({ list, onDone, onCancel }: Props) {
  const report = useReportDefect(list.vessel.id);
  const now = new Date();
  const form = useForm<Values, unknown, DefectValues>({
    resolver: zodResolver(DefectInput) as unknown as Resolver<Values, unknown, DefectValues>,
    defaultValues: {
      componentId: "",
      title: "",
      description: "",
      foundOn: shipDay(now, list.vessel.timeZone),
      time: shipClock(now, list.vessel.timeZone),
      affectsCritical: false,
      affectsSafety: false,
      affectsClass: false,
      needsEngineStop: false,
    },
  });
  const { register, formState } = form;
  const { errors, isSubmitting } = formState;
  const { onSubmit, problem } = useSendForm(form, {
    fields: ["componentId", "title", "description", "foundOn", "time"],
    send: async (values) => onDone(await report.mutateAsync(values)),
  });
  const error = (name: keyof Values) => errors[name]?.message;
  return (
    <form onSubmit={onSubmit} noValidate className="grid gap-4">
      <p className="rounded-md bg-brass-100 px-3 py-2 text-sm text-ink-900 dark:bg-brass-700/30 dark:text-ink-50">
        ⚠ Where the defect puts people, the ship or the environment at risk, act first as the company’s safety management system, the maker’s manual and the
        master or chief engineer require; report it here afterwards.
      </p>
      <Field id="defect-component" label="Component" error={error("componentId")}>
        <select className="field" {...describedBy("defect-component", error("componentId"))} {...register("componentId")}>
          <option value="">Choose the component…</option>
          {list.components.map((c) => (
            <option key={c.id} value={c.id}>
              {c.code} — {c.name}
            </option>
          ))}
        </select>
      </Field>
      <Field id="defect-title" label="What was found" hint="In a line, e.g. “Oil leak at the turbocharger drain”." error={error("title")}>
        <input className="field" autoComplete="off" {...describedBy("defect-title", error("title"), true)} {...register("title")} />
      </Field>
      <Field id="defect-description" label="Details" hint="Where, how much, since when, what was done so far." error={error("description")}>
        <textarea className="field min-h-24" {...describedBy("defect-description", error("description"), true)} {...register("description")} />
      </Field>
      <div className="grid gap-4 sm:grid-cols-2">
        <Field id="defect-day" label="Ship’s day found" error={error("foundOn")}>
          <input type="date" className="field" {...describedBy("defect-day", error("foundOn"))} {...register("foundOn")} />
        </Field>
        <Field id="defect-time" label="Ship’s time (HH:MM)" error={error("time")}>
          <input className="field tabular-nums" inputMode="numeric" maxLength={5} autoComplete="off" {...describedBy("defect-time", error("time"))} {...register("time")} />
        </Field>
      </div>
      <fieldset className="grid gap-1">
        <legend className="label">What it affects</legend>
        {FLAGS.map(([name, label]) => (
          <label key={name} className="flex items-center gap-2">
            <input type="checkbox" className="accent-tide-600" {...register(name)} />
            {label}
          </label>
        ))}
      </fieldset>
      <FormActions submitLabel="Report the defect" busy={isSubmitting} problem={problem} onCancel={onCancel} />
    </form>
  );
}
