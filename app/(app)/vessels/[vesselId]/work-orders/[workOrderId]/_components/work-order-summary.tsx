import { StateBadge } from "@/app/_components/state-badge";
import { TeamName } from "@/app/_components/rank-words-provider";
import type { WorkOrderDetail } from "@/server/completions/contract";
import { formatHours, formatShipDate } from "@/server/format/hours";

type Props = { detail: WorkOrderDetail };

/** The job card's head: what, on which machinery, when it falls due and how much room is left. */
export function WorkOrderSummary({ detail }: Props) {
  const { workOrder: w, component, vessel, routine } = detail;
  const tz = vessel.timeZone;
  const day = (iso: string | null) => (iso ? formatShipDate(new Date(iso), tz) : "—");
  const remaining = [
    w.remainingDays !== null && (w.remainingDays < 0 ? `${-w.remainingDays} d over` : `${w.remainingDays} d`),
    w.remainingHours !== null &&
      (w.remainingHours < 0 ? `${formatHours(-w.remainingHours)} over` : `${formatHours(w.remainingHours)} left`),
  ].filter(Boolean);
  return (
    <header className="panel p-4">
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <p className="font-mono text-sm text-ink-500 dark:text-ink-400">
            {w.number}
            {w.kind === "corrective" ? " · corrective" : ` · occurrence ${w.occurrence}`}
          </p>
          <h1 className="text-xl font-bold text-ink-900 dark:text-ink-50">{w.title}</h1>
          <p className="text-ink-600 dark:text-ink-300">
            <span className="font-mono">{component.code}</span> {component.name} · {vessel.name}
          </p>
        </div>
        <div className="flex items-center gap-2">
          <StateBadge state={w.state} />
          <a className="no-print btn-quiet" href={`/api/vessels/${vessel.id}/work-orders/${w.id}/card`} download>
            Job card (PDF)
          </a>
        </div>
      </div>
      <dl className="mt-4 grid grid-cols-2 gap-x-6 gap-y-2 text-sm sm:grid-cols-4">
        <Fact label="Due">
          {day(w.dueDate)}
          {w.dueHours !== null && <span className="block text-ink-500">at {formatHours(w.dueHours)}</span>}
        </Fact>
        <Fact label="Window">
          {w.windowOpensAt || w.graceEndsAt ? `${day(w.windowOpensAt)} – ${day(w.graceEndsAt)}` : "—"}
          {w.windowOpensHours !== null && w.graceEndsHours !== null && (
            <span className="block text-ink-500">
              {formatHours(w.windowOpensHours)} – {formatHours(w.graceEndsHours)}
            </span>
          )}
        </Fact>
        <Fact label="Remaining">{w.state === "done" ? "done" : remaining.length ? remaining.join(" · ") : "—"}</Fact>
        <Fact label="Planned effort">
          {w.team.length ? (
            <>
              <TeamName team={w.team} /> · {formatHours(w.elapsedHours)} ·{" "}
            </>
          ) : null}
          {w.estimatedManHours} man-hours{w.needsEngineStop ? " · engine stopped" : ""}
          {w.needsPort ? " · in port" : ""}
        </Fact>
      </dl>
      {(w.critical || w.classRelated) && (
        <p className="mt-3 flex gap-2 text-xs">
          {w.critical && <Tag>⚠ critical equipment</Tag>}
          {w.classRelated && <Tag>◆ class-related</Tag>}
        </p>
      )}
      {routine?.description && <p className="mt-3 max-w-prose whitespace-pre-line">{routine.description}</p>}
    </header>
  );
}

function Fact({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div>
      <dt className="text-xs font-semibold tracking-wide text-ink-500 uppercase dark:text-ink-400">{label}</dt>
      <dd className="tabular-nums">{children}</dd>
    </div>
  );
}

function Tag({ children }: { children: React.ReactNode }) {
  return (
    <span className="rounded bg-ink-100 px-1.5 py-0.5 text-ink-700 dark:bg-ink-800 dark:text-ink-200">{children}</span>
  );
}
