"use client";

// Our own SVG chart: two stacked counts and one rate on a fixed 0–100 % scale need no chart
// library (recharts weighed about 125 kB compressed on a page whose budget is 250 kB in all).
import { type RefObject, useEffect, useRef, useState } from "react";
import type { FleetBoard } from "@/server/fleet/contract";
import {
  countTop,
  daySlots,
  onTimePath,
  type Plot,
  QUARTERS,
  shareY,
  stackedAreas,
  type TrendDay,
  trendDays,
  trendTicks,
} from "./fleet-trend-scale";

// Drawn in CSS pixels at the panel's measured width, so the 11 px labels stay 11 px from a tablet
// to a wide desk; the margins hold the count labels (left), "100 %" (right) and the days (below).
const HEIGHT = 192;
const MARGIN = { left: 36, right: 44, top: 8, bottom: 22 };

const percent = (rate: number) => `${Math.round(rate * 1000) / 10} %`;

function dayWords(d: TrendDay): string {
  if (d.outOfTolerance === null) return `UTC day ${d.day}: no snapshot`;
  const rate = d.onTimeRate === null ? "no completions" : `${percent(d.onTimeRate)} on time`;
  return `UTC day ${d.day}: ${d.outOfTolerance} out of tolerance, ${d.late ?? 0} late, ${rate}`;
}

/** The fleet's overdue work per day (stacked) and its on-time rate, over the board's 90 days. */
export function FleetTrendChart({ board }: { board: FleetBoard }) {
  const days = trendDays(board.days, board.fleet);
  const known = days.filter((d) => d.outOfTolerance !== null);
  const last = known.at(-1);
  const first = known[0];
  const section = useRef<HTMLElement>(null);
  const width = usePanelWidth(section);

  return (
    <section ref={section} className="panel p-4" aria-labelledby="fleet-trend-heading">
      <h2 id="fleet-trend-heading" className="mb-1 font-semibold">
        Fleet, last {board.days.length} days
      </h2>
      {known.length === 0 || !first || !last ? (
        <p className="py-8 text-center text-ink-500">
          No daily figures yet: the worker takes them after each recompute and every night at 00:30 UTC.
        </p>
      ) : (
        <figure>
          <Legend />
          <div
            className="text-ink-500"
            data-testid="fleet-trend-chart"
            data-points={known.length}
            data-last-out-of-tolerance={last.outOfTolerance ?? ""}
            data-last-late={last.late ?? ""}
          >
            <TrendSvg days={days} width={width} label={`Fleet, last ${board.days.length} days`} />
          </div>
          <figcaption className="mt-1 text-xs text-ink-500">
            Work orders out of tolerance and late across the fleet at each day’s snapshot:{" "}
            {(first.outOfTolerance ?? 0) + (first.late ?? 0)} on {first.day},{" "}
            {(last.outOfTolerance ?? 0) + (last.late ?? 0)} on {last.day}. The dashed line is the on-time rate: of the
            fleet’s completions of the 90 days before each day and the work out of tolerance that day, the share done
            before its grace ended.
          </figcaption>
          <TrendTable days={known} />
        </figure>
      )}
    </section>
  );
}

/** The content width of the panel, followed as the window or the tablet's orientation changes. */
function usePanelWidth(ref: RefObject<HTMLElement | null>): number {
  const [width, setWidth] = useState(720);
  useEffect(() => {
    const el = ref.current;
    if (!el) return;
    const observer = new ResizeObserver(([entry]) => {
      if (entry) setWidth(Math.floor(entry.contentRect.width));
    });
    observer.observe(el);
    return () => observer.disconnect();
  }, [ref]);
  return width;
}

// The state colours of the board (fleet-table.tsx, state-badge.tsx), said in words and glyphs too.
function Legend() {
  return (
    <ul className="mb-2 flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink-600 dark:text-ink-300">
      <li className="flex items-center gap-1.5">
        <span aria-hidden="true" className="h-2.5 w-3 border border-alarm-500 bg-alarm-500/35 dark:border-alarm-300" />■
        out of tolerance
      </li>
      <li className="flex items-center gap-1.5">
        <span aria-hidden="true" className="h-2.5 w-3 border border-brass-500 bg-brass-400/35 dark:border-brass-300" />▲
        late
      </li>
      <li className="flex items-center gap-1.5">
        <span aria-hidden="true" className="w-4 border-t-2 border-dashed border-tide-500 dark:border-tide-300" />
        on time, % (right scale)
      </li>
    </ul>
  );
}

function TrendSvg({ days, width, label }: { days: TrendDay[]; width: number; label: string }) {
  const plot: Plot = {
    left: MARGIN.left,
    top: MARGIN.top,
    width: Math.max(width - MARGIN.left - MARGIN.right, 1),
    height: HEIGHT - MARGIN.top - MARGIN.bottom,
  };
  const top = countTop(days);
  const areas = stackedAreas(days, top, plot);
  const right = plot.left + plot.width;
  return (
    <svg width="100%" height={HEIGHT} viewBox={`0 0 ${width} ${HEIGHT}`} role="img" aria-label={label} fontSize={11}>
      {QUARTERS.map((q) => (
        <g key={q}>
          <line
            x1={plot.left}
            x2={right}
            y1={shareY(q, plot)}
            y2={shareY(q, plot)}
            stroke="currentColor"
            strokeOpacity={q === 0 ? 0.6 : 0.2}
            strokeDasharray={q === 0 ? undefined : "3 3"}
          />
          <text x={plot.left - 6} y={shareY(q, plot)} dy="0.35em" textAnchor="end" fill="currentColor">
            {q * top}
          </text>
          <text x={right + 6} y={shareY(q, plot)} dy="0.35em" fill="currentColor">
            {q * 100} %
          </text>
        </g>
      ))}
      {areas.outOfTolerance.map((d) => (
        <path key={d} d={d} className="fill-alarm-500/35 stroke-alarm-500 dark:stroke-alarm-300" />
      ))}
      {areas.late.map((d) => (
        <path key={d} d={d} className="fill-brass-400/35 stroke-brass-500 dark:stroke-brass-300" />
      ))}
      <path
        d={onTimePath(days, plot)}
        fill="none"
        strokeWidth={1.5}
        strokeDasharray="4 2"
        className="stroke-tide-500 dark:stroke-tide-300"
      />
      {trendTicks(days, plot).map((t) => (
        <text key={t.label} x={t.at} y={plot.top + plot.height + 16} textAnchor="middle" fill="currentColor">
          {t.label}
        </text>
      ))}
      {daySlots(days, plot).map((s) => (
        // The pointer's tooltip over the whole day, as the chart library gave before.
        <rect key={s.day.day} x={s.x} y={plot.top} width={s.width} height={plot.height} fill="transparent">
          <title>{dayWords(s.day)}</title>
        </rect>
      ))}
    </svg>
  );
}

/** The same figures for a screen reader, which cannot read areas and lines. */
function TrendTable({ days }: { days: TrendDay[] }) {
  return (
    <table className="sr-only">
      <caption>The fleet’s work orders out of tolerance and late, and its on-time rate, per UTC day</caption>
      <thead>
        <tr>
          <th scope="col">UTC day</th>
          <th scope="col">Out of tolerance</th>
          <th scope="col">Late</th>
          <th scope="col">On time</th>
        </tr>
      </thead>
      <tbody>
        {days.map((d) => (
          <tr key={d.day}>
            <th scope="row">{d.day}</th>
            <td>{d.outOfTolerance}</td>
            <td>{d.late}</td>
            <td>{d.onTimeRate === null ? "no completions" : percent(d.onTimeRate)}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
