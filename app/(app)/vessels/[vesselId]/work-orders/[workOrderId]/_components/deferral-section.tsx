"use client";

import { useState } from "react";
import { Field } from "@/app/_components/forms/field";
import { problemSentence } from "@/app/_components/forms/form-problem";
import { SidePanel } from "@/app/_components/forms/side-panel";
import { Notice } from "@/app/_components/notice";
import {
  DEFERRAL_STATUS_WORDS,
  type DeferralEntry,
  REJECT_NOTE_MIN,
  type WorkOrderWithDeferrals,
} from "@/server/deferrals/contract";
import { formatHours, formatShipDate, formatShipTime } from "@/server/format/hours";
import { DeferralRequestForm } from "./deferral-request-form";
import { proposedWords } from "./deferral-words";
import { useDecideDeferral, useWithdrawDeferral } from "./use-work-order";

type Props = { detail: WorkOrderWithDeferrals; onMessage: (message: string) => void };

/** Deferral requests of the work order: the one pending with what may be done now, then the record. */
export function DeferralSection({ detail, onMessage }: Props) {
  const { deferrals: d, vessel, workOrder: w } = detail;
  const [asking, setAsking] = useState(false);
  const pending = d.history.find((e) => e.status === "pending") ?? null;
  const earlier = d.history.filter((e) => e !== pending);
  const tz = vessel.timeZone;

  return (
    <section aria-labelledby="deferral-heading" className="grid gap-3 panel p-4">
      <div className="flex flex-wrap items-start justify-between gap-3">
        <h2 id="deferral-heading" className="text-base font-semibold">
          Deferral
        </h2>
        {d.may.request && (
          <button type="button" className="no-print btn-quiet" onClick={() => setAsking(true)}>
            Request a deferral
          </button>
        )}
      </div>
      {d.current.deferred && (
        <p className="rounded-md bg-ink-100 px-3 py-2 dark:bg-ink-800" data-testid="deferred-limit">
          <span aria-hidden="true">↷ </span>
          <span className="font-semibold">Deferred.</span> The limit in force is{" "}
          {[
            d.current.dueDate && formatShipDate(new Date(d.current.dueDate), tz),
            d.current.dueHours !== null && formatHours(d.current.dueHours),
          ]
            .filter(Boolean)
            .join(" · ")}
          ; the tolerance window and grace are measured from it.
        </p>
      )}
      {pending && <PendingRequest entry={pending} detail={detail} onMessage={onMessage} />}
      {d.history.length === 0 ? (
        <p className="text-ink-600 dark:text-ink-300">
          No deferral has been asked for this work order.
          {d.may.request ? " If it cannot be done by its limit, request one with the reason." : ""}
        </p>
      ) : (
        earlier.length > 0 && (
          <div>
            <h3 className="label">{pending ? "Earlier requests" : "Requests"}</h3>
            <ol className="grid gap-2">
              {earlier.map((e) => (
                <li key={e.id} className="border-l-2 border-ink-200 pl-3 dark:border-ink-700">
                  <EntryView entry={e} timeZone={tz} />
                </li>
              ))}
            </ol>
          </div>
        )
      )}
      {asking && (
        <SidePanel
          title="Request a deferral"
          subtitle={`${w.number} · ${w.title}`}
          onClose={() => setAsking(false)}
          wide
        >
          <DeferralRequestForm
            detail={detail}
            onDone={(message) => {
              setAsking(false);
              onMessage(message);
            }}
          />
        </SidePanel>
      )}
    </section>
  );
}

function EntryView({ entry: e, timeZone }: { entry: DeferralEntry; timeZone: string }) {
  const when = (iso: string) => formatShipTime(new Date(iso), timeZone);
  const status = DEFERRAL_STATUS_WORDS[e.status];
  return (
    <div className="grid gap-1" data-deferral-status={e.status}>
      <p>
        <span className="font-semibold">
          <span aria-hidden="true">{status.glyph} </span>
          {status.words.charAt(0).toUpperCase() + status.words.slice(1)}
        </span>{" "}
        · to <span className="tabular-nums">{proposedWords(e)}</span>
        {e.needsOffice && <span className="text-ink-500"> · office decision</span>}
      </p>
      <p className="whitespace-pre-line">{e.reason}</p>
      <p className="text-sm text-ink-500 dark:text-ink-400">
        Asked by {e.requestedBy ?? "a former user"}, {when(e.requestedAt)} ship’s time
        {e.decidedAt &&
          ` · ${e.status === "withdrawn" ? "withdrawn" : "decided"} by ${e.decidedBy ?? "a former user"}, ${when(e.decidedAt)}`}
      </p>
      {e.decisionNote && (
        <p className="rounded-md bg-brass-100 px-3 py-2 text-ink-900 dark:bg-brass-700/30 dark:text-ink-50">
          <span className="font-semibold">Decision note:</span> {e.decisionNote}
        </p>
      )}
    </div>
  );
}

function PendingRequest({ entry, detail, onMessage }: { entry: DeferralEntry } & Props) {
  const { deferrals: d, vessel, workOrder: w } = detail;
  const decide = useDecideDeferral(vessel.id, w.id);
  const withdraw = useWithdrawDeferral(vessel.id, w.id);
  const [note, setNote] = useState("");
  const [noteError, setNoteError] = useState<string | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const busy = decide.isPending || withdraw.isPending;

  async function send(decision: "approve" | "reject") {
    setProblem(null);
    setNoteError(null);
    if (decision === "reject" && note.trim().length < REJECT_NOTE_MIN) {
      setNoteError("Say why the deferral is rejected, so the chief engineer knows what to do instead.");
      return;
    }
    try {
      await decide.mutateAsync({ deferralId: entry.id, decision, note });
      onMessage(
        decision === "approve"
          ? `Deferral approved: ${w.number} is deferred to ${proposedWords(entry)}.`
          : `Deferral rejected: ${w.number} keeps its limit.`,
      );
    } catch (error) {
      setProblem(problemSentence(error, "nothing was decided"));
    }
  }

  async function takeBack() {
    setProblem(null);
    try {
      await withdraw.mutateAsync(entry.id);
      onMessage(`Deferral request for ${w.number} withdrawn.`);
    } catch (error) {
      setProblem(problemSentence(error, "nothing was changed"));
    }
  }

  return (
    <div className="grid gap-3 rounded-md border border-brass-400 p-3 dark:border-brass-500">
      <EntryView entry={entry} timeZone={vessel.timeZone} />
      {d.may.decide ? (
        <div className="no-print grid gap-3">
          <Field id="deferral-note" label="Decision note (needed to reject)" error={noteError ?? undefined}>
            <textarea
              id="deferral-note"
              className="field min-h-20"
              value={note}
              onChange={(e) => setNote(e.target.value)}
              aria-invalid={noteError ? true : undefined}
              aria-describedby={noteError ? "deferral-note-error" : undefined}
            />
          </Field>
          <div className="flex flex-wrap gap-2">
            <button type="button" className="btn-primary" disabled={busy} onClick={() => send("approve")}>
              Approve deferral
            </button>
            <button type="button" className="btn-quiet" disabled={busy} onClick={() => send("reject")}>
              Reject deferral
            </button>
          </div>
        </div>
      ) : (
        <p className="font-medium">
          {d.needsOffice
            ? "Awaits the technical superintendent’s decision: critical or class-related work (or your company’s rule) is decided by the office."
            : "Awaits the decision of the chief engineer or the technical superintendent."}
        </p>
      )}
      {d.may.withdraw && (
        <p className="no-print">
          <button type="button" className="btn-quiet" disabled={busy} onClick={takeBack}>
            Withdraw the request
          </button>
        </p>
      )}
      <Notice tone="problem" message={problem} />
    </div>
  );
}
