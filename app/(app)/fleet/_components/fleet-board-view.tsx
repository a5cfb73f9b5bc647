"use client";

import { LoadProblem } from "@/app/_components/notice";
import { FleetTable } from "./fleet-table";
import { FleetTrendChart } from "./fleet-trend-chart";
import { PendingDeferrals } from "./pending-deferrals";
import { useFleetBoard } from "./use-fleet-board";

export function FleetBoardView() {
  const { data, error, isPending } = useFleetBoard();
  if (error) return <LoadProblem what="Fleet board" error={error} />;
  if (isPending) {
    return (
      <div className="grid gap-4" aria-busy="true" aria-label="Loading the Fleet board">
        <div className="h-56 animate-pulse panel" />
        <div className="h-72 animate-pulse panel" />
      </div>
    );
  }
  const now = new Date(data.generatedAt);
  if (data.vessels.length === 0) {
    return (
      <div className="panel p-6 text-ink-600 dark:text-ink-300">
        <p className="font-medium">The company has no active vessel yet.</p>
        <p>
          An administrator adds vessels under Company → Vessels; their figures appear here after the worker’s first run.
        </p>
      </div>
    );
  }
  const stopped = data.vessels.filter((v) => v.stoppedReporting);
  return (
    <div className="grid grid-cols-[minmax(0,1fr)] gap-4">
      {stopped.length > 0 && (
        <p
          role="status"
          className="rounded-md border border-alarm-500 bg-alarm-50 px-3 py-2 font-medium text-alarm-700 dark:bg-alarm-700/20 dark:text-alarm-300"
        >
          <span aria-hidden="true">⊘ </span>
          {stopped.length === 1 ? "1 vessel has" : `${stopped.length} vessels have`} stopped reporting hours:{" "}
          {stopped.map((v) => v.name).join(", ")}.
        </p>
      )}
      <FleetTrendChart board={data} />
      <FleetTable board={data} />
      <PendingDeferrals board={data} now={now} />
    </div>
  );
}
