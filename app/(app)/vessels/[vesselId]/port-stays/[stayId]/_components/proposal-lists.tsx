"use client";
// What the timeline stands on, in words: the jobs in order with the proposal's reasons, what was
// left out and why, what waits for the voyage, each person's hours, and how much of the work fits.
import { useRankWords } from "@/app/_components/rank-words-provider";
import { useState } from "react";
import { formatHours } from "@/server/format/hours";
import type { PackageJob, PortStayView, ProposalView } from "@/server/port-stays/contract";
import { personLabel, shipClockLabel } from "../../_components/stay-words";
import type { DraftEntry, Outside } from "./use-package-draft";
import { shiftLocal } from "./timeline-geometry";

export function PlacedList({ entries, problems, onRemove }: { entries: DraftEntry[]; problems: Map<number, string>; onRemove?: (id: string) => void }) {
  const ranks = useRankWords();
  const sorted = entries.map((e, i) => ({ e, i })).sort((a, b) => (a.e.placed?.start ?? "").localeCompare(b.e.placed?.start ?? ""));
  return (
    <section aria-labelledby="placed-jobs" className="grid gap-2">
      <h2 id="placed-jobs" className="text-base font-semibold">
        Jobs in the package ({entries.length})
      </h2>
      <ol className="grid gap-2">
        {sorted.map(({ e, i }) => (
          <li key={e.input.workOrderId} className="panel flex flex-wrap items-start justify-between gap-2 p-3 text-sm" data-placed={e.job.number}>
            <div className="min-w-0 flex-1">
              <p className="font-semibold">
                <span className="font-mono">{e.job.number}</span> {e.job.title}
                {e.job.needsEngineStop && <span className="ml-2 text-brass-800 dark:text-brass-300">engine stopped</span>}
              </p>
              <p className="tabular-nums text-ink-600 dark:text-ink-300">
                {e.placed ? `${shipClockLabel(e.placed.startLocal)}, ${formatHours(e.job.elapsedHours)} · ${e.placed.people.map((p) => personLabel(p, ranks)).join(", ")}` : `wanted from ${shipClockLabel(e.input.start)}`}
              </p>
              {e.placed?.reason && <p>{e.placed.reason}</p>}
              {problems.get(i) && <p className="field-error">⚠ {problems.get(i)}</p>}
            </div>
            {onRemove && (
              <button type="button" className="btn-quiet min-h-6 px-2" onClick={() => onRemove(e.input.workOrderId)}>
                Take out<span className="sr-only"> {e.job.number}</span>
              </button>
            )}
          </li>
        ))}
      </ol>
    </section>
  );
}

/** The working slots of the stay, for putting a job back at a start of the chief's choosing. */
function workingStarts(stay: PortStayView, slotMinutes: number): string[] {
  const out: string[] = [];
  for (const day of stay.days) {
    for (let t = `${day}T${stay.workdayFrom}`; t.slice(11) < stay.workdayTo && t.startsWith(day); t = shiftLocal(t, slotMinutes)) {
      if (t >= stay.arrivesLocal && t < stay.departsLocal) out.push(t);
    }
  }
  return out;
}

export function LeftOutList({ stay, outside, slotMinutes, onAdd }: { stay: PortStayView; outside: Outside[]; slotMinutes: number; onAdd?: (job: PackageJob, start: string) => void }) {
  const starts = workingStarts(stay, slotMinutes);
  return (
    <section aria-labelledby="left-out" className="grid gap-2">
      <h2 id="left-out" className="text-base font-semibold">
        Left out ({outside.length})
      </h2>
      {outside.length === 0 ? (
        <p className="text-sm text-ink-600 dark:text-ink-300">Nothing considered was left out.</p>
      ) : (
        <ul className="grid gap-2">
          {outside.map((o) => (
            <LeftOutRow key={o.job.workOrderId} item={o} starts={starts} onAdd={onAdd} />
          ))}
        </ul>
      )}
    </section>
  );
}

function LeftOutRow({ item, starts, onAdd }: { item: Outside; starts: string[]; onAdd?: (job: PackageJob, start: string) => void }) {
  const [start, setStart] = useState(starts[0] ?? "");
  const id = `add-${item.job.workOrderId}`;
  return (
    <li className="panel flex flex-wrap items-end justify-between gap-2 p-3 text-sm">
      <div className="min-w-0 flex-1">
        <p className="font-semibold">
          <span className="font-mono">{item.job.number}</span> {item.job.title}
        </p>
        <p className="text-ink-600 dark:text-ink-300">{item.message}</p>
      </div>
      {onAdd && starts.length > 0 && (
        <div className="flex items-end gap-2">
          <div>
            <label htmlFor={id} className="text-xs text-ink-600 dark:text-ink-300">
              Start {item.job.number} at
            </label>
            <select id={id} className="field" value={start} onChange={(e) => setStart(e.target.value)}>
              {starts.map((s) => (
                <option key={s} value={s}>
                  {shipClockLabel(s)}
                </option>
              ))}
            </select>
          </div>
          <button type="button" className="btn-quiet" onClick={() => onAdd(item.job, start)}>
            Add<span className="sr-only"> {item.job.number}</span>
          </button>
        </div>
      )}
    </li>
  );
}

export function ProposalFacts({ proposal, crew }: { proposal: ProposalView; crew: PortStayView["crew"] }) {
  const ranks = useRankWords();
  const share = proposal.possible > 0 ? Math.round((proposal.value / proposal.possible) * 100) : 100;
  return (
    <div className="grid gap-4 md:grid-cols-2">
      <section aria-labelledby="people-hours">
        <h2 id="people-hours" className="text-base font-semibold">
          People’s hours
        </h2>
        <p className="text-sm">Priority-weighted work placed: {share} %</p>
        <table className="mt-2 text-sm">
          <thead>
            <tr className="text-left text-ink-600 dark:text-ink-300">
              <th className="pr-4 font-semibold">Person</th>
              <th className="pr-4 font-semibold">Jobs</th>
              <th className="font-semibold">Watches</th>
            </tr>
          </thead>
          <tbody className="tabular-nums">
            {proposal.people.map((p) => (
              <tr key={p.key}>
                <td className="pr-4">{personLabel(p.key, ranks, crew)}</td>
                <td className="pr-4">{formatHours(p.jobHours)}</td>
                <td>{formatHours(p.watchHours)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </section>
      <details className="panel self-start p-3 text-sm">
        <summary className="min-h-6 cursor-pointer font-semibold">Left for the voyage ({proposal.atSea.length})</summary>
        {proposal.atSea.length === 0 ? (
          <p className="mt-2">No sea work falls due before the next stay.</p>
        ) : (
          <ul className="mt-2 grid gap-1">
            {proposal.atSea.map((a) => (
              <li key={a.workOrderId}>
                <span className="font-mono">{a.number}</span> {a.title}: {a.message}
              </li>
            ))}
          </ul>
        )}
      </details>
    </div>
  );
}
