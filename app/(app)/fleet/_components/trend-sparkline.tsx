// A vessel's 90 days of overdue work (late + out of tolerance) as a small line: plain SVG, since
// fifty chart components would weigh on a tablet. Its figures are also said in words for screen
// readers and in the tooltip.

const WIDTH = 96;
const HEIGHT = 28;

export function TrendSparkline({ values, days, label }: { values: (number | null)[]; days: string[]; label: string }) {
  const known = values.flatMap((v, i) => (v === null ? [] : [{ i, v }]));
  if (known.length === 0) return <span className="text-xs text-ink-500">no history yet</span>;
  const max = Math.max(1, ...known.map((p) => p.v));
  const x = (i: number) => (values.length <= 1 ? WIDTH : (i / (values.length - 1)) * WIDTH);
  const y = (v: number) => HEIGHT - 2 - (v / max) * (HEIGHT - 4);
  const points = known.map((p) => `${x(p.i).toFixed(1)},${y(p.v).toFixed(1)}`).join(" ");
  const first = known[0]!;
  const last = known.at(-1)!;
  const words = `${label}: ${first.v} overdue on ${days[first.i]}, ${last.v} on ${days[last.i]}, at most ${max}`;
  return (
    <svg
      width={WIDTH}
      height={HEIGHT}
      viewBox={`0 0 ${WIDTH} ${HEIGHT}`}
      role="img"
      aria-label={words}
      className="overflow-visible text-brass-600 dark:text-brass-300"
      data-testid="trend-sparkline"
    >
      <title>{words}</title>
      <line x1={0} x2={WIDTH} y1={HEIGHT - 2} y2={HEIGHT - 2} stroke="currentColor" strokeOpacity={0.25} />
      <polyline points={points} fill="none" stroke="currentColor" strokeWidth={1.5} strokeLinejoin="round" />
      <circle cx={x(last.i)} cy={y(last.v)} r={2.5} fill="currentColor" />
    </svg>
  );
}
