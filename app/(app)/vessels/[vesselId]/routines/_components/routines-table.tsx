"use client";

import type { RoutineList } from "@/server/routines/contract";
import { TeamName } from "@/app/_components/rank-words-provider";
import type { Sheet } from "./routines-view";

type Props = { list: RoutineList; onAction: (sheet: Sheet) => void };

export function RoutinesTable({ list, onAction }: Props) {
  if (list.routines.length === 0) {
    return (
      <p className="panel p-6 text-ink-600 dark:text-ink-300">
        No routines match.{" "}
        {list.canEdit
          ? "Add a routine for a component of the register, or change the filter."
          : "A chief engineer or the company administrator keeps the maintenance plan."}
      </p>
    );
  }
  return (
    <div className="overflow-x-auto panel">
      <table className="w-full text-sm">
        <thead className="border-b border-ink-200 text-left text-xs text-ink-600 uppercase dark:border-ink-800 dark:text-ink-300">
          <tr>
            <th scope="col" className="px-3 py-2">
              Component
            </th>
            <th scope="col" className="px-3 py-2">
              Routine
            </th>
            <th scope="col" className="px-3 py-2">
              Interval
            </th>
            <th scope="col" className="px-3 py-2">
              Team
            </th>
            <th scope="col" className="px-3 py-2 text-right">
              Man-hours
            </th>
            <th scope="col" className="px-3 py-2">
              Marks
            </th>
            {list.canEdit && (
              <th scope="col" className="px-3 py-2">
                <span className="sr-only">Actions</span>
              </th>
            )}
          </tr>
        </thead>
        <tbody className="divide-y divide-ink-100 dark:divide-ink-800">
          {list.routines.map((r) => (
            <tr key={r.id} className="align-top hover:bg-ink-50 dark:hover:bg-ink-850">
              <td className="px-3 py-1.5">
                <span className="block font-mono text-xs font-semibold whitespace-nowrap">{r.component.code}</span>
                <span className="block text-xs text-ink-500 dark:text-ink-400">{r.component.name}</span>
              </td>
              <td className="px-3 py-1.5 font-medium text-ink-900 dark:text-ink-50">{r.title}</td>
              <td className="px-3 py-1.5">
                {r.intervalWords}
                {r.anchoredOn && (
                  <span className="block text-xs whitespace-nowrap text-ink-500 dark:text-ink-400">
                    anchored on {r.anchoredOn}
                  </span>
                )}
              </td>
              <td className="px-3 py-1.5"><TeamName team={r.team} /></td>
              <td className="px-3 py-1.5 text-right tabular-nums">{r.estimatedManHours}</td>
              <td className="px-3 py-1.5">
                <span className="flex flex-wrap gap-1 text-xs">
                  {r.critical && <Mark>critical</Mark>}
                  {r.classRelated && <Mark>class{r.classItemRef ? ` ${r.classItemRef}` : ""}</Mark>}
                  {r.needsEngineStop && <Mark>engine stop</Mark>}
                  {r.planProblem && <Mark tone="alarm">cannot be planned: {r.planProblem}</Mark>}
                </span>
              </td>
              {list.canEdit && (
                <td className="px-3 py-1.5">
                  <span className="flex gap-1">
                    <RowButton label={`Edit ${r.title}`} onClick={() => onAction({ kind: "edit", routine: r })}>
                      Edit
                    </RowButton>
                    <RowButton label={`Copy ${r.title}`} onClick={() => onAction({ kind: "copy", routine: r })}>
                      Copy
                    </RowButton>
                    <RowButton label={`Parts for ${r.title}`} onClick={() => onAction({ kind: "parts", routine: r })}>
                      Parts
                    </RowButton>
                    <RowButton label={`Retire ${r.title}`} onClick={() => onAction({ kind: "retire", routine: r })}>
                      Retire
                    </RowButton>
                  </span>
                </td>
              )}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

const MARK_TONE = {
  plain: "whitespace-nowrap bg-ink-100 text-ink-700 dark:bg-ink-800 dark:text-ink-200",
  alarm: "bg-alarm-50 font-medium text-alarm-700 dark:bg-alarm-700/20 dark:text-alarm-300",
} as const;

function Mark({ tone = "plain", children }: { tone?: keyof typeof MARK_TONE; children: React.ReactNode }) {
  return <span className={`rounded px-1 ${MARK_TONE[tone]}`}>{children}</span>;
}

function RowButton({ label, onClick, children }: { label: string; onClick: () => void; children: React.ReactNode }) {
  return (
    <button type="button" aria-label={label} className="btn-quiet px-2 py-0.5 text-xs" onClick={onClick}>
      {children}
    </button>
  );
}
