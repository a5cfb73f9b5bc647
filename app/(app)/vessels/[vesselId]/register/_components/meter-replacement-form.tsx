"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useMemo } from "react";
import { useForm, useWatch } from "react-hook-form";
import type { z } from "zod";
import { describedBy, Field } from "@/app/_components/forms/field";
import { FormActions } from "@/app/_components/forms/form-actions";
import { useSendForm } from "@/app/_components/forms/use-send-form";
import {
  formatHours,
  formatRate,
  formatShipTime,
  instantOfShipTime,
  shipClock,
  shipDay,
  utcOffsetLabel,
} from "@/server/format/hours";
import { MeterReplacementInput, type RegisterCounter, type RegisterView } from "@/server/register/contract";
import { MeterValue } from "@/server/readings/contract";
import { readingProblem, round1 } from "@/server/readings/rules";
import { estimateFinal } from "@/server/register/meter-estimate";
import { useReplaceMeter } from "./use-register";

type Values = z.input<typeof MeterReplacementInput>;
type Output = z.output<typeof MeterReplacementInput>;
const FIELDS = [
  "replacedAt",
  "replacedAt.shipDay",
  "replacedAt.time",
  "oldMeterFinal",
  "newMeterStart",
  "reason",
] as const;

type Props = { view: RegisterView; counter: RegisterCounter; onDone: (message: string) => void; onCancel: () => void };

export function MeterReplacementForm({ view, counter, onDone, onCancel }: Props) {
  const { timeZone } = view.vessel;
  const now = useMemo(() => new Date(view.now), [view.now]);
  const replace = useReplaceMeter(view.vessel.id);
  const form = useForm<Values, unknown, Output>({
    resolver: zodResolver(MeterReplacementInput),
    defaultValues: {
      replacedAt: { shipDay: shipDay(now, timeZone), time: shipClock(now, timeZone) },
      oldMeterFinal: "",
      newMeterStart: "0",
      reason: "",
    },
  });
  const { register, formState, control } = form;
  const { errors, isSubmitting } = formState;
  const [day, time, finalRaw, startRaw] = useWatch({
    control,
    name: ["replacedAt.shipDay", "replacedAt.time", "oldMeterFinal", "newMeterStart"],
  });
  const replacedAt =
    /^\d{4}-\d{2}-\d{2}$/.test(day) && /^\d{2}:\d{2}$/.test(time) ? instantOfShipTime(day, time, timeZone) : null;
  const last = counter.last;
  const lastAt = last ? new Date(last.readAt) : null;

  // The same checks as the server, while typing: the old meter may not go back, nor run 25 h in 24.
  const final = String(finalRaw ?? "").trim() ? MeterValue.safeParse(finalRaw) : null;
  const start = MeterValue.safeParse(String(startRaw ?? "").trim() || "0");
  const liveProblem =
    final?.success && replacedAt && last && lastAt && replacedAt > lastAt
      ? readingProblem(
          {
            name: counter.name,
            segmentStartedAt: null,
            previous: { readAt: lastAt, meterValue: last.meterValue },
            next: null,
            existingAtSameInstant: null,
          },
          final.data,
          replacedAt,
          timeZone,
        )
      : null;
  const offsetNow = last ? round1(last.totalHours - last.meterValue) : null;
  // No final value read: the old meter's hours since its last reading, estimated at the running rate.
  const rate = counter.runningRate ?? counter.plannedHoursPerDay;
  const estimate = estimateFinal(last, replacedAt, rate);
  const totalAtChange =
    final?.success && offsetNow !== null
      ? round1(final.data + offsetNow)
      : estimate && offsetNow !== null
        ? round1(estimate.value + offsetNow)
        : (last?.totalHours ?? null);

  const { onSubmit, problem } = useSendForm(form, {
    fields: FIELDS,
    send: async (values) => {
      // Left empty: the estimate is the old meter's final value, and the reason says so.
      const input =
        values.oldMeterFinal === undefined || values.oldMeterFinal === null
          ? estimate
            ? {
                ...values,
                oldMeterFinal: estimate.value,
                reason: `${values.reason} (old meter not read: its final value ${formatHours(estimate.value)} estimated at ${formatRate(rate)})`,
              }
            : values
          : values;
      const result = await replace.mutateAsync({ id: counter.id, input });
      onDone(
        `${counter.name}: meter ${result.segment} fitted; totals carry on with an offset of ${formatHours(result.offsetHours)}.`,
      );
    },
  });

  const timeError =
    errors.replacedAt?.shipDay?.message ?? errors.replacedAt?.time?.message ?? errors.replacedAt?.message;
  return (
    <form onSubmit={onSubmit} noValidate className="grid gap-4">
      <div
        role="note"
        className="rounded-md border border-brass-400 bg-brass-100 px-3 py-2 text-brass-700 dark:border-brass-600 dark:bg-brass-700/20 dark:text-brass-300"
      >
        <p className="font-semibold">Read the old meter before it comes off.</p>
        <p>
          Its final value closes the old meter’s hours; without it, the hours run since the last reading are lost.
          Isolate the meter’s supply before removing it; the maker’s instructions and the ship’s safety procedures
          prevail.
        </p>
      </div>

      <p className="text-ink-600 dark:text-ink-300">
        Meter {counter.segment} is fitted now.{" "}
        {last && lastAt ? (
          <>
            Last reading {formatHours(last.meterValue)} on {formatShipTime(lastAt, timeZone)}
            {offsetNow ? ` (total ${formatHours(last.totalHours)})` : ""}.
          </>
        ) : (
          "No reading on this meter yet."
        )}
      </p>

      <fieldset className="grid gap-1">
        <legend className="label">Replaced at, ship’s time</legend>
        <div className="flex flex-wrap items-center gap-2">
          <input
            type="date"
            aria-label="Ship’s day of the replacement"
            max={shipDay(now, timeZone)}
            className="field w-40"
            aria-invalid={timeError ? true : undefined}
            aria-describedby={timeError ? "replaced-at-error" : undefined}
            {...register("replacedAt.shipDay")}
          />
          <input
            type="time"
            aria-label="Ship’s time of the replacement"
            className="field w-32"
            aria-invalid={timeError ? true : undefined}
            aria-describedby={timeError ? "replaced-at-error" : undefined}
            {...register("replacedAt.time")}
          />
          <span className="text-xs text-ink-500">
            {timeZone} ({utcOffsetLabel(replacedAt ?? now, timeZone)})
          </span>
        </div>
        {timeError && (
          <p id="replaced-at-error" className="field-error">
            {timeError}
          </p>
        )}
      </fieldset>

      <Field
        id="old-meter-final"
        label="Final value on the old meter (h)"
        hint={
          estimate
            ? `Leave empty only if the old meter could not be read: Keelson then takes ${formatHours(estimate.value)}, its last reading plus ${formatHours(estimate.ran)} at the running rate of ${formatRate(rate)}, and says so in the reason.`
            : "Leave empty only if the old meter could not be read."
        }
        error={errors.oldMeterFinal?.message ?? liveProblem ?? undefined}
      >
        <input
          className="field w-40 text-right tabular-nums"
          inputMode="decimal"
          autoComplete="off"
          autoFocus
          placeholder={estimate ? `≈ ${estimate.value}` : last ? String(last.meterValue) : ""}
          {...describedBy("old-meter-final", errors.oldMeterFinal?.message ?? liveProblem ?? undefined, true)}
          {...register("oldMeterFinal")}
        />
      </Field>

      <Field
        id="new-meter-start"
        label="Value shown by the new meter (h)"
        hint="Usually 0 for a new meter."
        error={errors.newMeterStart?.message}
      >
        <input
          className="field w-40 text-right tabular-nums"
          inputMode="decimal"
          autoComplete="off"
          {...describedBy("new-meter-start", errors.newMeterStart?.message, true)}
          {...register("newMeterStart")}
        />
      </Field>

      <Field id="replacement-reason" label="Reason" error={errors.reason?.message}>
        <textarea
          rows={2}
          className="field"
          placeholder="e.g. Display failed; meter renewed"
          {...describedBy("replacement-reason", errors.reason?.message)}
          {...register("reason")}
        />
      </Field>

      {totalAtChange !== null && start.success && !liveProblem && (
        <p className="rounded-md bg-ink-100 px-3 py-2 text-ink-700 tabular-nums dark:bg-ink-850 dark:text-ink-200">
          Total at the change {formatHours(totalAtChange)}
          {!final?.success && estimate ? " (estimated from the running rate: the old meter was not read)" : ""}; the new
          meter’s readings count on from there (offset {formatHours(round1(totalAtChange - start.data))}).
        </p>
      )}

      <FormActions
        submitLabel="Record the new meter"
        busyLabel="Recording…"
        busy={isSubmitting}
        problem={problem}
        onCancel={onCancel}
      />
    </form>
  );
}

