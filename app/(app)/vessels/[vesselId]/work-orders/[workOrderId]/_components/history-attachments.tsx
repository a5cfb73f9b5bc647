"use client";

import { useState } from "react";
import { formatBytes, isImage } from "@/server/attachments/contract";
import { useAttachments } from "./use-attachments";

type Props = { vesselId: string; workOrderId: string; number: string };

/**
 * An earlier job's photos and documents, fetched only when asked for: the history stays one quick
 * query, and what was found last time is a tap away.
 */
export function HistoryAttachments({ vesselId, workOrderId, number }: Props) {
  const [open, setOpen] = useState(false);
  return (
    <span className="mt-1 block">
      <button
        type="button"
        className="text-xs font-semibold text-tide-700 underline-offset-2 hover:underline dark:text-tide-300"
        aria-expanded={open}
        onClick={() => setOpen((o) => !o)}
      >
        {open ? "▾" : "▸"} Photos and documents<span className="sr-only"> of {number}</span>
      </button>
      {open && <Strip vesselId={vesselId} workOrderId={workOrderId} />}
    </span>
  );
}

function Strip({ vesselId, workOrderId }: { vesselId: string; workOrderId: string }) {
  const query = useAttachments(vesselId, workOrderId);
  if (query.error) {
    return <span className="block text-xs text-alarm-700 dark:text-alarm-300">They could not be loaded: {query.error.message}</span>;
  }
  if (!query.data) return <span className="block text-xs text-ink-500 dark:text-ink-400" aria-busy="true">Loading…</span>;
  const items = query.data.attachments;
  if (!items.length) return <span className="block text-xs text-ink-500 dark:text-ink-400">None were kept with this job.</span>;
  return (
    <ul className="mt-1 flex flex-wrap gap-2">
      {items.map((a) => (
        <li key={a.id}>
          <a
            href={a.url}
            target={isImage(a.contentType) ? "_blank" : undefined}
            rel="noopener"
            className="block w-24 overflow-hidden rounded border border-ink-200 text-xs dark:border-ink-800"
            title={a.caption ?? a.fileName}
          >
            {isImage(a.contentType) ? (
              // eslint-disable-next-line @next/next/no-img-element -- served by the app's download route
              <img src={a.url} alt={a.caption ?? a.fileName} loading="lazy" className="aspect-[4/3] w-full object-cover" />
            ) : (
              <span className="flex aspect-[4/3] w-full items-center justify-center bg-ink-100 font-semibold text-alarm-700 dark:bg-ink-850 dark:text-alarm-300">
                PDF · {formatBytes(a.byteSize)}
              </span>
            )}
            <span className="block truncate px-1 py-0.5 text-ink-600 dark:text-ink-300">{a.caption ?? a.fileName}</span>
          </a>
        </li>
      ))}
    </ul>
  );
}
