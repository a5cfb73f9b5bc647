"use client";
// The parts the stay's jobs need (their routines' lists) against what is on board and what open
// requisitions already ask for: the chief engineer sees before arriving which jobs lack parts, and
// drafts a requisition of the shortfalls (and of what brings each part back to its minimum).
import Link from "next/link";
import { useState } from "react";
import { problemSentence } from "@/app/_components/forms/form-problem";
import { Notice } from "@/app/_components/notice";
import { amountText, type StayPartLine } from "@/server/parts/contract";
import { useDraftRequisition, useStayParts } from "../../../requisitions/_components/use-requisitions";

/** A proposal with more jobs than this is counted once accepted (the list travels in the address). */
const MAX_SHOWN_JOBS = 300;

type Props = { vesselId: string; stayId: string; port: string; jobs: string[] | null; canRequest: boolean };

function why(line: StayPartLine, minimum: boolean): string {
  const parts = [];
  if (line.short > 0) parts.push(`short ${line.short} for ${line.jobs.join(", ")}`);
  if (minimum && line.minimumOnBoard > 0) parts.push(`back to its minimum of ${line.minimumOnBoard}`);
  return parts.join("; ") || "for the stay’s jobs";
}

export function StayPartsPanel({ vesselId, stayId, port, jobs, canRequest }: Props) {
  const [minimum, setMinimum] = useState(true);
  const tooMany = !!jobs && jobs.length > MAX_SHOWN_JOBS;
  const query = useStayParts(vesselId, stayId, tooMany ? null : jobs, minimum);
  const draft = useDraftRequisition(vesselId);
  const [made, setMade] = useState<string | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const data = query.data;
  const toAsk = data?.lines.filter((l) => l.toOrder > 0) ?? [];
  const short = data?.lines.filter((l) => l.short > 0) ?? [];

  async function raise() {
    setProblem(null);
    try {
      const saved = await draft.mutateAsync({
        portStayId: stayId,
        note: `Parts for the work package at ${port}.`,
        lines: toAsk.map((l) => ({ partId: l.partId, quantity: l.toOrder, reason: why(l, minimum) })),
      });
      setMade(saved.number);
    } catch (error) {
      setProblem(problemSentence(error, "no requisition was drafted"));
    }
  }

  return (
    <section aria-labelledby="stay-parts-heading" className="grid gap-3 panel p-4">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 id="stay-parts-heading" className="text-lg font-semibold">
          Parts for {jobs ? "these jobs" : "the package"}
        </h2>
        <label className="flex items-center gap-2 text-sm">
          <input type="checkbox" className="accent-tide-600" checked={minimum} onChange={(e) => setMinimum(e.target.checked)} />
          Also bring each part back to its minimum
        </label>
      </div>
      {query.error ? (
        <Notice tone="problem" message={problemSentence(query.error, "the parts could not be counted")} />
      ) : !data ? (
        <p aria-busy="true" className="text-sm text-ink-500">
          Counting the parts…
        </p>
      ) : (
        <>
          <p className="text-sm" role="status">
            {tooMany ? "The proposal has too many jobs to count here; this counts the accepted package. " : ""}
            {data.jobs === 0
              ? "No job yet: the parts are counted for the accepted package, or for a proposal on the timeline."
              : short.length
                ? `${short.length} part${short.length === 1 ? " is" : "s are"} short for ${data.jobs} job${data.jobs === 1 ? "" : "s"}: ${short.map((l) => `${l.number} (${amountText(l.short, l.unit)})`).join(", ")}.`
                : `Every part the ${data.jobs} job${data.jobs === 1 ? "" : "s"} need${data.jobs === 1 ? "s" : ""} is on board.`}
            {data.openRequisitions.length > 0 && ` Already asked for this stay: ${data.openRequisitions.map((r) => r.number).join(", ")}.`}
          </p>
          {data.lines.length > 0 && (
            <div className="overflow-x-auto">
              <table className="w-full text-sm">
                <caption className="sr-only">The parts the jobs need against what is on board</caption>
                <thead className="text-left text-xs text-ink-500 uppercase">
                  <tr>
                    <th className="pr-3 font-semibold">Part</th>
                    <th className="pr-3 font-semibold">For</th>
                    <th className="pr-3 text-right font-semibold">Needed</th>
                    <th className="pr-3 text-right font-semibold">On board</th>
                    <th className="pr-3 text-right font-semibold">Asked</th>
                    <th className="pr-3 text-right font-semibold">Short</th>
                    <th className="text-right font-semibold">To ask</th>
                  </tr>
                </thead>
                <tbody>
                  {data.lines.map((l) => (
                    <tr key={l.partId} className="border-t border-ink-100 align-top dark:border-ink-800">
                      <td className="py-1 pr-3">
                        <span className="font-mono">{l.number}</span> {l.description}
                        {l.critical && <span className="ml-2 rounded border border-brass-400 px-1 text-xs font-semibold text-brass-700 dark:text-brass-300">critical spare</span>}
                      </td>
                      <td className="py-1 pr-3 text-ink-600 dark:text-ink-300">{l.jobs.length ? l.jobs.join(", ") : `under its minimum of ${l.minimumOnBoard}`}</td>
                      <td className="py-1 pr-3 text-right tabular-nums">{l.needed || "—"}</td>
                      <td className={`py-1 pr-3 text-right tabular-nums ${l.low ? "font-semibold text-alarm-700 dark:text-alarm-300" : ""}`}>{l.onBoard}</td>
                      <td className="py-1 pr-3 text-right tabular-nums">{l.onOrder || "—"}</td>
                      <td className={`py-1 pr-3 text-right tabular-nums ${l.short ? "font-semibold text-alarm-700 dark:text-alarm-300" : ""}`}>{l.short || "—"}</td>
                      <td className="py-1 text-right font-semibold tabular-nums">{l.toOrder ? amountText(l.toOrder, l.unit) : "—"}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          )}
          <Notice tone="problem" message={problem} />
          {made ? (
            <p role="status" className="font-medium">
              {made} drafted.{" "}
              <Link href={`/vessels/${vesselId}/requisitions?show=${made}`} className="text-tide-700 underline underline-offset-2 dark:text-tide-300">
                Check and send it on the Requisitions tab
              </Link>
            </p>
          ) : (
            canRequest &&
            data.canRequest &&
            toAsk.length > 0 && (
              <div>
                <button type="button" className="btn-primary" disabled={draft.isPending} onClick={raise}>
                  {draft.isPending ? "Drafting…" : `Draft a requisition for ${toAsk.length} part${toAsk.length === 1 ? "" : "s"}`}
                </button>
              </div>
            )
          )}
        </>
      )}
    </section>
  );
}
