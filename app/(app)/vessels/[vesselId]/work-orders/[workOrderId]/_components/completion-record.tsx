"use client";

import { useState } from "react";
import { Field } from "@/app/_components/forms/field";
import { ProblemError } from "@/app/_components/fetch-json";
import { problemSentence } from "@/app/_components/forms/form-problem";
import { Notice } from "@/app/_components/notice";
import { useRankWords } from "@/app/_components/rank-words-provider";
import type { CompletionRecord } from "@/server/completions/contract";
import { formatHours, formatShipTime } from "@/server/format/hours";
import type { PartUnit } from "@/db/schema/parts";
import { amountText } from "@/server/parts/contract";
import { useDecideCompletion } from "./use-work-order";

const STATUS_WORDS: Record<CompletionRecord["status"], string> = {
  "awaiting-approval": "◷ Awaiting the chief engineer’s approval",
  approved: "✓ Approved",
  returned: "↩ Returned for correction",
};

type Props = { record: CompletionRecord; timeZone: string; counterName: string | null };

/** What the engineer recorded, as the chief reads it before deciding. */
export function CompletionRecordView({ record, timeZone, counterName }: Props) {
  const { label: rankLabel } = useRankWords();
  const when = (iso: string) => formatShipTime(new Date(iso), timeZone);
  return (
    <section aria-labelledby="record-heading" className="panel p-4">
      <h2 id="record-heading" className="text-base font-semibold">
        Completion record
      </h2>
      <p className="mt-1 font-semibold" data-status={record.status}>
        {STATUS_WORDS[record.status]}
        {record.decidedAt && record.decidedBy && (
          <span className="font-normal text-ink-500">
            {" "}
            · {record.decidedBy}, {when(record.decidedAt)}
          </span>
        )}
      </p>
      {record.decisionNote && (
        <p className="mt-2 rounded-md bg-brass-100 px-3 py-2 text-ink-900 dark:bg-brass-700/30 dark:text-ink-50">
          <span className="font-semibold">Chief engineer’s note:</span> {record.decisionNote}
        </p>
      )}
      <dl className="mt-3 grid grid-cols-2 gap-x-6 gap-y-2 text-sm sm:grid-cols-4">
        <div>
          <dt className="label">Done</dt>
          <dd>{when(record.doneAt)} ship’s time</dd>
        </div>
        <div>
          <dt className="label">Recorded by</dt>
          <dd>{record.doneBy ?? "—"}</dd>
        </div>
        <div>
          <dt className="label">Responsible</dt>
          <dd>{record.responsible ?? record.doneBy ?? "—"}</dd>
        </div>
        <div className="col-span-2">
          <dt className="label">Done by</dt>
          <dd>
            {record.workedBy.length
              ? record.workedBy.map((p) => (p.name ? `${rankLabel(p.rank)} ${p.name}` : rankLabel(p.rank))).join(", ")
              : "—"}
          </dd>
        </div>
        <div>
          <dt className="label">Counter at completion</dt>
          <dd className="tabular-nums">
            {record.counterHours !== null
              ? `${formatHours(record.counterHours)}${counterName ? ` (${counterName})` : ""}`
              : "—"}
          </dd>
        </div>
        <div>
          <dt className="label">Man-hours</dt>
          <dd className="tabular-nums">{record.manHours}</dd>
        </div>
      </dl>
      {record.checklist.length > 0 && (
        <ol className="mt-3 grid gap-1">
          {record.checklist.map((t, i) => (
            <li key={i} className={t.done ? "" : "font-medium text-brass-700 dark:text-brass-300"}>
              <span aria-hidden="true">{t.done ? "☑" : "☐"}</span> {t.step}
              <span className="sr-only">{t.done ? " (done)" : " (not done)"}</span>
              {t.remark && <span className="block pl-5 text-sm">Not done: {t.remark}</span>}
            </li>
          ))}
        </ol>
      )}
      {record.measurements.length > 0 && (
        <table className="mt-3 text-sm">
          <thead className="text-left text-xs text-ink-500 uppercase">
            <tr>
              <th className="pr-4 font-semibold">Measurement</th>
              <th className="pr-4 font-semibold">Value</th>
              <th className="font-semibold">Limits</th>
            </tr>
          </thead>
          <tbody>
            {record.measurements.map((m) => (
              <tr key={m.name} className={m.outOfLimits ? "font-semibold text-alarm-700 dark:text-alarm-300" : ""}>
                <td className="pr-4">{m.name}</td>
                <td className="pr-4 tabular-nums">
                  {m.value} {m.unit}
                  {m.outOfLimits && " ▲ out of limits"}
                </td>
                <td className="tabular-nums">
                  {m.lower ?? "—"} … {m.upper ?? "—"} {m.unit}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      {record.partsUsed.length > 0 && (
        <div className="mt-3 text-sm">
          <h3 className="label">Parts used</h3>
          <ul className="mt-1 grid gap-0.5">
            {record.partsUsed.map((p) => (
              <li key={p.partId}>
                <span className="tabular-nums">{amountText(p.quantity, p.unit as PartUnit)}</span> {p.number} — {p.description}
              </li>
            ))}
          </ul>
          {record.status === "returned" && <p className="text-ink-500">Put back in the stores while the record is corrected.</p>}
        </div>
      )}
      {record.remarks && <p className="mt-3 whitespace-pre-line">{record.remarks}</p>}
    </section>
  );
}

type DecisionProps = {
  vesselId: string;
  workOrderId: string;
  onDecided: (message: string) => void;
  /** The defect number approving this repair closes: then its cause and action are asked. */
  closesDefect?: string | null;
};

/** The chief engineer's answer: approve, or return with a note saying what to correct. */
export function DecisionForm({ vesselId, workOrderId, onDecided, closesDefect = null }: DecisionProps) {
  const decide = useDecideCompletion(vesselId, workOrderId);
  const [note, setNote] = useState("");
  const [cause, setCause] = useState("");
  const [action, setAction] = useState("");
  const [problem, setProblem] = useState<string | null>(null);
  const [noteError, setNoteError] = useState<string | null>(null);
  const [closeErrors, setCloseErrors] = useState<Record<string, string>>({});

  async function send(decision: "approve" | "return") {
    setProblem(null);
    setNoteError(null);
    setCloseErrors({});
    if (decision === "return" && !note.trim()) {
      setNoteError("Say what needs correcting before returning it.");
      return;
    }
    try {
      await decide.mutateAsync({ decision, note, cause, action });
      onDecided(
        decision === "approve"
          ? closesDefect
            ? `Approved: ${closesDefect} is closed with its cause and action.`
            : "Approved: the work order is done and the next occurrence is being scheduled."
          : "Returned to the engineer with your note.",
      );
    } catch (error) {
      const named = error instanceof ProblemError ? (error.problem.errors ?? []).filter((e) => e.field === "cause" || e.field === "action") : [];
      setCloseErrors(Object.fromEntries(named.map((e) => [e.field, e.message])));
      setProblem(named.length ? "Nothing was decided: say the cause and the action." : problemSentence(error, "nothing was decided"));
    }
  }

  return (
    <section aria-labelledby="decision-heading" className="no-print grid gap-3 panel p-4">
      <h2 id="decision-heading" className="text-base font-semibold">
        Your decision
      </h2>
      <Field id="decision-note" label="Note (needed to return it)" error={noteError ?? undefined}>
        <textarea
          id="decision-note"
          className="field min-h-20"
          value={note}
          onChange={(e) => setNote(e.target.value)}
          aria-invalid={noteError ? true : undefined}
          aria-describedby={noteError ? "decision-note-error" : undefined}
        />
      </Field>
      {closesDefect && (
        <fieldset className="grid gap-3">
          <legend className="label">Approving closes {closesDefect}: say what caused it and what prevents it again (ISM Code §9)</legend>
          <Field id="defect-cause" label="Cause found" error={closeErrors.cause}>
            <textarea id="defect-cause" className="field min-h-16" value={cause} onChange={(e) => setCause(e.target.value)} aria-invalid={closeErrors.cause ? true : undefined} />
          </Field>
          <Field id="defect-action" label="Action against a repeat" error={closeErrors.action}>
            <textarea id="defect-action" className="field min-h-16" value={action} onChange={(e) => setAction(e.target.value)} aria-invalid={closeErrors.action ? true : undefined} />
          </Field>
        </fieldset>
      )}
      <Notice tone="problem" message={problem} />
      <div className="flex gap-2">
        <button type="button" className="btn-primary" disabled={decide.isPending} onClick={() => send("approve")}>
          {closesDefect ? "Approve and close the defect" : "Approve"}
        </button>
        <button type="button" className="btn-quiet" disabled={decide.isPending} onClick={() => send("return")}>
          Return with note
        </button>
      </div>
    </section>
  );
}
