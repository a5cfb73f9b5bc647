"use client";

import { useState } from "react";
import { TableSkeleton } from "@/app/_components/data-table";
import { LoadProblem, Notice } from "@/app/_components/notice";
import { ageOf } from "@/app/_components/relative-age";
import type { AdminMail, CaughtMessage } from "@/server/mail/contract";
import { ConfirmPanel } from "../../_components/confirm-panel";
import { Outbox, when } from "./outbox";
import { useAdminMail, useClearCaught } from "./use-admin-mail";

export function MailAdmin() {
  const mail = useAdminMail();
  if (mail.isPending) return <TableSkeleton label="Loading the mail" />;
  if (mail.error) return <LoadProblem what="mail" error={mail.error} />;
  return (
    <div className="grid gap-6">
      <Delivery data={mail.data} refreshing={mail.isFetching} onRefresh={() => void mail.refetch()} />
      {mail.data.caught && (
        <CaughtMail messages={mail.data.caught} problem={mail.data.caughtProblem} now={new Date(mail.dataUpdatedAt)} />
      )}
      <Outbox rows={mail.data.outbox} />
    </div>
  );
}

function Delivery({ data, refreshing, onRefresh }: { data: AdminMail; refreshing: boolean; onRefresh: () => void }) {
  return (
    <div className="flex flex-wrap items-start justify-between gap-3">
      <div className="max-w-3xl">
        <h2 className="text-base font-semibold">{data.delivery.kind === "fake" ? "Caught mail" : "Mail"}</h2>
        <p className="text-ink-600 dark:text-ink-300">
          {data.delivery.kind === "fake" ? (
            <>
              This is a development set-up: messages go to the local mail catcher, not to anyone’s inbox. The catcher
              keeps them for you to read here; you see your company’s messages only.
            </>
          ) : (
            <>
              Messages go to the configured relay,{" "}
              <span className="font-mono text-xs">
                {data.delivery.host}:{data.delivery.port}
              </span>
              , and from there to people’s inboxes. Below is what Keelson queued and how sending went.
            </>
          )}
        </p>
      </div>
      <button type="button" className="btn-quiet" onClick={onRefresh} disabled={refreshing}>
        {refreshing ? "Refreshing…" : "Refresh"}
      </button>
    </div>
  );
}

function CaughtMail({ messages, problem, now }: { messages: CaughtMessage[]; problem: string | null; now: Date }) {
  const [openId, setOpenId] = useState<string | null>(null);
  const [confirming, setConfirming] = useState(false);
  const [notice, setNotice] = useState<string | null>(null);
  const clear = useClearCaught();
  const open = messages.find((m) => m.id === openId) ?? messages[0] ?? null;

  return (
    <section aria-labelledby="caught-heading">
      <div className="mb-2 flex flex-wrap items-end justify-between gap-3">
        <h3 id="caught-heading" className="font-semibold">
          Caught by the mail catcher{" "}
          <span className="font-normal text-ink-500 dark:text-ink-400">({messages.length})</span>
        </h3>
        <button type="button" className="btn-quiet px-2 py-1 text-xs" onClick={() => setConfirming(true)}>
          Clear caught mail
        </button>
      </div>
      <Notice message={notice} className="mb-3" />
      {confirming && (
        <ConfirmPanel
          title="Clear the caught mail?"
          subtitle="Your company’s messages in the local mail catcher of this development set-up"
          confirmLabel="Clear caught mail"
          tone="alarm"
          onConfirm={async () => {
            const { cleared } = await clear.mutateAsync();
            return `${clearedWords(cleared)} The outbox is as it was; nothing is sent again.`;
          }}
          onDone={(message) => {
            setConfirming(false);
            setNotice(message);
          }}
          onClose={() => setConfirming(false)}
        >
          <p>The catcher forgets your company’s messages; other companies’ messages on this set-up stay in it.</p>
          <p>The outbox is not touched: sent messages stay marked sent and are not sent again.</p>
        </ConfirmPanel>
      )}
      {problem && (
        <p
          role="alert"
          className="mb-3 rounded-md bg-alarm-50 px-3 py-2 font-medium text-alarm-700 dark:bg-alarm-700/20 dark:text-alarm-300"
        >
          {problem}
        </p>
      )}
      {messages.length === 0 ? (
        <p className="panel p-4 text-ink-500 dark:text-ink-400">
          Nothing caught yet. Reminders, digests and invitations appear here once the worker has sent them.
        </p>
      ) : (
        <div className="grid gap-3 lg:grid-cols-[minmax(0,2fr)_minmax(0,3fr)]">
          <ul
            className="max-h-[36rem] divide-y divide-ink-100 self-start overflow-y-auto panel dark:divide-ink-850"
            aria-label="Caught messages"
          >
            {messages.map((m) => {
              const current = open?.id === m.id;
              return (
                <li key={m.id}>
                  <button
                    type="button"
                    aria-current={current ? "true" : undefined}
                    onClick={() => setOpenId(m.id)}
                    className={`block w-full px-3 py-2 text-left hover:bg-ink-50 dark:hover:bg-ink-850 ${
                      current ? "bg-tide-50 dark:bg-tide-900/60" : ""
                    }`}
                  >
                    <span className="block truncate font-semibold">{m.subject || "(no subject)"}</span>
                    <span className="flex justify-between gap-2 text-xs text-ink-500 dark:text-ink-400">
                      <span className="truncate">to {m.to.join(", ")}</span>
                      <time dateTime={m.date} title={when(m.date)} className="shrink-0">
                        {ageOf(m.date, now)}
                      </time>
                    </span>
                  </button>
                </li>
              );
            })}
          </ul>
          {open && <MessageViewer key={open.id} message={open} />}
        </div>
      )}
    </section>
  );
}

function clearedWords(cleared: number): string {
  if (cleared === 0) return "The catcher held none of your company’s messages.";
  return `Cleared ${cleared} caught ${cleared === 1 ? "message" : "messages"} of your company.`;
}

function MessageViewer({ message }: { message: CaughtMessage }) {
  const [view, setView] = useState<"html" | "text">(message.html ? "html" : "text");
  const tab = (which: "html" | "text", label: string) => (
    <button
      type="button"
      role="tab"
      aria-selected={view === which}
      disabled={which === "html" && !message.html}
      onClick={() => setView(which)}
      className={`border-b-2 px-3 py-1.5 font-semibold disabled:opacity-40 ${
        view === which
          ? "border-brass-500 text-ink-900 dark:text-white"
          : "border-transparent text-ink-500 hover:text-ink-800 dark:text-ink-400 dark:hover:text-ink-100"
      }`}
    >
      {label}
    </button>
  );
  return (
    <article className="flex min-w-0 flex-col panel" aria-label={`Message: ${message.subject}`}>
      <header className="border-b border-ink-200 px-4 py-3 dark:border-ink-800">
        <h4 className="font-semibold">{message.subject || "(no subject)"}</h4>
        <dl className="mt-1 grid grid-cols-[auto_1fr] gap-x-3 text-xs text-ink-600 dark:text-ink-300">
          <dt className="font-semibold">From</dt>
          <dd className="truncate">{message.from}</dd>
          <dt className="font-semibold">To</dt>
          <dd className="truncate">{message.to.join(", ")}</dd>
          <dt className="font-semibold">Caught</dt>
          <dd>{when(message.date)}</dd>
          <dt className="font-semibold">Message-ID</dt>
          <dd className="truncate font-mono">{message.messageId ?? "—"}</dd>
        </dl>
        <div role="tablist" aria-label="Show the message as" className="mt-2 -mb-3 flex gap-1">
          {tab("html", "HTML")}
          {tab("text", "Plain text")}
        </div>
      </header>
      {view === "html" && message.html ? (
        // The message is untrusted markup: an empty sandbox runs no script, submits no form.
        // Light background on purpose: mail is designed for a white page.
        <iframe
          title={`HTML of “${message.subject}”`}
          sandbox=""
          srcDoc={message.html}
          className="h-[32rem] w-full rounded-b-lg bg-white"
        />
      ) : (
        <pre className="max-h-[32rem] overflow-auto px-4 py-3 font-mono text-xs whitespace-pre-wrap">
          {message.text}
        </pre>
      )}
    </article>
  );
}
