"use client";

import { Bar, BarChart, CartesianGrid, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import { useState } from "react";
import { Notice } from "@/app/_components/notice";
import { formatHours } from "@/server/format/hours";
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
            <div className="h-56 text-ink-500" data-testid="running-hours-chart" data-points={daily.length} data-last-day={daily.at(-1)?.day} data-last-hours={daily.at(-1)?.hours}>
              <ResponsiveContainer width="100%" height="100%">
                <BarChart data={daily} margin={{ top: 4, right: 4, bottom: 0, left: -16 }}>
                  <CartesianGrid strokeDasharray="3 3" vertical={false} stroke="currentColor" strokeOpacity={0.2} />
                  <XAxis dataKey="day" tickFormatter={(d: string) => d.slice(5)} minTickGap={24} stroke="currentColor" fontSize={11} />
                  <YAxis domain={[0, 24]} ticks={[0, 6, 12, 18, 24]} stroke="currentColor" fontSize={11} />
                  <Tooltip
                    formatter={(v) => [formatHours(Number(v)), "Ran"]}
                    labelFormatter={(d) => `Ship's day ${String(d)}`}
                    contentStyle={{ fontSize: 12 }}
                  />
                  <Bar dataKey="hours" fill="#23879a" isAnimationActive={false} />
                </BarChart>
              </ResponsiveContainer>
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
