"use client";

import { type FieldErrors, type UseFormRegister, useWatch, type Control } from "react-hook-form";
import { describedBy, Field } from "@/app/_components/forms/field";
import { CALENDAR_UNITS, type RoutineList, WEEKDAYS } from "@/server/routines/contract";
import { intervalWords } from "@/server/routines/interval-words";
import { calendarRuleProblem } from "@/server/scheduling/calendar-rule";
import { calendarRuleFromForm } from "@/server/scheduling/calendar-rule-words";
import type { RoutineFormValues } from "./routine-form-values";

type Props = {
  control: Control<RoutineFormValues>;
  register: UseFormRegister<RoutineFormValues>;
  errors: FieldErrors<RoutineFormValues>;
  toleranceRules: RoutineList["toleranceRules"];
};

const UNIT_WORDS = { day: "days", week: "weeks", month: "months", year: "years" } as const;
const WEEKDAY_WORDS = { MO: "Mon", TU: "Tue", WE: "Wed", TH: "Thu", FR: "Fri", SA: "Sat", SU: "Sun" } as const;

/** The stored rule the fields would give, or null while they do not make one yet. */
function ruleOfFields(v: RoutineFormValues): string | null {
  if (v.calendarMode === "rrule")
    return v.calendarRule.trim() && !calendarRuleProblem(v.calendarRule) ? v.calendarRule : null;
  if (v.calendarMode !== "form") return null;
  try {
    return calendarRuleFromForm({
      every: Number(v.calendar.every),
      unit: v.calendar.unit,
      weekdays: v.calendar.unit === "week" ? v.calendar.weekdays : [],
    });
  } catch {
    return null;
  }
}

export function IntervalFields({ control, register, errors, toleranceRules }: Props) {
  const values = useWatch({ control }) as RoutineFormValues;
  const hours = Number(values.intervalHours?.replace(/[\s,]/g, ""));
  const rule = ruleOfFields(values);
  const preview =
    (Number.isFinite(hours) && hours > 0) || rule
      ? intervalWords(Number.isFinite(hours) && hours > 0 ? hours : null, rule)
      : "not yet: give running hours, a calendar rule, or both";
  const hasCalendar = values.calendarMode !== "none";

  return (
    <fieldset className="grid gap-3 rounded-md border border-ink-200 p-3 dark:border-ink-800">
      <legend className="px-1 text-sm font-semibold">Interval</legend>
      <Field
        id="routine-hours"
        label="Running hours"
        hint="Leave empty for a routine by the calendar only."
        error={errors.intervalHours?.message}
      >
        <input
          className="field w-40"
          inputMode="decimal"
          autoComplete="off"
          {...describedBy("routine-hours", errors.intervalHours?.message, true)}
          {...register("intervalHours")}
        />
      </Field>

      <div role="radiogroup" aria-label="Calendar rule" className="flex flex-wrap gap-4">
        {(
          [
            ["none", "No calendar rule"],
            ["form", "Every N days, weeks, months or years"],
            ["rrule", "RRULE (RFC 5545)"],
          ] as const
        ).map(([mode, label]) => (
          <label key={mode} className="flex items-center gap-1.5">
            <input type="radio" value={mode} className="accent-brass-600" {...register("calendarMode")} />
            {label}
          </label>
        ))}
      </div>

      {values.calendarMode === "form" && (
        <div className="grid gap-2">
          <div className="flex items-end gap-2">
            <Field id="routine-every" label="Every" error={errors.calendar?.every?.message}>
              <input
                className="field w-20"
                inputMode="numeric"
                {...describedBy("routine-every", errors.calendar?.every?.message)}
                {...register("calendar.every")}
              />
            </Field>
            <div>
              <label htmlFor="routine-unit" className="sr-only">
                Unit
              </label>
              <select id="routine-unit" className="field" {...register("calendar.unit")}>
                {CALENDAR_UNITS.map((u) => (
                  <option key={u} value={u}>
                    {UNIT_WORDS[u]}
                  </option>
                ))}
              </select>
            </div>
          </div>
          {values.calendar?.unit === "week" && (
            <fieldset className="flex flex-wrap gap-3">
              <legend className="label">On (optional)</legend>
              {WEEKDAYS.map((d) => (
                <label key={d} className="flex items-center gap-1">
                  <input type="checkbox" value={d} className="accent-brass-600" {...register("calendar.weekdays")} />
                  {WEEKDAY_WORDS[d]}
                </label>
              ))}
            </fieldset>
          )}
          {errors.calendar?.weekdays?.message && <p className="field-error">{errors.calendar.weekdays.message}</p>}
        </div>
      )}

      {values.calendarMode === "rrule" && (
        <Field
          id="routine-rrule"
          label="Calendar rule"
          hint="Without DTSTART or COUNT, e.g. FREQ=MONTHLY;INTERVAL=3 or FREQ=MONTHLY;BYDAY=1MO."
          error={errors.calendarRule?.message}
        >
          <input
            className="field font-mono"
            autoComplete="off"
            spellCheck={false}
            {...describedBy("routine-rrule", errors.calendarRule?.message, true)}
            {...register("calendarRule")}
          />
        </Field>
      )}

      <p className="rounded bg-ink-100 px-2 py-1 dark:bg-ink-850" aria-live="polite">
        <span className="text-xs text-ink-500 dark:text-ink-400">Falls due </span>
        <span className="font-medium">{preview}</span>
      </p>

      {hasCalendar && (
        <div className="grid gap-2">
          <label className="flex items-center gap-2">
            <input type="checkbox" className="accent-brass-600" {...register("anchored")} />
            Anchored: keeps a fixed anniversary (class items), rather than counting from the last completion
          </label>
          {errors.anchored?.message && <p className="field-error">{errors.anchored.message}</p>}
          {values.anchored && (
            <Field id="routine-anchor" label="Anniversary date" error={errors.anchorDate?.message}>
              <input
                type="date"
                className="field w-44"
                {...describedBy("routine-anchor", errors.anchorDate?.message)}
                {...register("anchorDate")}
              />
            </Field>
          )}
        </div>
      )}

      <div className="grid grid-cols-2 gap-3">
        <Field id="routine-baseline-at" label="Baseline: last done on" error={errors.baselineAt?.message}>
          <input
            type="date"
            className="field"
            {...describedBy("routine-baseline-at", errors.baselineAt?.message)}
            {...register("baselineAt")}
          />
        </Field>
        <Field id="routine-baseline-hours" label="Baseline: at counter hours" error={errors.baselineHours?.message}>
          <input
            className="field"
            inputMode="decimal"
            autoComplete="off"
            {...describedBy("routine-baseline-hours", errors.baselineHours?.message)}
            {...register("baselineHours")}
          />
        </Field>
      </div>
      <p className="-mt-2 text-xs text-ink-500 dark:text-ink-400">
        Where the count starts until the first completion is recorded: the ship’s day and counter reading it was last
        done, or when the count starts.
      </p>

      <Field
        id="routine-tolerance"
        label="Tolerance rule"
        hint="The company’s rule matched by interval applies unless you choose one here."
        error={errors.toleranceRuleId?.message}
      >
        <select
          className="field"
          {...describedBy("routine-tolerance", errors.toleranceRuleId?.message, true)}
          {...register("toleranceRuleId")}
        >
          <option value="">Matched by interval</option>
          {toleranceRules.map((r) => (
            <option key={r.id} value={r.id}>
              {r.name} ({r.kind})
            </option>
          ))}
        </select>
      </Field>
    </fieldset>
  );
}
