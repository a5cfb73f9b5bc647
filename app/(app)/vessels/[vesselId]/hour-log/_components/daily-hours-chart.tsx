// Our own SVG bar chart: a fixed 0–24 h scale and one bar per ship's day need no chart library
// (recharts weighed 117 kB compressed on a page whose budget is 150 kB in all).
import { formatHours } from "@/server/format/hours";
import { dailyBars, type DailyHours, dayTicks, HOUR_TICKS, hourY } from "./daily-hours-scale";
import { formatDayKey } from "@/server/format/dates";

// Drawn in these units and scaled to the panel's width; text stays legible from a phone to a desk.
// The right margin holds half of the last day's label, which is centred on its bar.
const WIDTH = 640;
const HEIGHT = 224;
const plot = { left: 28, top: 6, width: WIDTH - 28 - 18, height: HEIGHT - 30 };

export function DailyHoursChart({ daily, label }: { daily: DailyHours[]; label: string }) {
  const bars = dailyBars(daily, plot);
  const baseline = hourY(0, plot);
  return (
    <>
      <svg viewBox={`0 0 ${WIDTH} ${HEIGHT}`} className="h-auto w-full" role="img" aria-label={label} fontSize={11}>
        {HOUR_TICKS.map((h) => (
          <g key={h}>
            <line
              x1={plot.left}
              x2={plot.left + plot.width}
              y1={hourY(h, plot)}
              y2={hourY(h, plot)}
              stroke="currentColor"
              strokeOpacity={h === 0 ? 0.6 : 0.2}
              strokeDasharray={h === 0 ? undefined : "3 3"}
            />
            <text x={plot.left - 6} y={hourY(h, plot)} dy="0.35em" textAnchor="end" fill="currentColor">
              {h}
            </text>
          </g>
        ))}
        {bars.map((b) => (
          <rect key={b.day} x={b.x} y={b.y} width={b.width} height={b.height} fill="#23879a">
            {/* The pointer's tooltip, as the chart library gave before. */}
            <title>{`Ship's day ${formatDayKey(b.day)}: ran ${formatHours(b.hours)}`}</title>
          </rect>
        ))}
        {dayTicks(daily, plot).map((t) => (
          <text key={t.label} x={t.at} y={baseline + 16} textAnchor="middle" fill="currentColor">
            {t.label}
          </text>
        ))}
      </svg>
      {/* The same figures for a screen reader, which cannot read bars. */}
      <table className="sr-only">
        <caption>{label}</caption>
        <thead>
          <tr>
            <th scope="col">Ship&apos;s day</th>
            <th scope="col">Hours run</th>
          </tr>
        </thead>
        <tbody>
          {daily.map((d) => (
            <tr key={d.day}>
              <th scope="row">{formatDayKey(d.day)}</th>
              <td>{formatHours(d.hours)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </>
  );
}
