"use client";

// Our own SVG, as the Fleet board's chart: points, two limits and a straight line need no chart library.
import { type RefObject, useEffect, useRef, useState } from "react";
import type { MeasurementTrendView } from "@/server/measurements/contract";
import { formatHours, formatShipDate } from "@/server/format/hours";
import { chartDomain, dueX, lineSegments, niceTicks, type Plot, scaleX, scaleY } from "./trend-chart-scale";

const HEIGHT = 200;
const MARGIN = { left: 48, right: 16, top: 12, bottom: 24 };
const DAY_MS = 86_400_000;

type Props = {
  trend: MeasurementTrendView;
  due: { hours: number | null; date: string | null } | null;
  timeZone: string;
  decimals: number;
};

const number = (value: number, decimals: number) =>
  new Intl.NumberFormat("en-GB", { minimumFractionDigits: decimals, maximumFractionDigits: decimals }).format(value);

/** One measurement: its recorded values against its limits, with the fitted straight line. */
export function TrendChart({ trend, due, timeZone, decimals }: Props) {
  const box = useRef<HTMLDivElement>(null);
  const width = useBoxWidth(box);
  const plot: Plot = {
    left: MARGIN.left,
    top: MARGIN.top,
    width: Math.max(width - MARGIN.left - MARGIN.right, 1),
    height: HEIGHT - MARGIN.top - MARGIN.bottom,
  };
  const dueAt = dueX(trend, due);
  const d = chartDomain(trend, dueAt);
  const x = (v: number) => scaleX(v, d, plot);
  const y = (v: number) => scaleY(v, d, plot);
  const xLabel = (v: number) =>
    trend.basis === "hours" ? formatHours(v) : formatShipDate(new Date(v * DAY_MS), timeZone).replace(/^\d+ /, "");
  const segments = lineSegments(trend, d, plot);
  const meets = trend.projection.kind === "reaches" && trend.projection.x <= d.x1 ? trend.projection : null;
  const limits = [
    { name: "upper", value: trend.upper },
    { name: "lower", value: trend.lower },
  ].filter((l): l is { name: string; value: number } => l.value !== null);
  const right = plot.left + plot.width;

  return (
    <div ref={box} className="text-ink-500">
      <svg
        width="100%"
        height={HEIGHT}
        viewBox={`0 0 ${width} ${HEIGHT}`}
        role="img"
        aria-label={`${trend.name}: recorded values against the limits, with a fitted straight line`}
        fontSize={11}
      >
        {niceTicks(d.y0, d.y1).map((t) => (
          <g key={`y${t}`}>
            <line x1={plot.left} x2={right} y1={y(t)} y2={y(t)} stroke="currentColor" strokeOpacity={0.15} />
            <text x={plot.left - 6} y={y(t)} dy="0.35em" textAnchor="end" fill="currentColor">
              {number(t, decimals)}
            </text>
          </g>
        ))}
        {niceTicks(d.x0, d.x1, trend.basis === "hours" ? 3 : 4).map((t) => (
          <text key={`x${t}`} x={x(t)} y={plot.top + plot.height + 16} textAnchor="middle" fill="currentColor">
            {xLabel(t)}
          </text>
        ))}
        {limits.map((l) => (
          <g key={l.name}>
            <line
              x1={plot.left}
              x2={right}
              y1={y(l.value)}
              y2={y(l.value)}
              strokeWidth={1.5}
              strokeDasharray="6 3"
              className="stroke-alarm-500 dark:stroke-alarm-300"
            />
            <text
              x={plot.left + 4}
              y={y(l.value)}
              dy={l.name === "upper" ? "-0.45em" : "1.1em"}
              className="fill-alarm-700 dark:fill-alarm-300"
            >
              {l.name} limit {number(l.value, decimals)} {trend.unit}
            </text>
          </g>
        ))}
        {dueAt !== null && dueAt >= d.x0 && dueAt <= d.x1 && (
          <g>
            <line x1={x(dueAt)} x2={x(dueAt)} y1={plot.top} y2={plot.top + plot.height} stroke="currentColor" strokeDasharray="2 3" />
            <text x={x(dueAt) - 4} y={plot.top + 10} textAnchor="end" fill="currentColor">
              falls due
            </text>
          </g>
        )}
        {segments && (
          <>
            <line
              x1={segments.fitted[0].x}
              y1={segments.fitted[0].y}
              x2={segments.fitted[1].x}
              y2={segments.fitted[1].y}
              strokeWidth={2}
              className="stroke-tide-600 dark:stroke-tide-300"
            />
            {segments.projected && (
              <line
                x1={segments.projected[0].x}
                y1={segments.projected[0].y}
                x2={segments.projected[1].x}
                y2={segments.projected[1].y}
                strokeWidth={2}
                strokeDasharray="5 4"
                className="stroke-tide-600 dark:stroke-tide-300"
              />
            )}
          </>
        )}
        {meets && (
          <path
            d={`M ${x(meets.x) - 5} ${y(meets.limitValue) - 5} l 10 10 m 0 -10 l -10 10`}
            strokeWidth={2}
            className="stroke-alarm-600 dark:stroke-alarm-300"
          >
            <title>{`The line meets the ${meets.limit} limit ${meets.atHours !== null ? `at about ${formatHours(Math.round(meets.atHours))}` : ""}${meets.atDate ? ` (about ${formatShipDate(new Date(meets.atDate), timeZone)})` : ""}`}</title>
          </path>
        )}
        {trend.points.map((p, i) => (
          <circle
            key={`${p.doneAt}-${i}`}
            cx={x(p.x)}
            cy={y(p.value)}
            r={4}
            className="fill-ink-50 stroke-ink-800 dark:fill-ink-900 dark:stroke-ink-100"
            strokeWidth={1.5}
          >
            <title>
              {`${formatShipDate(new Date(p.doneAt), timeZone)}${p.counterHours !== null ? `, ${formatHours(p.counterHours)}` : ""}: ${number(p.value, decimals)} ${trend.unit}`}
            </title>
          </circle>
        ))}
      </svg>
    </div>
  );
}

/** The content width of the chart's box, followed as the window or the tablet's orientation changes. */
function useBoxWidth(ref: RefObject<HTMLElement | null>): number {
  const [width, setWidth] = useState(420);
  useEffect(() => {
    const el = ref.current;
    if (!el) return;
    const observer = new ResizeObserver(([entry]) => {
      if (entry) setWidth(Math.max(200, Math.floor(entry.contentRect.width)));
    });
    observer.observe(el);
    return () => observer.disconnect();
  }, [ref]);
  return width;
}
