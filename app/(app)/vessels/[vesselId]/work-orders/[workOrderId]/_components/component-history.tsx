import Link from "next/link";
import type { WorkOrderDetail } from "@/server/completions/contract";
import { formatHours, formatShipDate } from "@/server/format/hours";
import { HistoryAttachments } from "./history-attachments";

/** Done work on the same component, newest first: what was found last time it was opened. */
export function ComponentHistory({ detail }: { detail: WorkOrderDetail }) {
  const { history, component, vessel } = detail;
  return (
    <section aria-labelledby="history-heading" className="panel">
      <h2
        id="history-heading"
        className="border-b border-ink-200 px-4 py-3 text-base font-semibold dark:border-ink-800"
      >
        Earlier work on <span className="font-mono">{component.code}</span> {component.name}
      </h2>
      {history.length === 0 ? (
        <p className="px-4 py-3 text-ink-500 dark:text-ink-400">No approved work is recorded on this component yet.</p>
      ) : (
        <ol className="divide-y divide-ink-100 dark:divide-ink-800">
          {history.map((h) => (
            <li key={h.workOrderId} className="grid gap-1 px-4 py-2 sm:grid-cols-[9rem_1fr_auto]">
              <span className="tabular-nums">{formatShipDate(new Date(h.doneAt), vessel.timeZone)}</span>
              <span>
                <Link
                  href={`/vessels/${vessel.id}/work-orders/${h.workOrderId}`}
                  className="font-medium text-tide-700 underline-offset-2 hover:underline dark:text-tide-300"
                >
                  {h.title}
                </Link>
                <span className="ml-2 font-mono text-xs text-ink-500">{h.number}</span>
                {h.outOfLimits.length > 0 && (
                  <span className="ml-2 text-xs font-semibold text-alarm-700 dark:text-alarm-300">
                    ▲ out of limits: {h.outOfLimits.join(", ")}
                  </span>
                )}
                {h.remarks && <span className="block text-sm text-ink-600 dark:text-ink-300">{h.remarks}</span>}
                <HistoryAttachments vesselId={vessel.id} workOrderId={h.workOrderId} number={h.number} />
              </span>
              <span className="text-sm text-ink-500 tabular-nums dark:text-ink-400">
                {h.counterHours !== null && `${formatHours(h.counterHours)} · `}
                {h.manHours} man-h{h.doneBy ? ` · ${h.doneBy}` : ""}
              </span>
            </li>
          ))}
        </ol>
      )}
    </section>
  );
}
