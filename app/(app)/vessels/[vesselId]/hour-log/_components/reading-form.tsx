"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useMemo, useRef, useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { ProblemError } from "@/app/_components/fetch-json";
import { ageOf } from "@/app/_components/relative-age";
import { formatHours, formatShipTime, instantOfShipTime, shipClock, shipDay, utcOffsetLabel } from "@/server/format/hours";
import type { HourLogCounter, HourLogView } from "@/server/readings/contract";
import { MeterValue } from "@/server/readings/contract";
import { hoursPerDay, isInFuture, readingProblem, round1 } from "@/server/readings/rules";
import { HourLogForm, toBatch } from "./hour-log-form";
import { useSaveReadings } from "./use-hour-log";

type Props = { view: HourLogView; onShowChart: (counterId: string) => void };

export function ReadingForm({ view, onShowChart }: Props) {
  const { vessel, counters, canWrite } = view;
  const now = useMemo(() => new Date(view.now), [view.now]);
  const today = shipDay(now, vessel.timeZone);
  const order = counters.map((c) => c.id);
  const save = useSaveReadings(vessel.id);
  const [saved, setSaved] = useState<string | null>(null);
  const [formProblem, setFormProblem] = useState<string | null>(null);
  const inputs = useRef<(HTMLInputElement | null)[]>([]);

  const form = useForm<HourLogForm>({
    resolver: zodResolver(HourLogForm),
    defaultValues: {
      shipDay: today,
      time: shipClock(now, vessel.timeZone),
      values: Object.fromEntries(order.map((id) => [id, ""])),
    },
  });
  const { register, handleSubmit, formState, setError, reset, control } = form;
  const [day, time, values] = useWatch({ control, name: ["shipDay", "time", "values"] });
  const readAt = /^\d{4}-\d{2}-\d{2}$/.test(day) && /^\d{2}:\d{2}$/.test(time) ? instantOfShipTime(day, time, vessel.timeZone) : null;
  const filled = order.filter((id) => values?.[id]?.trim()).length;

  async function onSubmit(data: HourLogForm) {
    setSaved(null);
    setFormProblem(null);
    const batch = toBatch(data, order);
    try {
      const result = await save.mutateAsync(batch);
      setSaved(
        `Saved ${result.saved} reading${result.saved === 1 ? "" : "s"} for ${formatShipTime(new Date(result.readAt), vessel.timeZone)} ship's time.`,
      );
      reset({ shipDay: data.shipDay, time: data.time, values: Object.fromEntries(order.map((id) => [id, ""])) });
    } catch (error) {
      if (!(error instanceof ProblemError)) {
        setFormProblem("The readings could not be sent. Check the connection and try again; nothing was saved.");
        return;
      }
      (error.problem.errors ?? []).forEach((e, i) => {
        // The first refused row takes focus, so the keyboard lands where the correction goes.
        const options = { shouldFocus: i === 0 };
        const counterId = e.row !== undefined ? batch.entries[e.row]?.counterId : undefined;
        if (counterId) setError(`values.${counterId}`, { message: e.message }, options);
        else if (e.field === "time" || e.field === "shipDay") setError(e.field, { message: e.message }, options);
      });
      setFormProblem(`${error.problem.detail} Nothing was saved.`);
    }
  }

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
    <form onSubmit={handleSubmit(onSubmit)} noValidate className="panel">
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
            aria-invalid={formState.errors.shipDay ? true : undefined}
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
            aria-invalid={formState.errors.time ? true : undefined}
            {...register("time")}
          />
        </div>
        <p className="pb-1.5 text-ink-500 dark:text-ink-400">
          {vessel.timeZone} ({utcOffsetLabel(readAt ?? now, vessel.timeZone)}) · ship’s time now{" "}
          {formatShipTime(now, vessel.timeZone)}
        </p>
        {(formState.errors.shipDay || formState.errors.time) && (
          <p className="field-error w-full" role="alert">
            {formState.errors.shipDay?.message ?? formState.errors.time?.message}
          </p>
        )}
        {readAt && isInFuture(readAt, new Date()) && !formState.errors.time && (
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
            {counters.map((counter, index) => (
              <CounterRow
                key={counter.id}
                counter={counter}
                index={index}
                raw={values?.[counter.id] ?? ""}
                readAt={readAt}
                timeZone={vessel.timeZone}
                now={now}
                disabled={!canWrite}
                error={formState.errors.values?.[counter.id]?.message}
                inputProps={register(`values.${counter.id}`)}
                inputRef={(el) => {
                  inputs.current[index] = el;
                }}
                onKeyDown={onKeyDown(index)}
                onShowChart={() => onShowChart(counter.id)}
              />
            ))}
          </tbody>
        </table>
      </div>

      <div className="flex flex-wrap items-center gap-3 border-t border-ink-200 p-4 dark:border-ink-800">
        {canWrite ? (
          <button type="submit" className="btn-primary" disabled={formState.isSubmitting}>
            {formState.isSubmitting ? "Saving…" : filled ? `Save ${filled} reading${filled === 1 ? "" : "s"}` : "Save readings"}
          </button>
        ) : (
          <p className="text-ink-600 dark:text-ink-300">Your role can read the Hour log but not enter readings.</p>
        )}
        <p className="text-xs text-ink-500">Enter moves to the next counter; all readings are saved together or not at all.</p>
        <div aria-live="polite" className="w-full empty:hidden">
          {saved && <p className="rounded-md bg-go-50 px-3 py-2 font-medium text-go-700 dark:bg-go-700/20 dark:text-go-300">{saved}</p>}
          {formProblem && (
            <p role="alert" className="rounded-md bg-alarm-50 px-3 py-2 font-medium text-alarm-700 dark:bg-alarm-700/20 dark:text-alarm-300">
              {formProblem}
            </p>
          )}
          {typeof formState.errors.values?.message === "string" && (
            <p className="field-error">{formState.errors.values.message}</p>
          )}
        </div>
      </div>
    </form>
  );
}

type RowProps = {
  counter: HourLogCounter;
  index: number;
  raw: string;
  readAt: Date | null;
  timeZone: string;
  now: Date;
  disabled: boolean;
  error?: string;
  inputProps: ReturnType<ReturnType<typeof useForm<HourLogForm>>["register"]>;
  inputRef: (el: HTMLInputElement | null) => void;
  onKeyDown: (event: React.KeyboardEvent<HTMLInputElement>) => void;
  onShowChart: () => void;
};

function CounterRow({ counter, raw, readAt, timeZone, now, disabled, error, inputProps, inputRef, onKeyDown, onShowChart }: RowProps) {
  const { last } = counter;
  const parsed = raw.trim() ? MeterValue.safeParse(raw) : null;
  const value = parsed?.success ? parsed.data : null;
  const lastAt = last ? new Date(last.readAt) : null;
  const live =
    value !== null && last && lastAt && readAt
      ? {
          diff: round1(value - last.meterValue),
          perDay: hoursPerDay(last.meterValue, lastAt, value, readAt),
          problem: readingProblem(
            { name: counter.name, segmentStartedAt: null, previous: readAt > lastAt ? { readAt: lastAt, meterValue: last.meterValue } : null, next: null, existingAtSameInstant: null },
            value,
            readAt,
            timeZone,
          ),
        }
      : null;
  const message = error ?? live?.problem ?? (parsed && !parsed.success ? parsed.error.issues[0]?.message : undefined);
  const id = `reading-${counter.id}`;
  const messageId = `${id}-message`;
  const { ref, ...rest } = inputProps;

  return (
    <tr className="border-b border-ink-100 align-top last:border-0 dark:border-ink-850">
      <th scope="row" className="px-4 py-2 font-normal">
        <label htmlFor={id} className="block font-semibold text-ink-900 dark:text-ink-50">
          {counter.name}
        </label>
        <span className="block text-xs text-ink-500 dark:text-ink-400">
          {counter.components.length ? counter.components.map((c) => c.code).join(", ") : "no component uses it yet"}
          {counter.segment > 1 ? ` · meter ${counter.segment}` : ""}
        </span>
        <button type="button" onClick={onShowChart} className="text-xs text-tide-700 underline-offset-2 hover:underline dark:text-tide-300">
          Chart
        </button>
      </th>
      <td className="px-3 py-2 whitespace-nowrap">
        {last && lastAt ? (
          <>
            <span className="block font-medium tabular-nums">{formatHours(last.meterValue)}</span>
            <span className="block text-xs text-ink-500 dark:text-ink-400">
              {formatShipTime(lastAt, timeZone)} · {ageOf(lastAt, now)}
            </span>
          </>
        ) : (
          <span className="text-ink-500">No reading yet</span>
        )}
      </td>
      <td className="px-3 py-2">
        <input
          id={id}
          inputMode="decimal"
          autoComplete="off"
          placeholder={last ? String(last.meterValue) : "0"}
          disabled={disabled}
          className="field w-36 text-right tabular-nums"
          aria-invalid={message ? true : undefined}
          aria-describedby={message ? messageId : undefined}
          onKeyDown={onKeyDown}
          ref={(el) => {
            ref(el);
            inputRef(el);
          }}
          {...rest}
        />
        {message && (
          <p id={messageId} className="field-error max-w-md">
            {message}
          </p>
        )}
      </td>
      <td className="px-3 py-2 whitespace-nowrap tabular-nums">
        {live ? (
          <>
            <span className={live.diff < 0 ? "font-semibold text-alarm-600" : "font-medium"}>
              {live.diff >= 0 ? "+" : "−"}
              {formatHours(Math.abs(live.diff))}
            </span>
            {live.perDay !== null && <span className="block text-xs text-ink-500">{live.perDay} h/day since last</span>}
          </>
        ) : (
          <span className="text-ink-400">—</span>
        )}
      </td>
      <td className="px-3 py-2 whitespace-nowrap text-ink-600 tabular-nums dark:text-ink-300">
        {counter.rate ? (
          <>
            {counter.rate.hoursPerDay} h/day
            <span className="block text-xs text-ink-500">{counter.rate.basis === "measured" ? "last 30 days" : "planned"}</span>
          </>
        ) : (
          <>
            {counter.plannedHoursPerDay} h/day<span className="block text-xs text-ink-500">planned</span>
          </>
        )}
      </td>
    </tr>
  );
}
