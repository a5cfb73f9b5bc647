"use client";

import { format } from "date-fns";
import { useRef, useState } from "react";
import { type DataColumn, DataTable } from "@/app/_components/data-table";
import { problemSentence } from "@/app/_components/forms/form-problem";
import { Notice } from "@/app/_components/notice";
import type { OutboxRow } from "@/server/mail/contract";
import { MAIL_KIND_LABEL } from "@/server/mail/kinds";
import { ConfirmPanel } from "../../_components/confirm-panel";
import { RowButton } from "../../_components/row-button";
import { useOutboxAction } from "./use-admin-mail";

const STATUS_TONE: Record<OutboxRow["status"], string> = {
  pending: "text-brass-700 dark:text-brass-300",
  sending: "text-tide-700 dark:text-tide-300",
  sent: "text-go-700 dark:text-go-300",
  failed: "text-alarm-700 dark:text-alarm-300",
  cancelled: "text-ink-500 dark:text-ink-400",
};

export const when = (iso: string) => format(new Date(iso), "d MMM yyyy, HH:mm");

/** A message given up or cancelled, or waiting out a back-off after a refusal, may be tried (again) now. */
const mayRetry = (r: OutboxRow) =>
  r.status === "failed" || r.status === "cancelled" || (r.status === "pending" && r.attempts > 0);
/** Only a waiting message can be stopped; one being sent is in the worker's hands. */
const mayCancel = (r: OutboxRow) => r.status === "pending";
const whoOf = (r: OutboxRow) => `“${r.subject}” to ${r.to}`;

export function Outbox({ rows }: { rows: OutboxRow[] }) {
  const action = useOutboxAction();
  const [cancelling, setCancelling] = useState<OutboxRow | null>(null);
  const [notice, setNotice] = useState<{ message: string; tone: "done" | "problem" } | null>(null);
  const heading = useRef<HTMLHeadingElement>(null);
  // The row's buttons change or vanish once the list is read again, so keyboard focus goes to the
  // heading, just above the notice, instead of falling back to the page. After the side panel has
  // given focus back to its opener, hence the next frame.
  const focusHeading = () => requestAnimationFrame(() => heading.current?.focus());

  async function retry(row: OutboxRow) {
    setNotice(null);
    try {
      await action.mutateAsync({ id: row.id, action: "retry" });
      setNotice({
        tone: "done",
        message: `${whoOf(row)} is queued again: the worker tries it within seconds. If the relay refuses it again, the error shows here.`,
      });
    } catch (error) {
      setNotice({ tone: "problem", message: problemSentence(error, "nothing was changed") });
    }
    focusHeading();
  }

  const counts = rows.reduce<Record<string, number>>(
    (acc, r) => ({ ...acc, [r.status]: (acc[r.status] ?? 0) + 1 }),
    {},
  );
  const columns: DataColumn<OutboxRow>[] = [
    {
      id: "message",
      header: "Message",
      cellClassName: "font-normal",
      cell: (r) => (
        <>
          <span className="block font-semibold">{r.subject}</span>
          <span className="block text-xs text-ink-500 dark:text-ink-400">
            {MAIL_KIND_LABEL[r.kind]} · to {r.to} · queued {when(r.createdAt)}
          </span>
        </>
      ),
    },
    {
      id: "status",
      header: "Status",
      cellClassName: "whitespace-nowrap",
      cell: (r) => (
        <>
          <span className={`font-semibold ${STATUS_TONE[r.status]}`}>{r.status}</span>
          <span className="block text-xs text-ink-500 dark:text-ink-400">
            {r.status === "sent" && r.sentAt
              ? when(r.sentAt)
              : r.status === "pending"
                ? `next try ${when(r.nextAttemptAt)}`
                : ""}
          </span>
        </>
      ),
    },
    { id: "attempts", header: "Attempts", align: "right", cellClassName: "tabular-nums", cell: (r) => r.attempts },
    {
      id: "error",
      header: "Last error",
      cellClassName: "text-xs break-words text-ink-600 dark:text-ink-300",
      // The sender leaves the error of a refused attempt on a message sent later: say it is history.
      cell: (r) =>
        r.lastError === null ? (
          <span className="text-ink-500">—</span>
        ) : r.status === "sent" ? (
          <span className="text-ink-500 dark:text-ink-400">before it was sent: {r.lastError}</span>
        ) : (
          r.lastError
        ),
    },
    {
      id: "actions",
      header: "Actions",
      hideHeader: true,
      cellClassName: "whitespace-nowrap",
      cell: (r) => (
        <div className="flex justify-end gap-1.5">
          {mayRetry(r) && (
            <RowButton
              label="Try again"
              who={whoOf(r)}
              disabled={action.isPending && action.variables?.id === r.id}
              onClick={() => void retry(r)}
            />
          )}
          {mayCancel(r) && <RowButton label="Cancel" who={whoOf(r)} onClick={() => setCancelling(r)} />}
        </div>
      ),
    },
  ];

  return (
    <section aria-labelledby="outbox-heading">
      <h3 id="outbox-heading" ref={heading} tabIndex={-1} className="font-semibold focus:outline-none">
        Outbox
      </h3>
      <p className="mb-2 text-ink-500 dark:text-ink-400">
        Every message is written here before it is sent, once per person and subject, and retried with growing pauses
        when the relay fails. A failed or cancelled message can be tried again; a waiting one can be cancelled.{" "}
        {rows.length > 0 &&
          (["pending", "sending", "sent", "failed", "cancelled"] as const)
            .filter((s) => counts[s])
            .map((s) => `${counts[s]} ${s}`)
            .join(", ")}
        {rows.length === 100 && " (the latest 100)"}
      </p>
      <Notice message={notice?.message ?? null} tone={notice?.tone} className="mb-2" />
      <DataTable
        columns={columns}
        rows={rows}
        rowKey={(r) => r.id}
        labelledBy="outbox-heading"
        alignTop
        empty="Nothing queued yet."
      />
      {cancelling && (
        <ConfirmPanel
          title="Cancel this message?"
          subtitle={whoOf(cancelling)}
          confirmLabel="Cancel the message"
          tone="alarm"
          // Its own "Cancel" button would read as the action itself; Close and Escape leave.
          offerCancel={false}
          onConfirm={async () => {
            const { message } = await action.mutateAsync({ id: cancelling.id, action: "cancel" });
            return `${whoOf(message)} is cancelled and will not be sent.`;
          }}
          onDone={(message) => {
            setCancelling(null);
            setNotice({ tone: "done", message });
            focusHeading();
          }}
          onClose={() => setCancelling(null)}
        >
          <p>It will not be sent. If the worker is sending it at this very moment, it cannot be stopped any more.</p>
          <p>
            It stays in the outbox as cancelled, with “Cancelled by” and your name beside it. “Try again” sends it after
            all.
          </p>
        </ConfirmPanel>
      )}
    </section>
  );
}
