"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { type Control, type Path, useForm, useWatch } from "react-hook-form";
import { describedBy, Field } from "@/app/_components/forms/field";
import { FormActions } from "@/app/_components/forms/form-actions";
import { useSendForm } from "@/app/_components/forms/use-send-form";
import type { ToleranceKind, ToleranceUnit } from "@/server/scheduling/tolerance";
import {
  type AdminToleranceRule,
  ToleranceRuleInput,
  type ToleranceRuleValues,
  UNITS_FOR_KIND,
} from "@/server/tolerance/contract";
import { matchesWords, previewWords, stateWords } from "./tolerance-words";
import { useSaveToleranceRule } from "./use-tolerance-rules";

const FIELDS = [
  "name",
  "kind",
  "minInterval",
  "maxInterval",
  "windowBefore.value",
  "windowBefore.unit",
  "graceAfter.value",
  "graceAfter.unit",
  "capHours",
  "keepsAnniversary",
  "graceOnTime",
] as const satisfies readonly Path<ToleranceRuleInput>[];

const UNIT_LABEL: Record<ToleranceUnit, string> = {
  days: "days",
  months: "months",
  hours: "hours",
  percent: "% of the interval",
};

const NEW_RULE: Record<ToleranceKind, ToleranceRuleInput> = {
  calendar: {
    name: "",
    kind: "calendar",
    minInterval: 0,
    maxInterval: 0,
    windowBefore: { value: 0, unit: "days" },
    graceAfter: { value: 0, unit: "days" },
    capHours: null,
    keepsAnniversary: true,
    graceOnTime: false,
  },
  hours: {
    name: "",
    kind: "hours",
    minInterval: 0,
    maxInterval: 0,
    windowBefore: { value: 0, unit: "hours" },
    graceAfter: { value: 0, unit: "hours" },
    capHours: null,
    keepsAnniversary: false,
    graceOnTime: false,
  },
};

type Props = { rule?: AdminToleranceRule; kind: ToleranceKind; onDone: (message: string) => void };

/** The form as typed so far, for the preview and for the fields that depend on the kind. */
function useRuleValues(control: Control<ToleranceRuleInput, unknown, ToleranceRuleValues>): ToleranceRuleInput {
  const name = useWatch({ control, name: "name" });
  const kind = useWatch({ control, name: "kind" });
  const minInterval = useWatch({ control, name: "minInterval" });
  const maxInterval = useWatch({ control, name: "maxInterval" });
  const windowBefore = useWatch({ control, name: "windowBefore" });
  const graceAfter = useWatch({ control, name: "graceAfter" });
  const capHours = useWatch({ control, name: "capHours" });
  const keepsAnniversary = useWatch({ control, name: "keepsAnniversary" });
  const graceOnTime = useWatch({ control, name: "graceOnTime" });
  return { name, kind, minInterval, maxInterval, windowBefore, graceAfter, capHours, keepsAnniversary, graceOnTime };
}

const numberOrNull = (raw: unknown) => (raw === "" || raw === null || raw === undefined ? null : Number(raw));

export function ToleranceRuleForm({ rule, kind, onDone }: Props) {
  const save = useSaveToleranceRule();
  const form = useForm<ToleranceRuleInput, unknown, ToleranceRuleValues>({
    resolver: zodResolver(ToleranceRuleInput),
    defaultValues: rule
      ? {
          name: rule.name,
          kind: rule.kind,
          minInterval: rule.minInterval,
          maxInterval: rule.maxInterval,
          windowBefore: rule.windowBefore,
          graceAfter: rule.graceAfter,
          capHours: rule.capHours,
          keepsAnniversary: rule.keepsAnniversary,
          graceOnTime: rule.graceOnTime,
        }
      : NEW_RULE[kind],
  });
  const { register, formState, setValue, getValues, control } = form;
  const { errors, isSubmitting } = formState;
  const values = useRuleValues(control);
  const units = UNITS_FOR_KIND[values.kind];
  const sizeUnit = values.kind === "hours" ? "hours" : "days";

  // Another kind counts in other units: a span keeps its number but takes the kind's first unit.
  function kindChanged(next: ToleranceKind) {
    for (const field of ["windowBefore.unit", "graceAfter.unit"] as const) {
      if (!UNITS_FOR_KIND[next].includes(getValues(field))) setValue(field, UNITS_FOR_KIND[next][0]!);
    }
    if (next === "calendar") setValue("capHours", null);
  }

  const { onSubmit, problem } = useSendForm(form, {
    fields: FIELDS,
    send: async (submitted) => {
      const saved = await save.mutateAsync({
        id: rule?.id,
        values: { ...submitted, capHours: submitted.capHours ?? null },
      });
      onDone(rule ? `“${saved.name}” saved; the Backlog follows within a minute.` : `“${saved.name}” added.`);
    },
  });

  const described = (id: string, error: string | undefined, hasHint = false) =>
    describedBy(`rule-${id}`, error, hasHint);

  return (
    <form onSubmit={onSubmit} noValidate className="grid gap-4">
      <Field id="rule-name" label="Name" error={errors.name?.message}>
        <input
          className="field"
          autoComplete="off"
          {...described("name", errors.name?.message)}
          {...register("name")}
        />
      </Field>
      <Field id="rule-kind" label="Kind of interval" error={errors.kind?.message}>
        <select
          className="field"
          {...described("kind", errors.kind?.message)}
          {...register("kind", { onChange: (event) => kindChanged(event.target.value as ToleranceKind) })}
        >
          <option value="calendar">Calendar</option>
          <option value="hours">Running hours</option>
        </select>
      </Field>
      <div className="grid grid-cols-2 gap-3">
        <Field
          id="rule-minInterval"
          label={`Smallest interval (${sizeUnit})`}
          error={errors.minInterval?.message}
          hint={values.kind === "calendar" ? "A month counts 30.44 days, a year 365.25." : undefined}
        >
          <input
            className="field tabular-nums"
            type="number"
            min={0}
            step="any"
            {...described("minInterval", errors.minInterval?.message, values.kind === "calendar")}
            {...register("minInterval", { valueAsNumber: true })}
          />
        </Field>
        <Field id="rule-maxInterval" label={`Largest interval (${sizeUnit})`} error={errors.maxInterval?.message}>
          <input
            className="field tabular-nums"
            type="number"
            min={0}
            step="any"
            {...described("maxInterval", errors.maxInterval?.message)}
            {...register("maxInterval", { valueAsNumber: true })}
          />
        </Field>
      </div>
      {(["windowBefore", "graceAfter"] as const).map((span) => {
        const error = errors[span]?.value?.message ?? errors[span]?.unit?.message;
        return (
          <div key={span} className="grid grid-cols-[1fr_10rem] items-end gap-3">
            <Field
              id={`rule-${span}-value`}
              label={span === "windowBefore" ? "Window before the due point" : "Grace after the due point"}
              error={error}
            >
              <input
                className="field tabular-nums"
                type="number"
                min={0}
                step="any"
                {...described(`${span}-value`, error)}
                {...register(`${span}.value`, { valueAsNumber: true })}
              />
            </Field>
            <div>
              <label htmlFor={`rule-${span}-unit`} className="sr-only">
                {span === "windowBefore" ? "Window unit" : "Grace unit"}
              </label>
              <select id={`rule-${span}-unit`} className="field" {...register(`${span}.unit`)}>
                {units.map((unit) => (
                  <option key={unit} value={unit}>
                    {UNIT_LABEL[unit]}
                  </option>
                ))}
              </select>
            </div>
          </div>
        );
      })}
      {values.kind === "hours" && (
        <Field
          id="rule-capHours"
          label="Cap (hours, optional)"
          error={errors.capHours?.message}
          hint="The most hours a percentage window or grace may come to."
        >
          <input
            className="field tabular-nums"
            type="number"
            min={0}
            step="any"
            {...described("capHours", errors.capHours?.message, true)}
            {...register("capHours", { setValueAs: numberOrNull })}
          />
        </Field>
      )}
      <label className="flex items-start gap-2">
        <input type="checkbox" className="mt-1" {...register("keepsAnniversary")} />
        <span>
          Keeps the anniversary
          <span className="block text-xs text-ink-500 dark:text-ink-400">
            An anchored routine completed inside the window keeps its due date; one completed earlier starts again from
            the completion.
          </span>
        </span>
      </label>
      {values.kind === "calendar" && (
        <label className="flex items-start gap-2">
          <input type="checkbox" className="mt-1" {...register("graceOnTime")} />
          <span>
            The whole window counts as on time (class surveys)
            <span className="block text-xs text-ink-500 dark:text-ink-400">
              Work done or still open after the due date but inside the grace is not late; the day after the grace
              it is out of tolerance. Class surveys work this way (HSSC, IMO Res. A.1104(29) 4.2.1: within 3 months
              before or after each anniversary).
            </span>
          </span>
        </label>
      )}
      <div className="rounded-md bg-ink-50 px-3 py-2 text-ink-700 dark:bg-ink-850 dark:text-ink-200" aria-live="polite">
        <p className="text-xs font-semibold tracking-wide text-ink-500 uppercase dark:text-ink-400">In plain words</p>
        <p>{previewWords(values)}</p>
        <p className="mt-1 text-sm">{stateWords(values)}</p>
        {Number.isFinite(values.minInterval) && Number.isFinite(values.maxInterval) && (
          // The range in words too: a calendar range is typed in days but thought of in months.
          <p className="mt-1 text-xs text-ink-500 dark:text-ink-400">Applies to {matchesWords(values)}.</p>
        )}
      </div>
      <FormActions submitLabel={rule ? "Save rule" : "Add rule"} busy={isSubmitting} problem={problem} />
    </form>
  );
}
