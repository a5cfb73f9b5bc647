"use client";

import { useId, useState } from "react";
import { formatHours, formatShipTime } from "@/server/format/hours";
import { zoneWords } from "@/server/vessels/clock-rules";
import type { HistoryReading, ReadingCorrectionEntry, ReadingHistory } from "@/server/readings/contract";
import type { Neighbour } from "@/server/readings/rules";
import { CorrectionPanel } from "./correction-panel";

const SHOWN = 8;

type Props = {
  vesselId: string;
  history: ReadingHistory;
  timeZone: string;
  canWrite: boolean;
  onChanged: (message: string) => void;
};

/** A counter's latest readings, newest first, each with its "corrected" mark and a Correct action. */
export function RecentReadings({ vesselId, history, timeZone, canWrite, onChanged }: Props) {
  const [editing, setEditing] = useState<string | null>(null);
  const readings = history.readings;
  const recent = [...readings].reverse().slice(0, SHOWN);
  const removals = history.removals.slice(0, 3);
  const target = readings.find((r) => r.id === editing);

  return (
    <div>
      <h3 className="label">Latest readings</h3>
      <ol className="grid gap-1 tabular-nums" aria-label={`Latest readings of ${history.counter.name}`}>
        {recent.map((r) => {
          // Only the meter fitted now can change: an older meter's readings fixed its offset.
          const correctable = canWrite && r.segment === history.counter.segment;
          return (
            <li key={r.id} className="flex items-center justify-between gap-2">
              <span className="whitespace-nowrap text-ink-500 dark:text-ink-400">
                {formatShipTime(new Date(r.readAt), r.zone)}
                {r.zone !== timeZone && <span className="text-xs text-ink-500"> ({zoneWords(r.zone)})</span>}
              </span>
              <span className="ml-auto flex items-center gap-1.5 whitespace-nowrap">
                {r.corrections.length > 0 && <CorrectedMark reading={r} timeZone={timeZone} />}
                <span className="font-medium">{formatHours(r.meterValue)}</span>
              </span>
              {canWrite && !correctable && (
                <span className="w-14 text-right text-xs text-ink-500 dark:text-ink-400">old meter</span>
              )}
              {correctable && (
                <button
                  type="button"
                  className="-my-0.5 w-14 rounded px-1.5 py-1 text-right text-xs text-tide-700 underline-offset-2 hover:underline dark:text-tide-300"
                  aria-label={`Correct the reading of ${formatShipTime(new Date(r.readAt), r.zone)}, ${formatHours(r.meterValue)}`}
                  onClick={() => setEditing(r.id)}
                >
                  Correct
                </button>
              )}
            </li>
          );
        })}
      </ol>
      {removals.length > 0 && (
        <div className="mt-3 border-t border-ink-200 pt-2 text-xs text-ink-500 dark:border-ink-800 dark:text-ink-400">
          <h4 className="font-semibold">Removed readings</h4>
          <ul className="grid gap-0.5">
            {removals.map((r) => (
              <li key={r.id}>
                <span className="tabular-nums">
                  {formatShipTime(new Date(r.readAt), timeZone)} · {formatHours(r.oldMeterValue)}
                </span>{" "}
                — “{r.reason}”{r.by ? `, ${r.by}` : ""}
              </li>
            ))}
          </ul>
        </div>
      )}
      {target && (
        <CorrectionPanel
          vesselId={vesselId}
          counterName={history.counter.name}
          reading={target}
          neighbours={neighboursOf(readings, target)}
          timeZone={timeZone}
          onClose={() => setEditing(null)}
          onDone={(message) => {
            setEditing(null);
            onChanged(message);
          }}
        />
      )}
    </div>
  );
}

function neighboursOf(
  readings: HistoryReading[],
  target: HistoryReading,
): { previous: Neighbour | null; next: Neighbour | null } {
  const same = readings.filter((r) => r.segment === target.segment && r.id !== target.id);
  const at = (r: HistoryReading | undefined): Neighbour | null =>
    r ? { readAt: new Date(r.readAt), meterValue: r.meterValue } : null;
  return {
    previous: at(same.filter((r) => r.readAt < target.readAt).at(-1)),
    next: at(same.find((r) => r.readAt > target.readAt)),
  };
}

/** "corrected", with the last correction's old value, reason and author on hover, focus or tap. */
function CorrectedMark({ reading, timeZone }: { reading: HistoryReading; timeZone: string }) {
  const [open, setOpen] = useState(false);
  const tipId = useId();
  const latest = reading.corrections[0] as ReadingCorrectionEntry;
  const more = reading.corrections.length - 1;
  return (
    <span className="group relative inline-flex">
      <button
        type="button"
        aria-describedby={tipId}
        aria-expanded={open}
        onClick={() => setOpen((o) => !o)}
        onBlur={() => setOpen(false)}
        onKeyDown={(e) => e.key === "Escape" && setOpen(false)}
        // The mark stays small; the button around it is 24 px tall (WCAG 2.2 SC 2.5.8), the row unmoved.
        className="-my-1 inline-flex py-1"
      >
        <span className="rounded border border-brass-400 bg-brass-100 px-1 text-[11px] leading-4 font-semibold text-brass-700 dark:border-brass-600 dark:bg-brass-700/20 dark:text-brass-300">
          corrected
        </span>
      </button>
      <span
        id={tipId}
        role="tooltip"
        className={`${open ? "visible opacity-100" : "invisible opacity-0"} absolute right-0 bottom-full z-10 mb-1 w-64 rounded-md bg-ink-900 px-2 py-1.5 text-left text-xs font-normal whitespace-normal text-white shadow-lg group-focus-within:visible group-focus-within:opacity-100 group-hover:visible group-hover:opacity-100 dark:bg-ink-100 dark:text-ink-900`}
      >
        Was {formatHours(latest.oldMeterValue)}: “{latest.reason}”{" — corrected"}
        {latest.by ? ` by ${latest.by}` : ""} on {formatShipTime(new Date(latest.at), timeZone)}
        {more > 0 ? ` (corrected ${more + 1} times)` : ""}
      </span>
    </span>
  );
}
