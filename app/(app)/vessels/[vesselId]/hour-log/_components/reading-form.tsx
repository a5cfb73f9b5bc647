"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useMemo, useRef, useState } from "react";
import { useFieldArray, useForm, useWatch } from "react-hook-form";
import { rowFields, useSendForm } from "@/app/_components/forms/use-send-form";
import { formatShipTime, instantOfShipTime, shipClock, shipDay, utcOffsetLabel } from "@/server/format/hours";
import type { HourLogView } from "@/server/readings/contract";
import { isInFuture } from "@/server/readings/rules";
import { CounterRow } from "./counter-row";
import { emptyEntries, formFieldOfBatch, HourLogForm, toBatch } from "./hour-log-form";
import { useSaveReadings } from "./use-hour-log";

type Props = { view: HourLogView; onShowChart: (counterId: string) => void };

export function ReadingForm({ view, onShowChart }: Props) {
  const { vessel, counters, canWrite } = view;
  const now = useMemo(() => new Date(view.now), [view.now]);
  const today = shipDay(now, vessel.timeZone);
  const order = counters.map((c) => c.id);
  const save = useSaveReadings(vessel.id);
  const [saved, setSaved] = useState<string | null>(null);
  const inputs = useRef<(HTMLInputElement | null)[]>([]);

  const form = useForm<HourLogForm>({
    resolver: zodResolver(HourLogForm),
    defaultValues: { shipDay: today, time: shipClock(now, vessel.timeZone), entries: emptyEntries(order) },
  });
  const { register, formState, reset, control } = form;
  const rows = useFieldArray({ control, name: "entries" });
  const [day, time, entries] = useWatch({ control, name: ["shipDay", "time", "entries"] });
  const readAt =
    /^\d{4}-\d{2}-\d{2}$/.test(day) && /^\d{2}:\d{2}$/.test(time)
      ? instantOfShipTime(day, time, vessel.timeZone)
      : null;
  const filled = entries.filter((e) => e.value.trim()).length;
  const { errors } = formState;

  const { onSubmit, problem } = useSendForm(form, {
    fields: (values) => ["shipDay", "time", ...rowFields("entries", values.entries.length, ["value"])],
    fieldOf: formFieldOfBatch,
    send: async (values) => {
      setSaved(null);
      const result = await save.mutateAsync(toBatch(values));
      setSaved(
        `Saved ${result.saved} reading${result.saved === 1 ? "" : "s"} for ${formatShipTime(new Date(result.readAt), vessel.timeZone)} ship's time.`,
      );
      reset({ shipDay: values.shipDay, time: values.time, entries: emptyEntries(order) });
    },
  });

  function onKeyDown(index: number) {
    return (event: React.KeyboardEvent<HTMLInputElement>) => {
      if (event.key !== "Enter" || event.ctrlKey || event.metaKey) return;
      const next = inputs.current[index + 1];
      if (next) {
        event.preventDefault();
        next.focus();
      }
    };
  }

  return (
    <form onSubmit={onSubmit} noValidate className="panel">
      <div className="flex flex-wrap items-end gap-4 border-b border-ink-200 p-4 dark:border-ink-800">
        <div>
          <label htmlFor="shipDay" className="label">
            Ship’s day
          </label>
          <input
            id="shipDay"
            type="date"
            max={today}
            className="field w-40"
            aria-invalid={errors.shipDay ? true : undefined}
            {...register("shipDay")}
          />
        </div>
        <div>
          <label htmlFor="time" className="label">
            Ship’s time
          </label>
          {/* A text field, not type=time: the ship's clock is always 24-hour, whatever the tablet's locale. */}
          <input
            id="time"
            inputMode="numeric"
            placeholder="HH:MM"
            maxLength={5}
            autoComplete="off"
            className="field w-24 tabular-nums"
            aria-invalid={errors.time ? true : undefined}
            {...register("time")}
          />
        </div>
        <p className="pb-1.5 text-ink-500 dark:text-ink-400">
          {vessel.timeZone} ({utcOffsetLabel(readAt ?? now, vessel.timeZone)}) · ship’s time now{" "}
          {formatShipTime(now, vessel.timeZone)}
        </p>
        {(errors.shipDay || errors.time) && (
          <p className="field-error w-full" role="alert">
            {errors.shipDay?.message ?? errors.time?.message}
          </p>
        )}
        {readAt && isInFuture(readAt, new Date()) && !errors.time && (
          <p className="field-error w-full">That ship’s time has not come yet.</p>
        )}
      </div>

      <div className="overflow-x-auto">
        <table className="w-full text-left">
          <thead className="text-xs tracking-wide text-ink-500 uppercase dark:text-ink-400">
            <tr className="border-b border-ink-200 dark:border-ink-800">
              <th scope="col" className="px-4 py-2 font-semibold">
                Counter
              </th>
              <th scope="col" className="px-3 py-2 font-semibold">
                Last reading
              </th>
              <th scope="col" className="px-3 py-2 font-semibold">
                New reading (h)
              </th>
              <th scope="col" className="px-3 py-2 font-semibold">
                Difference
              </th>
              <th scope="col" className="px-3 py-2 font-semibold">
                Rate
              </th>
            </tr>
          </thead>
          <tbody>
            {rows.fields.map((row, index) => {
              const counter = counters.find((c) => c.id === row.counterId);
              if (!counter) return null;
              return (
                <CounterRow
                  key={row.id}
                  counter={counter}
                  raw={entries[index]?.value ?? ""}
                  readAt={readAt}
                  timeZone={vessel.timeZone}
                  now={now}
                  disabled={!canWrite}
                  error={errors.entries?.[index]?.value?.message}
                  inputProps={register(`entries.${index}.value`)}
                  inputRef={(el) => {
                    inputs.current[index] = el;
                  }}
                  onKeyDown={onKeyDown(index)}
                  onShowChart={() => onShowChart(counter.id)}
                />
              );
            })}
          </tbody>
        </table>
      </div>

      <div className="flex flex-wrap items-center gap-3 border-t border-ink-200 p-4 dark:border-ink-800">
        {canWrite ? (
          <button type="submit" className="btn-primary" disabled={formState.isSubmitting}>
            {formState.isSubmitting
              ? "Saving…"
              : filled
                ? `Save ${filled} reading${filled === 1 ? "" : "s"}`
                : "Save readings"}
          </button>
        ) : (
          <p className="text-ink-600 dark:text-ink-300">Your role can read the Hour log but not enter readings.</p>
        )}
        <p className="text-xs text-ink-500">
          Enter moves to the next counter; all readings are saved together or not at all.
        </p>
        <div aria-live="polite" className="w-full empty:hidden">
          {saved && (
            <p className="rounded-md bg-go-50 px-3 py-2 font-medium text-go-700 dark:bg-go-700/20 dark:text-go-300">
              {saved}
            </p>
          )}
          {problem && (
            <p
              role="alert"
              className="rounded-md bg-alarm-50 px-3 py-2 font-medium text-alarm-700 dark:bg-alarm-700/20 dark:text-alarm-300"
            >
              {problem}
            </p>
          )}
          {errors.entries?.root?.message && <p className="field-error">{errors.entries.root.message}</p>}
        </div>
      </div>
    </form>
  );
}
