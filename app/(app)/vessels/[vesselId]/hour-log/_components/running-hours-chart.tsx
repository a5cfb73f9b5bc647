"use client";

import { useState } from "react";
import { Notice } from "@/app/_components/notice";
import { formatHours } from "@/server/format/hours";
import { DailyHoursChart } from "./daily-hours-chart";
import { RecentReadings } from "./recent-readings";
import { useReadingHistory } from "./use-hour-log";

type Props = {
  vesselId: string;
  counters: { id: string; name: string }[];
  counterId: string;
  onCounterChange: (id: string) => void;
  timeZone: string;
  /** Whether the user may correct readings (`readings:write`). */
  canWrite: boolean;
};

const DAYS = 90;

export function RunningHoursChart({ vesselId, counters, counterId, onCounterChange, timeZone, canWrite }: Props) {
  const { data, isPending, error } = useReadingHistory(vesselId, counterId, DAYS);
  const [changed, setChanged] = useState<string | null>(null);
  const daily = data?.daily ?? [];
  const total = daily.reduce((sum, d) => sum + d.hours, 0);
  const counterName = counters.find((c) => c.id === counterId)?.name ?? "the counter";

  return (
    <section className="panel p-4" aria-labelledby="chart-heading">
      <div className="mb-3 flex flex-wrap items-center justify-between gap-3">
        <h2 id="chart-heading" className="font-semibold">
          Daily running hours, last {DAYS} days
        </h2>
        <label className="flex items-center gap-2">
          <span className="text-ink-600 dark:text-ink-300">Counter</span>
          <select
            className="field w-auto"
            value={counterId}
            onChange={(e) => {
              setChanged(null);
              onCounterChange(e.target.value);
            }}
          >
            {counters.map((c) => (
              <option key={c.id} value={c.id}>
                {c.name}
              </option>
            ))}
          </select>
        </label>
      </div>
      <Notice message={changed} className="mb-3" />
      {error ? (
        <p role="alert" className="text-alarm-600">
          The history could not be loaded: {error.message}
        </p>
      ) : isPending ? (
        <div className="h-56 animate-pulse rounded bg-ink-100 dark:bg-ink-850" aria-busy="true" />
      ) : daily.length === 0 ? (
        <p className="py-10 text-center text-ink-500">No readings in the last {DAYS} days.</p>
      ) : (
        <div className="grid gap-4 lg:grid-cols-[1fr_23rem]">
          <figure>
            <div className="text-ink-500" data-testid="running-hours-chart" data-points={daily.length} data-last-day={daily.at(-1)?.day} data-last-hours={daily.at(-1)?.hours}>
              <DailyHoursChart daily={daily} label={`Daily running hours of ${counterName}, last ${DAYS} days`} />
            </div>
            <figcaption className="mt-1 text-xs text-ink-500">
              {formatHours(Math.round(total * 10) / 10)} over {daily.length} days, {(total / daily.length).toFixed(1)} h/day on
              average. Between two readings the hours are spread evenly over the ship’s days.
            </figcaption>
          </figure>
          {data && (
            <RecentReadings vesselId={vesselId} history={data} timeZone={timeZone} canWrite={canWrite} onChanged={setChanged} />
          )}
        </div>
      )}
    </section>
  );
}
