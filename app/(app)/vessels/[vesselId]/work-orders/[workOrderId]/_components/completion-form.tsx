"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useForm, useWatch } from "react-hook-form";
import type { z } from "zod";
import { describedBy, Field } from "@/app/_components/forms/field";
import { FormActions } from "@/app/_components/forms/form-actions";
import { rowFields, useSendForm } from "@/app/_components/forms/use-send-form";
import { CompletionInput, limitSide, type WorkOrderDetail } from "@/server/completions/contract";
import { formatHours, formatShipTime, shipClock, shipDay } from "@/server/format/hours";
import { RANKS, type Rank } from "@/server/routines/contract";
import { CompletionParts, startingPartsUsed } from "./completion-parts";
import { CompletionPeople } from "./completion-people";
import { useSaveCompletion } from "./use-work-order";

type Values = z.input<typeof CompletionInput>;
type Output = z.output<typeof CompletionInput>;

type Props = { detail: WorkOrderDetail; onDone: (message: string) => void };

function startingValues(detail: WorkOrderDetail): Values {
  const record = detail.completion;
  const tz = detail.vessel.timeZone;
  if (record) {
    const at = new Date(record.doneAt);
    return {
      doneOn: shipDay(at, tz),
      time: shipClock(at, tz),
      counterHours: record.counterHours === null ? "" : String(record.counterHours),
      manHours: String(record.manHours),
      checklist: record.checklist.map((t) => ({ step: t.step, done: t.done, remark: t.remark ?? "" })),
      measurements: record.measurements.map((m) => ({ name: m.name, value: String(m.value) })),
      remarks: record.remarks,
      responsibleId: record.responsibleId ?? "",
      workedBy: record.workedBy.map((p) => ({ rank: p.rank as Rank, name: p.name })),
      partsUsed: startingPartsUsed(detail),
    };
  }
  const now = new Date(detail.now);
  return {
    doneOn: shipDay(now, tz),
    time: shipClock(now, tz),
    // The latest reading is the likeliest value: the job is usually recorded the day it is done.
    counterHours: detail.counter?.latest ? String(detail.counter.latest.totalHours) : "",
    manHours: String(detail.workOrder.estimatedManHours),
    checklist: (detail.routine?.checklist ?? []).map((step) => ({ step, done: false, remark: "" })),
    measurements: (detail.routine?.measurements ?? []).map((m) => ({ name: m.name, value: "" })),
    remarks: "",
    // The vessel's chief answers for most jobs; the work order's rank did it, names to be filled in.
    responsibleId: detail.responsibleChoices.find((c) => c.role === "chief-engineer")?.id ?? "",
    workedBy: RANKS.includes(detail.workOrder.rank as Rank) ? [{ rank: detail.workOrder.rank as Rank, name: "" }] : [],
    partsUsed: startingPartsUsed(detail),
  };
}

/** The engineer's record of the job: checklist, measurements against limits, counter, time, effort. */
export function CompletionForm({ detail, onDone }: Props) {
  const resubmit = detail.completion?.status === "returned";
  const save = useSaveCompletion(detail.vessel.id, detail.workOrder.id, resubmit);
  const form = useForm<Values, unknown, Output>({
    resolver: zodResolver(CompletionInput),
    defaultValues: startingValues(detail),
  });
  const { register, formState, control } = form;
  const { errors, isSubmitting } = formState;
  const checklist = useWatch({ control, name: "checklist" });
  const measured = useWatch({ control, name: "measurements" });
  const limits = detail.routine?.measurements ?? [];
  const tz = detail.vessel.timeZone;
  const latest = detail.counter?.latest;
  const { onSubmit, problem } = useSendForm(form, {
    fields: [
      "doneOn",
      "time",
      "counterHours",
      "manHours",
      "remarks",
      ...rowFields("checklist", checklist.length, ["remark"]),
      "checklist",
      ...rowFields("measurements", limits.length, ["value", "name"]),
      "measurements",
      "responsibleId",
      ...rowFields("workedBy", form.getValues("workedBy")?.length ?? 0, ["rank", "name"]),
      "workedBy",
      ...rowFields("partsUsed", form.getValues("partsUsed")?.length ?? 0, ["partId", "quantity", "counted", "reason"]),
      "partsUsed",
    ],
    send: async (values) => {
      const result = await save.mutateAsync(values);
      onDone(
        `Recorded; it now awaits the chief engineer’s approval.${result.followUpNumber ? ` Values out of limits raised the follow-up ${result.followUpNumber}.` : ""}`,
      );
    },
  });

  return (
    <form onSubmit={onSubmit} noValidate className="grid gap-5 panel p-4" aria-labelledby="completion-heading">
      <h2 id="completion-heading" className="text-base font-semibold">
        {resubmit ? "Correct and resubmit the completion" : "Record the completion"}
      </h2>

      {checklist.length > 0 && (
        <fieldset className="grid gap-2">
          <legend className="label">Checklist — tick each step done, or say why not</legend>
          {checklist.map((tick, i) => {
            const error = errors.checklist?.[i]?.remark?.message;
            return (
              <div key={i} className="grid gap-1 rounded-md border border-ink-200 p-2 dark:border-ink-800">
                <label className="flex items-start gap-2">
                  <input type="checkbox" className="mt-0.5" {...register(`checklist.${i}.done`)} />
                  <span>
                    <span className="text-ink-500">{i + 1}.</span> {tick.step}
                  </span>
                </label>
                {!tick.done && (
                  <div className="pl-6">
                    <input
                      className="field"
                      placeholder="Why it was not done"
                      aria-label={`Remark for step ${i + 1}`}
                      {...describedBy(`step-${i}-remark`, error)}
                      {...register(`checklist.${i}.remark`)}
                    />
                    {error && (
                      <p id={`step-${i}-remark-error`} className="field-error">
                        {error}
                      </p>
                    )}
                  </div>
                )}
              </div>
            );
          })}
          {errors.checklist?.message && <p className="field-error">{errors.checklist.message}</p>}
        </fieldset>
      )}

      {limits.length > 0 && (
        <fieldset className="grid gap-3 sm:grid-cols-2">
          <legend className="label">Measurements</legend>
          {limits.map((m, i) => {
            const raw = String(measured[i]?.value ?? "")
              .trim()
              .replace(",", ".");
            const value = raw && /^-?\d+(\.\d+)?$/.test(raw) ? Number(raw) : null;
            const side = value === null ? null : limitSide(m, value);
            const error = errors.measurements?.[i]?.value?.message ?? errors.measurements?.[i]?.name?.message;
            const id = `measurement-${i}`;
            return (
              <Field
                key={m.name}
                id={id}
                label={`${m.name} (${m.unit})`}
                hint={`Limits ${m.lower ?? "—"} … ${m.upper ?? "—"} ${m.unit}`}
                error={error}
              >
                <input type="hidden" {...register(`measurements.${i}.name`)} />
                <input
                  className={`field w-36 text-right tabular-nums ${side ? "border-alarm-500 dark:border-alarm-500" : ""}`}
                  inputMode="decimal"
                  autoComplete="off"
                  {...describedBy(id, error, true)}
                  {...register(`measurements.${i}.value`)}
                />
                {side && (
                  <p role="status" className="mt-1 text-sm font-semibold text-alarm-700 dark:text-alarm-300">
                    ▲ {side === "low" ? "below" : "above"} the limit: a follow-up corrective work order will be raised
                  </p>
                )}
              </Field>
            );
          })}
          {errors.measurements?.message && <p className="field-error sm:col-span-2">{errors.measurements.message}</p>}
        </fieldset>
      )}

      <div className="grid gap-4 sm:grid-cols-4">
        <Field id="done-on" label="Ship’s day done" error={errors.doneOn?.message}>
          <input
            type="date"
            className="field"
            {...describedBy("done-on", errors.doneOn?.message)}
            {...register("doneOn")}
          />
        </Field>
        <Field id="done-time" label="Ship’s time (HH:MM)" error={errors.time?.message}>
          {/* Text, not type=time: the ship's clock is 24-hour whatever the tablet's locale. */}
          <input
            className="field tabular-nums"
            inputMode="numeric"
            maxLength={5}
            placeholder="HH:MM"
            autoComplete="off"
            {...describedBy("done-time", errors.time?.message)}
            {...register("time")}
          />
        </Field>
        {detail.counter && (
          <Field
            id="counter-hours"
            label={`Counter at completion (${detail.counter.name})`}
            hint={
              latest
                ? `Latest reading ${formatHours(latest.totalHours)}, ${formatShipTime(new Date(latest.readAt), tz)}`
                : "No reading yet"
            }
            error={errors.counterHours?.message}
          >
            <input
              className="field text-right tabular-nums"
              inputMode="decimal"
              autoComplete="off"
              {...describedBy("counter-hours", errors.counterHours?.message, true)}
              {...register("counterHours")}
            />
          </Field>
        )}
        <Field id="man-hours" label="Man-hours spent" error={errors.manHours?.message}>
          <input
            className="field text-right tabular-nums"
            inputMode="decimal"
            autoComplete="off"
            {...describedBy("man-hours", errors.manHours?.message)}
            {...register("manHours")}
          />
        </Field>
      </div>

      <CompletionPeople form={form} detail={detail} />

      <CompletionParts form={form} detail={detail} />

      <Field
        id="remarks"
        label="Remarks"
        hint="What was found, what was renewed, what to watch next time."
        error={errors.remarks?.message}
      >
        <textarea
          className="field min-h-24"
          {...describedBy("remarks", errors.remarks?.message, true)}
          {...register("remarks")}
        />
      </Field>

      <div className="no-print">
        <FormActions
          submitLabel={resubmit ? "Resubmit for approval" : "Record for approval"}
          busy={isSubmitting}
          problem={problem}
        />
      </div>
    </form>
  );
}
