"use client";

import type { UseFormRegisterReturn } from "react-hook-form";
import { ageOf } from "@/app/_components/relative-age";
import { formatHours, formatRate, formatShipTime } from "@/server/format/hours";
import { type HourLogCounter, MeterValue } from "@/server/readings/contract";
import { hoursPerDay, readingProblem, round1 } from "@/server/readings/rules";

type RowProps = {
  counter: HourLogCounter;
  raw: string;
  readAt: Date | null;
  timeZone: string;
  now: Date;
  disabled: boolean;
  error?: string;
  inputProps: UseFormRegisterReturn;
  inputRef: (el: HTMLInputElement | null) => void;
  onKeyDown: (event: React.KeyboardEvent<HTMLInputElement>) => void;
  onShowChart: () => void;
};

/** One counter: its last reading, the new one being typed, and the difference and rate it makes. */
export function CounterRow({
  counter,
  raw,
  readAt,
  timeZone,
  now,
  disabled,
  error,
  inputProps,
  inputRef,
  onKeyDown,
  onShowChart,
}: RowProps) {
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
            {
              name: counter.name,
              segmentStartedAt: null,
              previous: readAt > lastAt ? { readAt: lastAt, meterValue: last.meterValue } : null,
              next: null,
              existingAtSameInstant: null,
            },
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
        <button
          type="button"
          onClick={onShowChart}
          className="-my-1 py-1 text-xs text-tide-700 underline-offset-2 hover:underline dark:text-tide-300"
        >
          Chart
        </button>
      </th>
      <td className="px-3 py-2 whitespace-nowrap">
        {last && lastAt ? (
          <>
            <span className="block font-medium tabular-nums">{formatHours(last.meterValue)}</span>
            <span className="block text-xs text-ink-500 dark:text-ink-400">
              {formatShipTime(lastAt, timeZone)} · {ageOf(lastAt, now, timeZone)}
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
          <span className="text-ink-500">—</span>
        )}
      </td>
      <td className="px-3 py-2 whitespace-nowrap text-ink-600 tabular-nums dark:text-ink-300">
        {counter.rate ? (
          <>
            {formatRate(counter.rate.hoursPerDay)}
            <span className="block text-xs text-ink-500">
              {counter.rate.basis === "measured" ? "last 30 days" : "planned"}
            </span>
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
