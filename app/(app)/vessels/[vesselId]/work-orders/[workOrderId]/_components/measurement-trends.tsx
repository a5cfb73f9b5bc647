"use client";

// The routine's measurements over its completions, each against its limits with a straight line
// fitted to it, and a plain warning when the line reaches a limit before this job falls due: a
// first step from fixed intervals toward condition-based maintenance (EN 13306 §7.4, from memory).
import type { MeasurementTrendView, RoutineTrends } from "@/server/measurements/contract";
import { formatHours, formatShipDate } from "@/server/format/hours";
import { valueDecimals } from "@/server/measurements/trend-words";
import { TrendChart } from "./trend-chart";
import { useRoutineTrends } from "./use-trends";

type Props = { vesselId: string; workOrderId: string; routineId: string; timeZone: string };

export function MeasurementTrends({ vesselId, workOrderId, routineId, timeZone }: Props) {
  const { data, error, isPending } = useRoutineTrends(vesselId, workOrderId, routineId);
  // The warning speaks of "this job": only the routine's open work order is the job it means.
  const warnings = data?.next?.workOrderId === workOrderId ? data.measurements.flatMap((m) => (m.warning ? [m.warning] : [])) : [];
  return (
    <section aria-labelledby="trends-heading" className="panel p-4">
      <h2 id="trends-heading" className="text-base font-semibold">
        Measurement trends
      </h2>
      {error ? (
        <p role="alert" className="mt-2 text-alarm-700 dark:text-alarm-300">
          The trends could not be loaded: {error.message}
        </p>
      ) : isPending ? (
        <div className="mt-2 h-52 animate-pulse rounded bg-ink-100 dark:bg-ink-850" aria-busy="true" />
      ) : (
        <>
          {warnings.map((w) => (
            <p
              key={w}
              data-testid="trend-warning"
              className="mt-2 rounded-md bg-alarm-50 px-3 py-2 font-medium text-alarm-700 dark:bg-alarm-700/20 dark:text-alarm-300"
            >
              <span aria-hidden="true">▲ </span>
              {w}
            </p>
          ))}
          <p className="mt-2 max-w-prose text-sm text-ink-600 dark:text-ink-300">
            The values recorded at this routine’s approved completions (the newest 50). A straight line is only the
            present rate: a renewed part or a change in how the machinery runs breaks it, and the maker’s limits prevail.
          </p>
          <div className="mt-3 grid gap-4 lg:grid-cols-2">
            {data.measurements.map((m, i) => (
              <MeasurementFigure key={`${m.name}-${i}`} trend={m} data={data} timeZone={timeZone} />
            ))}
          </div>
        </>
      )}
    </section>
  );
}

function MeasurementFigure({ trend, data, timeZone }: { trend: MeasurementTrendView; data: RoutineTrends; timeZone: string }) {
  const decimals = valueDecimals(trend);
  return (
    <figure data-testid="trend-chart" data-measurement={trend.name} data-points={trend.points.length} data-projection={trend.projection.kind === "reaches" ? "reaches" : trend.projection.reason}>
      <h3 className="text-sm font-semibold">
        {trend.name}
        {trend.unit && <span className="font-normal text-ink-500"> ({trend.unit})</span>}
      </h3>
      {trend.points.length === 0 ? (
        <p className="py-6 text-sm text-ink-500">No value recorded yet.</p>
      ) : (
        <TrendChart
          trend={trend}
          due={data.next ? { hours: data.next.dueHours, date: data.next.dueDate } : null}
          timeZone={timeZone}
          decimals={decimals}
        />
      )}
      <figcaption className="mt-1 text-xs text-ink-500">{trend.caption}</figcaption>
      {trend.points.length > 0 && <ValuesTable trend={trend} timeZone={timeZone} decimals={decimals} />}
    </figure>
  );
}

/** The same values for a screen reader, which cannot read points and lines. */
function ValuesTable({ trend, timeZone, decimals }: { trend: MeasurementTrendView; timeZone: string; decimals: number }) {
  const value = (v: number) => `${new Intl.NumberFormat("en-GB", { minimumFractionDigits: decimals, maximumFractionDigits: decimals }).format(v)} ${trend.unit}`;
  const limits = [trend.lower !== null && `lower limit ${value(trend.lower)}`, trend.upper !== null && `upper limit ${value(trend.upper)}`].filter(Boolean);
  return (
    <table className="sr-only">
      <caption>
        {trend.name}: the recorded values{limits.length ? `, against the ${limits.join(" and the ")}` : ""}
      </caption>
      <thead>
        <tr>
          <th scope="col">Done on</th>
          <th scope="col">Counter</th>
          <th scope="col">Value</th>
        </tr>
      </thead>
      <tbody>
        {trend.points.map((p, i) => (
          <tr key={`${p.doneAt}-${i}`}>
            <th scope="row">{formatShipDate(new Date(p.doneAt), timeZone)}</th>
            <td>{p.counterHours !== null ? formatHours(p.counterHours) : "—"}</td>
            <td>{value(p.value)}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
