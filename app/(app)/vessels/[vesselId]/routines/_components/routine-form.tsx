"use client";

import { type Path, useForm, useWatch } from "react-hook-form";
import { ProblemError } from "@/app/_components/fetch-json";
import { describedBy, Field } from "@/app/_components/forms/field";
import { FormActions } from "@/app/_components/forms/form-actions";
import { rowFields, useSendForm } from "@/app/_components/forms/use-send-form";
import { fieldErrorsFromZod } from "@/server/http/problem";
import { CAUTIONS, RoutineInput, type RoutineList, type RoutineView } from "@/server/routines/contract";
import { ChecklistEditor } from "./checklist-editor";
import { IntervalFields } from "./interval-fields";
import { MeasurementsEditor } from "./measurements-editor";
import { inputOf, type RoutineFormValues, valuesOf } from "./routine-form-values";
import { CAUTION_WORDS, CAUTIONS_PREVAIL } from "./routine-words";
import { TeamEditor } from "./team-editor";
import { useAddRoutine, useChangeRoutine } from "./use-routines";

const FIXED_FIELDS = [
  "componentId",
  "title",
  "description",
  "checklist",
  "intervalHours",
  "calendarRule",
  "calendar.every",
  "calendar.weekdays",
  "anchored",
  "anchorDate",
  "team",
  "elapsedHours",
  "portEvent",
  "portEventHours",
  "classItemRef",
  "spareParts",
  "cautions",
  "baselineAt",
  "baselineHours",
  "toleranceRuleId",
] as const satisfies readonly Path<RoutineFormValues>[];

type Props = {
  list: RoutineList;
  routine: RoutineView | null;
  onDone: (message: string) => void;
  onCancel: () => void;
};

export function RoutineForm({ list, routine, onDone, onCancel }: Props) {
  const add = useAddRoutine(list.vessel.id);
  const change = useChangeRoutine(list.vessel.id);
  const form = useForm<RoutineFormValues>({
    defaultValues: valuesOf(routine, new Date().toISOString().slice(0, 10)),
  });
  const { register, control, formState } = form;
  const portEvent = useWatch({ control, name: "portEvent" });
  const { errors, isSubmitting } = formState;

  const { onSubmit, problem } = useSendForm(form, {
    fields: (values) => [
      ...FIXED_FIELDS,
      ...rowFields("measurements", values.measurements.length, ["name", "unit", "lower", "upper"]),
      ...rowFields("team", values.team.length, ["rank", "count"]),
    ],
    send: async (values) => {
      const input = inputOf(values);
      // Checked here first with the same contract as the server, so a mistake shows without a round trip.
      const local = RoutineInput.safeParse(input);
      if (!local.success) {
        const errors = fieldErrorsFromZod(local.error);
        throw new ProblemError({
          type: "about:blank",
          title: "",
          status: 422,
          detail: errors[0]?.message ?? "",
          errors,
        });
      }
      if (routine) {
        await change.mutateAsync({ id: routine.id, change: input });
        onDone(`${values.title} saved; the Backlog follows in a moment.`);
      } else {
        await add.mutateAsync(input);
        onDone(`${values.title} added; its work order appears in the Backlog in a moment.`);
      }
    },
  });

  return (
    <form onSubmit={onSubmit} noValidate className="grid gap-4">
      <Field id="routine-component" label="Component" error={errors.componentId?.message}>
        <select
          className="field"
          autoFocus
          {...describedBy("routine-component", errors.componentId?.message)}
          {...register("componentId")}
        >
          <option value="">Choose a component…</option>
          {list.components.map((c) => (
            <option key={c.id} value={c.id}>
              {c.code} — {c.name}
            </option>
          ))}
        </select>
      </Field>
      <Field id="routine-title" label="Title" error={errors.title?.message}>
        <input
          className="field"
          autoComplete="off"
          {...describedBy("routine-title", errors.title?.message)}
          {...register("title")}
        />
      </Field>
      <Field id="routine-description" label="Description" error={errors.description?.message}>
        <textarea
          className="field min-h-16"
          {...describedBy("routine-description", errors.description?.message)}
          {...register("description")}
        />
      </Field>

      <Field
        id="routine-port-event"
        label="Falls due"
        hint="A statutory test before departure (the steering gear: SOLAS V/26) is tied to every stay, not to a weekly rule."
        error={errors.portEvent?.message}
      >
        <select
          className="field"
          {...describedBy("routine-port-event", errors.portEvent?.message, true)}
          {...register("portEvent")}
        >
          <option value="">By running hours or the calendar</option>
          <option value="departure">Before each departure from a port stay</option>
          <option value="arrival">After each arrival at a port stay</option>
        </select>
      </Field>
      {portEvent ? (
        <Field id="routine-port-event-hours" label="Within hours of it" error={errors.portEventHours?.message}>
          <input
            className="field w-32"
            inputMode="decimal"
            {...describedBy("routine-port-event-hours", errors.portEventHours?.message)}
            {...register("portEventHours")}
          />
        </Field>
      ) : (
        <IntervalFields control={control} register={register} errors={errors} toleranceRules={list.toleranceRules} />
      )}

      <TeamEditor control={control} register={register} errors={errors} />

      <fieldset className="grid gap-1.5">
        <legend className="label">Marks</legend>
        <label className="flex items-center gap-2">
          <input type="checkbox" className="accent-brass-600" {...register("needsEngineStop")} />
          Needs the engine stopped (planned into a port stay)
        </label>
        <label className="flex items-center gap-2">
          <input type="checkbox" className="accent-brass-600" {...register("needsPort")} />
          Needs the ship in port (shore crane, service engineer, surveyor, parts delivered in port)
        </label>
        <label className="flex items-center gap-2">
          <input type="checkbox" className="accent-brass-600" {...register("critical")} />
          Critical equipment (ISM Code 10.3)
        </label>
        <label className="flex items-center gap-2">
          <input type="checkbox" className="accent-brass-600" {...register("classRelated")} />
          Class-related
        </label>
      </fieldset>
      <Field id="routine-class-ref" label="Class item reference" error={errors.classItemRef?.message}>
        <input
          className="field w-48 font-mono"
          autoComplete="off"
          {...describedBy("routine-class-ref", errors.classItemRef?.message)}
          {...register("classItemRef")}
        />
      </Field>

      <ChecklistEditor control={control} register={register} error={errors.checklist?.message} />
      <MeasurementsEditor control={control} register={register} errors={errors} />

      <Field id="routine-parts" label="Spare parts to have ready" error={errors.spareParts?.message}>
        <textarea
          className="field min-h-14"
          {...describedBy("routine-parts", errors.spareParts?.message)}
          {...register("spareParts")}
        />
      </Field>

      <fieldset className="grid gap-1.5">
        <legend className="label">Cautions</legend>
        {CAUTIONS.map((c) => (
          <label key={c} className="flex items-start gap-2">
            <input type="checkbox" value={c} className="accent-brass-600" {...register("cautions")} />
            {CAUTION_WORDS[c]}
          </label>
        ))}
        <p className="text-xs text-ink-500 dark:text-ink-400">{CAUTIONS_PREVAIL}</p>
      </fieldset>

      <FormActions
        submitLabel={routine ? "Save routine" : "Add routine"}
        busy={isSubmitting}
        problem={problem}
        onCancel={onCancel}
      />
    </form>
  );
}
