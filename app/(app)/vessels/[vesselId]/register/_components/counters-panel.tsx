"use client";

import { ageOf } from "@/app/_components/relative-age";
import { formatHours, formatShipDate, formatShipTime } from "@/server/format/hours";
import type { RegisterCounter, RegisterView } from "@/server/register/contract";

export type CounterAction = "edit-counter" | "replace-meter" | "retire-counter";

type Props = {
  view: RegisterView;
  onAdd: () => void;
  onAction: (action: CounterAction, counter: RegisterCounter) => void;
};

export function CountersPanel({ view, onAdd, onAction }: Props) {
  const active = view.counters.filter((c) => !c.retiredAt);
  const retired = view.counters.filter((c) => c.retiredAt);
  return (
    <section className="self-start panel" aria-labelledby="counters-heading">
      <div className="flex items-center justify-between gap-2 border-b border-ink-200 px-4 py-3 dark:border-ink-800">
        <h2 id="counters-heading" className="font-semibold">
          Counters <span className="font-normal text-ink-500">({active.length})</span>
        </h2>
        {view.canEdit && (
          <button type="button" className="btn-quiet px-2 py-1" onClick={onAdd}>
            Add counter
          </button>
        )}
      </div>
      {active.length === 0 ? (
        <p className="px-4 py-3 text-ink-500">No counters yet. Add one for each hour meter on board.</p>
      ) : (
        <ul className="divide-y divide-ink-100 dark:divide-ink-850">
          {active.map((c) => (
            <CounterItem key={c.id} counter={c} view={view} onAction={onAction} />
          ))}
        </ul>
      )}
      {retired.length > 0 && (
        <details className="border-t border-ink-200 px-4 py-2 text-ink-500 dark:border-ink-800">
          <summary className="cursor-pointer">Retired counters ({retired.length})</summary>
          <ul className="mt-1 grid gap-0.5">
            {retired.map((c) => (
              <li key={c.id}>
                {c.name}, retired {formatShipDate(new Date(c.retiredAt!), view.vessel.timeZone)}
              </li>
            ))}
          </ul>
        </details>
      )}
    </section>
  );
}

function CounterItem({
  counter,
  view,
  onAction,
}: {
  counter: RegisterCounter;
  view: RegisterView;
  onAction: Props["onAction"];
}) {
  const { timeZone } = view.vessel;
  const { last } = counter;
  const action = (kind: CounterAction, label: string) => (
    <button
      type="button"
      className="text-xs font-semibold text-tide-700 underline-offset-2 hover:underline dark:text-tide-300"
      aria-label={`${label}: ${counter.name}`}
      onClick={() => onAction(kind, counter)}
    >
      {label}
    </button>
  );
  return (
    <li className="px-4 py-2">
      <div className="flex items-baseline justify-between gap-2">
        <p className="font-semibold">{counter.name}</p>
        <p className="text-xs whitespace-nowrap text-ink-500 tabular-nums dark:text-ink-400">
          {counter.plannedHoursPerDay} h/day planned
        </p>
      </div>
      <p className="text-xs text-ink-700 tabular-nums dark:text-ink-200">
        {last ? (
          <>
            <span className="font-medium">{formatHours(last.meterValue)}</span>
            {last.totalHours !== last.meterValue && ` (total ${formatHours(last.totalHours)})`} on{" "}
            {formatShipTime(new Date(last.readAt), timeZone)},{" "}
            <span className="text-ink-500 dark:text-ink-400">{ageOf(last.readAt, view.now, view.vessel.timeZone)}</span>
          </>
        ) : (
          <span className="text-ink-500">
            {counter.segment > 1 ? `No reading of meter ${counter.segment} yet` : "No reading yet"}
          </span>
        )}
      </p>
      <p className="text-xs text-ink-500 dark:text-ink-400">
        {counter.segment === 1
          ? "First meter"
          : `Meter ${counter.segment}${counter.segmentStartedAt ? `, fitted ${formatShipDate(new Date(counter.segmentStartedAt), timeZone)}` : ""}`}
        {" · "}
        {counter.usedBy.length ? (
          <>
            counter of <span className="font-mono">{counter.usedBy.map((u) => u.code).join(", ")}</span>
          </>
        ) : (
          "no component has it yet"
        )}
      </p>
      {view.canEdit && (
        <div className="mt-1 flex flex-wrap gap-x-3">
          {action("edit-counter", "Edit")}
          {action("replace-meter", "Replace meter")}
          {action("retire-counter", "Retire")}
        </div>
      )}
    </li>
  );
}
