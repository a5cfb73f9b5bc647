"use client";

import { useState } from "react";
import { RunningHoursChart } from "./running-hours-chart";
import { ReadingForm } from "./reading-form";
import { useHourLog } from "./use-hour-log";

export function HourLog({ vesselId }: { vesselId: string }) {
  const { data, error, isPending } = useHourLog(vesselId);
  const [chartCounter, setChartCounter] = useState<string | undefined>();

  if (isPending) return <HourLogSkeleton />;
  if (error) {
    return (
      <p role="alert" className="panel p-4 text-alarm-700 dark:text-alarm-300">
        The Hour log could not be loaded: {error.message}
      </p>
    );
  }
  if (data.counters.length === 0) {
    return (
      <div className="panel p-6">
        <p className="font-medium">This vessel has no counters yet.</p>
        <p className="text-ink-600 dark:text-ink-300">
          A chief engineer adds hour meters in the machinery register; they then appear here.
        </p>
      </div>
    );
  }
  const selected = chartCounter ?? data.counters[0]!.id;
  return (
    <div className="grid gap-4">
      {/* A counter added or retired elsewhere gives the form a new set of rows. */}
      <ReadingForm key={data.counters.map((c) => c.id).join()} view={data} onShowChart={setChartCounter} />
      <RunningHoursChart
        vesselId={vesselId}
        counters={data.counters.map(({ id, name }) => ({ id, name }))}
        counterId={selected}
        onCounterChange={setChartCounter}
        timeZone={data.vessel.timeZone}
        canWrite={data.canWrite}
      />
    </div>
  );
}

function HourLogSkeleton() {
  return (
    <div className="animate-pulse panel p-4" aria-busy="true" aria-label="Loading the Hour log">
      <div className="mb-4 h-6 w-64 rounded bg-ink-200 dark:bg-ink-800" />
      {Array.from({ length: 8 }, (_, i) => (
        <div key={i} className="mb-2 h-9 rounded bg-ink-100 dark:bg-ink-850" />
      ))}
    </div>
  );
}
