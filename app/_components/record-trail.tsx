"use client";

import { useQuery } from "@tanstack/react-query";
import { useState } from "react";
import type { AuditItem } from "@/server/audit/contract";
import { lineValueWords, type TrailRecordTable } from "@/server/audit/kinds";
import { formatUtcTime } from "@/server/format/dates";
import { fetchJson } from "./fetch-json";
import { LoadProblem } from "./notice";
import { queryKeys } from "./query-keys";

type Trail = { items: AuditItem[]; more: boolean };

/**
 * A record's audit trail at the foot of its page: closed at first, loaded when opened (nothing is
 * fetched for the many visits that never look), newest first.
 */
export function RecordTrail({
  vesselId,
  table,
  record,
}: {
  /** The vessel whose record it is; null for a company-wide one (a part, a tolerance rule). */
  vesselId: string | null;
  table: TrailRecordTable;
  record: string;
}) {
  const [open, setOpen] = useState(false);
  const search = `table=${table}&record=${encodeURIComponent(record)}`;
  const trail = useQuery({
    queryKey: queryKeys.trail(vesselId ?? "company", table, record),
    queryFn: () => fetchJson<Trail>(vesselId ? `/api/vessels/${vesselId}/trail?${search}` : `/api/trail?${search}`),
    enabled: open,
  });
  return (
    <details className="panel p-4 print:hidden" onToggle={(e) => setOpen(e.currentTarget.open)}>
      <summary className="cursor-pointer py-1 font-semibold">History of changes</summary>
      <div className="mt-3" aria-live="polite" aria-busy={trail.isPending && open}>
        {trail.isPending && <p className="text-sm text-ink-500">Loading the trail…</p>}
        {trail.isError && <LoadProblem error={trail.error} what="the history of changes" />}
        {trail.data && trail.data.items.length === 0 && (
          <p className="text-sm text-ink-500">No change is recorded for this record.</p>
        )}
        {trail.data && trail.data.items.length > 0 && (
          <ol className="space-y-3 text-sm">
            {trail.data.items.map((item) => (
              <li key={item.id} className="border-l-2 border-ink-200 pl-3 dark:border-ink-700">
                <p>
                  <span className="tabular-nums text-ink-500 dark:text-ink-400">{formatUtcTime(item.at)}</span> ·{" "}
                  <span className={item.byPerson ? "font-medium" : "italic"}>{item.by}</span> · {item.record}{" "}
                  {item.action}
                </p>
                {item.reason && <p>Reason: {item.reason}</p>}
                {item.lines.length > 0 && (
                  <ul className="text-xs text-ink-600 dark:text-ink-300">
                    {item.lines.slice(0, 8).map((l) => (
                      <li key={l.label}>
                        {l.label}:{" "}
                        {lineValueWords(item.action, l)}
                      </li>
                    ))}
                  </ul>
                )}
              </li>
            ))}
          </ol>
        )}
        {trail.data?.more && (
          <p className="mt-2 text-xs text-ink-500">
            Only the newest 200 changes are shown here; the administrator’s audit trail holds them all.
          </p>
        )}
      </div>
    </details>
  );
}
