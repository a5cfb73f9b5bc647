"use client";

import { Area, CartesianGrid, ComposedChart, Legend, Line, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import type { FleetBoard } from "@/server/fleet/contract";

/** The fleet's overdue work per day (stacked) and its on-time rate, over the board's 90 days. */
export function FleetTrendChart({ board }: { board: FleetBoard }) {
  const data = board.days.map((day, i) => ({
    day,
    outOfTolerance: board.fleet.outOfTolerance[i],
    late: board.fleet.late[i],
    onTime: board.fleet.onTimeRate[i] === null ? null : Math.round(board.fleet.onTimeRate[i]! * 1000) / 10,
  }));
  const known = data.filter((d) => d.outOfTolerance !== null);
  const last = known.at(-1);
  const first = known[0];

  return (
    <section className="panel p-4" aria-labelledby="fleet-trend-heading">
      <h2 id="fleet-trend-heading" className="mb-1 font-semibold">
        Fleet, last {board.days.length} days
      </h2>
      {known.length === 0 ? (
        <p className="py-8 text-center text-ink-500">
          No daily figures yet: the worker takes them after each recompute and every night at 00:30 UTC.
        </p>
      ) : (
        <figure>
          <div
            className="h-48 text-ink-500"
            data-testid="fleet-trend-chart"
            data-points={known.length}
            data-last-out-of-tolerance={last?.outOfTolerance ?? ""}
            data-last-late={last?.late ?? ""}
          >
            <ResponsiveContainer width="100%" height="100%">
              <ComposedChart data={data} margin={{ top: 4, right: 4, bottom: 0, left: -16 }}>
                <CartesianGrid strokeDasharray="3 3" vertical={false} stroke="currentColor" strokeOpacity={0.2} />
                <XAxis
                  dataKey="day"
                  tickFormatter={(d: string) => d.slice(5)}
                  minTickGap={32}
                  stroke="currentColor"
                  fontSize={11}
                />
                <YAxis yAxisId="count" allowDecimals={false} stroke="currentColor" fontSize={11} />
                <YAxis
                  yAxisId="rate"
                  orientation="right"
                  domain={[0, 100]}
                  unit="%"
                  stroke="currentColor"
                  fontSize={11}
                  width={44}
                />
                <Tooltip
                  labelFormatter={(d) => `UTC day ${String(d)}`}
                  contentStyle={{ fontSize: 12, color: "#1b2430" }}
                />
                <Legend wrapperStyle={{ fontSize: 12 }} />
                <Area
                  yAxisId="count"
                  type="stepAfter"
                  dataKey="outOfTolerance"
                  name="■ out of tolerance"
                  stackId="overdue"
                  stroke="#c8412f"
                  fill="#c8412f"
                  fillOpacity={0.35}
                  isAnimationActive={false}
                />
                <Area
                  yAxisId="count"
                  type="stepAfter"
                  dataKey="late"
                  name="▲ late"
                  stackId="overdue"
                  stroke="#c48d2e"
                  fill="#dcaa4a"
                  fillOpacity={0.35}
                  isAnimationActive={false}
                />
                <Line
                  yAxisId="rate"
                  type="monotone"
                  dataKey="onTime"
                  name="on time, % (right scale)"
                  stroke="#23879a"
                  strokeDasharray="4 2"
                  dot={false}
                  connectNulls
                  isAnimationActive={false}
                />
              </ComposedChart>
            </ResponsiveContainer>
          </div>
          <figcaption className="mt-1 text-xs text-ink-500">
            Work orders out of tolerance and late across the fleet at each day’s snapshot
            {first && last
              ? `: ${(first.outOfTolerance ?? 0) + (first.late ?? 0)} on ${first.day}, ${(last.outOfTolerance ?? 0) + (last.late ?? 0)} on ${last.day}`
              : ""}
            . The dashed line is the share of the fleet’s completions of the 90 days before each day done before their
            grace ended.
          </figcaption>
        </figure>
      )}
    </section>
  );
}
