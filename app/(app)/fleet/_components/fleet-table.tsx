import Link from "next/link";
import { StateBadge } from "@/app/_components/state-badge";
import type { BacklogState } from "@/server/backlog/contract";
import type { BoardTier, FleetBoard, FleetBoardVessel } from "@/server/fleet/contract";
import { backlogHref, OVERDUE } from "./backlog-links";
import { TrendSparkline } from "./trend-sparkline";

// What puts a vessel where it is on the board, in words (never by colour alone).
const TIER_WORDS: Record<BoardTier, string | null> = {
  0: "■ critical or class work out of tolerance",
  1: "▲ critical or class work late",
  2: "■ work out of tolerance",
  3: "▲ work late",
  4: null,
};
const TIER_ROW: Record<BoardTier, string> = {
  0: "border-l-4 border-l-alarm-500",
  1: "border-l-4 border-l-brass-500",
  2: "border-l-4 border-l-alarm-300 dark:border-l-alarm-700",
  3: "border-l-4 border-l-brass-300 dark:border-l-brass-700",
  4: "border-l-4 border-l-transparent",
};

const STATE_COLUMNS: { state: BacklogState; key: keyof FleetBoardVessel }[] = [
  { state: "out-of-tolerance", key: "outOfTolerance" },
  { state: "late", key: "late" },
  { state: "window-open", key: "windowOpen" },
  { state: "deferred", key: "deferred" },
  { state: "scheduled", key: "scheduled" },
];

const th = "px-1.5 py-1.5 font-semibold whitespace-nowrap";
const td = "px-1.5 py-1.5 text-right tabular-nums whitespace-nowrap";

export function FleetTable({ board }: { board: FleetBoard }) {
  return (
    <section className="panel" aria-labelledby="fleet-table-heading">
      <div className="flex flex-wrap items-baseline justify-between gap-2 border-b border-ink-200 px-4 py-3 dark:border-ink-800">
        <h2 id="fleet-table-heading" className="font-semibold">
          Vessels <span className="font-normal text-ink-500">{board.vessels.length}</span>
        </h2>
        <p className="text-xs text-ink-500">
          Figures are open work orders; each one opens that vessel’s Backlog filtered the same way. A vessel with no
          reading for over {board.missingReadingsHours} h is marked “stopped reporting”. On time, 90 days: the jobs done within
          their tolerance, out of those done in the last 90 days plus the work out of tolerance now — open overdue work counts
          against it until it is done.
        </p>
      </div>
      <div className="overflow-x-auto">
        <table className="w-full text-sm" data-testid="fleet-table">
          <thead className="text-xs text-ink-500 dark:text-ink-400">
            <tr className="border-b border-ink-100 dark:border-ink-850">
              <th
                scope="col"
                rowSpan={2}
                className={`${th} sticky left-0 z-10 bg-white pl-4 text-left align-bottom dark:bg-ink-900`}
              >
                Vessel
              </th>
              <th
                scope="colgroup"
                colSpan={2}
                className={`${th} bg-alarm-50/60 text-center text-ink-800 dark:bg-alarm-700/15 dark:text-ink-100`}
              >
                Critical equipment
              </th>
              <th
                scope="colgroup"
                colSpan={2}
                className={`${th} bg-alarm-50/60 text-center text-ink-800 dark:bg-alarm-700/15 dark:text-ink-100`}
              >
                Class-related
              </th>
              <th scope="colgroup" colSpan={STATE_COLUMNS.length} className={`${th} text-center`}>
                All open work, by state
              </th>
              <th scope="col" rowSpan={2} className={`${th} text-left align-bottom`}>
                Last reading
              </th>
              <th scope="col" rowSpan={2} className="px-2 py-1.5 text-right align-bottom leading-tight font-semibold">
                On time, 90 days
              </th>
              <th scope="col" rowSpan={2} className="px-2 py-1.5 text-right align-bottom leading-tight font-semibold">
                Deferrals pending
              </th>
              <th scope="col" rowSpan={2} className="px-2 py-1.5 text-right align-bottom leading-tight font-semibold">
                Defects open
              </th>
              <th scope="col" rowSpan={2} className="px-2 py-1.5 text-right align-bottom leading-tight font-semibold">
                Requisitions open
              </th>
              <th scope="col" rowSpan={2} className={`${th} text-left align-bottom`}>
                Overdue, 90 days
              </th>
            </tr>
            <tr className="border-b border-ink-200 dark:border-ink-800">
              {/* Narrower than badges, so the whole fleet fits a laptop's width: glyph and words still. */}
              {(["■ out of tolerance", "▲ late", "■ out of tolerance", "▲ late"] as const).map((words, i) => (
                <th
                  key={i}
                  scope="col"
                  className="w-16 bg-alarm-50/60 px-2 py-1.5 text-right leading-tight font-semibold text-ink-800 dark:bg-alarm-700/15 dark:text-ink-100"
                >
                  {words}
                </th>
              ))}
              {STATE_COLUMNS.map((c) => (
                <th key={c.state} scope="col" className={`${th} text-right`}>
                  <StateBadge state={c.state} />
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {board.vessels.map((v) => (
              <VesselRow key={v.id} v={v} days={board.days} now={new Date(board.generatedAt)} />
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}

function VesselRow({ v, days, now }: { v: FleetBoardVessel; days: string[]; now: Date }) {
  const tier = TIER_WORDS[v.tier];
  return (
    <tr
      data-vessel={v.code}
      data-tier={v.tier}
      className={`border-b border-ink-100 align-top last:border-0 hover:bg-ink-50 dark:border-ink-850 dark:hover:bg-ink-850 ${TIER_ROW[v.tier]}`}
    >
      <th
        scope="row"
        className="sticky left-0 z-10 min-w-40 bg-white py-1.5 pr-2 pl-3 text-left font-normal dark:bg-ink-900"
      >
        <Link href={backlogHref(v.id, { state: OVERDUE })} className="font-semibold hover:underline">
          {v.name}
        </Link>{" "}
        <span className="font-mono text-xs text-ink-500">{v.code}</span>
        {tier && <span className="block text-xs font-medium text-ink-700 dark:text-ink-200">{tier}</span>}
        {!v.day && <span className="block text-xs text-ink-500">no figures yet: the worker has not run</span>}
      </th>
      <Count
        v={v}
        n={v.criticalOutOfTolerance}
        what="critical work out of tolerance"
        strong
        filter={{ state: ["out-of-tolerance"], critical: true }}
      />
      <Count v={v} n={v.criticalLate} what="critical work late" strong filter={{ state: ["late"], critical: true }} />
      <Count
        v={v}
        n={v.classOutOfTolerance}
        what="class-related work out of tolerance"
        strong
        filter={{ state: ["out-of-tolerance"], classRelated: true }}
      />
      <Count
        v={v}
        n={v.classLate}
        what="class-related work late"
        strong
        filter={{ state: ["late"], classRelated: true }}
      />
      {STATE_COLUMNS.map((c) => (
        <Count
          key={c.state}
          v={v}
          n={v[c.key] as number}
          what={c.state.replace(/-/g, " ")}
          filter={{ state: [c.state] }}
        />
      ))}
      <td className="px-2 py-1.5 whitespace-nowrap">
        <LastReading v={v} now={now} />
      </td>
      <td className={td}>
        {v.onTimeRate === null ? (
          <span className="text-ink-500">no completions</span>
        ) : (
          <>
            <span className="font-semibold">{Math.round(v.onTimeRate * 100)} %</span>
            <span className="block text-xs text-ink-500">
              of {v.completed90} done{v.outOfTolerance ? ` + ${v.outOfTolerance} overdue` : ""}
            </span>
          </>
        )}
      </td>
      <Count
        v={v}
        n={v.pendingDeferrals}
        what="deferral requests awaiting a decision"
        filter={{ deferral: "pending" }}
      />
      <td className={td}>
        {v.openDefects === 0 ? (
          <span className="text-ink-500" aria-label="no defects open">
            0
          </span>
        ) : (
          <Link
            href={backlogHref(v.id, { defects: true })}
            aria-label={`${v.openDefects} defects open on ${v.name}${v.criticalDefects ? `, ${v.criticalDefects} on critical equipment` : ""}, the oldest ${v.oldestDefectDays} days: open its Backlog`}
            className="rounded px-1 hover:underline"
          >
            <span className={v.criticalDefects ? "font-bold text-alarm-700 dark:text-alarm-300" : "font-semibold"}>{v.openDefects}</span>
            {v.criticalDefects > 0 && <span className="block text-xs text-alarm-700 dark:text-alarm-300">{v.criticalDefects} critical</span>}
            <span className="block text-xs text-ink-500">oldest {v.oldestDefectDays} d</span>
          </Link>
        )}
      </td>
      <td className={td}>
        {v.openRequisitions === 0 ? (
          <span className="text-ink-500" aria-label="no requisitions open">
            0
          </span>
        ) : (
          <Link href={`/requisitions?vessel=${v.code}`} aria-label={`${v.openRequisitions} requisitions open for ${v.name}: open the list`} className="rounded px-1 font-semibold hover:underline">
            {v.openRequisitions}
          </Link>
        )}
      </td>
      <td className="px-2 py-1.5">
        <TrendSparkline values={v.trend} days={days} label={`${v.name}, late and out of tolerance`} />
      </td>
    </tr>
  );
}

function Count({
  v,
  n,
  what,
  filter,
  strong = false,
}: {
  v: FleetBoardVessel;
  n: number;
  what: string;
  filter: Parameters<typeof backlogHref>[1];
  strong?: boolean;
}) {
  const cell = `${td} ${strong ? "bg-alarm-50/60 dark:bg-alarm-700/15" : ""}`;
  if (n === 0) {
    return (
      <td className={`${cell} text-ink-500`}>
        <span aria-label={`no ${what}`}>0</span>
      </td>
    );
  }
  return (
    <td className={cell}>
      <Link
        href={backlogHref(v.id, filter)}
        aria-label={`${n} ${what} on ${v.name}: open its Backlog`}
        className={`rounded px-1 hover:underline ${strong ? "text-base font-bold text-alarm-700 dark:text-alarm-300" : "font-semibold"}`}
      >
        {n}
      </Link>
    </td>
  );
}

function LastReading({ v, now }: { v: FleetBoardVessel; now: Date }) {
  const hours = v.lastReadingAt ? Math.floor((now.getTime() - new Date(v.lastReadingAt).getTime()) / 3_600_000) : null;
  // Under two days the hours say more (the company's limit is in hours); then whole days.
  const age =
    hours === null || v.daysSinceReading === null
      ? "no reading yet"
      : hours < 48
        ? `${hours} h ago`
        : `${v.daysSinceReading} days ago`;
  if (!v.stoppedReporting) return <span title={v.lastReadingAt ?? undefined}>{age}</span>;
  return (
    <span
      data-testid="stopped-reporting"
      title={v.lastReadingAt ?? undefined}
      className="inline-flex items-center gap-1 rounded border border-alarm-500 bg-alarm-50 px-1.5 py-0.5 text-xs font-bold text-alarm-700 dark:bg-alarm-700/30 dark:text-alarm-100"
    >
      <span aria-hidden="true">⊘</span> stopped reporting · {age}
    </span>
  );
}
