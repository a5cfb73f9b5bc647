"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { useState } from "react";
import { fetchJson } from "@/app/_components/fetch-json";
import { problemSentence } from "@/app/_components/forms/form-problem";
import { Notice } from "@/app/_components/notice";
import { queryKeys } from "@/app/_components/query-keys";
import type { FleetBoardPending } from "@/server/fleet/contract";
import { formatRate } from "@/server/format/hours";
import { ageOf } from "@/app/_components/relative-age";
import { StateBadge } from "@/app/_components/state-badge";
import type { FleetBoard } from "@/server/fleet/contract";

/**
 * The requests awaiting a decision, with the chief engineer's reason and the counter's running rate
 * (is the machine really on stand-by?), decided here or on the work order page.
 */
export function PendingDeferrals({ board, now }: { board: FleetBoard; now: Date }) {
  const items = board.pendingDeferrals;
  return (
    <section className="panel" aria-labelledby="pending-deferrals-heading">
      <h2
        id="pending-deferrals-heading"
        className="border-b border-ink-200 px-4 py-3 font-semibold dark:border-ink-800"
      >
        Pending deferrals <span className="font-normal text-ink-500">{items.length}</span>
      </h2>
      {items.length === 0 ? (
        <p className="p-4 text-ink-600 dark:text-ink-300">No deferral request awaits a decision.</p>
      ) : (
        <ul className="divide-y divide-ink-100 dark:divide-ink-850" data-testid="pending-deferrals">
          {items.map((d) => (
            <li key={d.id} className="grid gap-1 px-4 py-2 sm:grid-cols-[1fr_auto] sm:items-center">
              <div>
                <Link
                  href={`/vessels/${d.vessel.id}/work-orders/${d.workOrder.id}`}
                  className="font-mono font-semibold hover:underline"
                >
                  {d.workOrder.number}
                </Link>{" "}
                <span className="font-medium">{d.workOrder.title}</span>
                <span className="block text-xs text-ink-600 dark:text-ink-300">
                  {d.vessel.name} · asked {ageOf(d.requestedAt, now)}
                  {d.requestedBy ? ` by ${d.requestedBy}` : ""} · proposed{" "}
                  {[
                    d.proposedDueDay && `to ${d.proposedDueDay}`,
                    d.proposedDueHours !== null && `to ${d.proposedDueHours.toLocaleString("en-GB")} h`,
                  ]
                    .filter(Boolean)
                    .join(" and ")}
                </span>
              </div>
              <div className="flex flex-wrap items-center gap-1.5 text-xs">
                {d.workOrder.critical && <Flag>critical</Flag>}
                {d.workOrder.classRelated && <Flag>class</Flag>}
                {d.needsOffice && <span className="text-ink-600 dark:text-ink-300">office decides</span>}
                <StateBadge state={d.workOrder.state} />
              </div>
              <Facts d={d} now={now} />
              {d.mayDecide && <Decide d={d} />}
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}

function Flag({ children }: { children: React.ReactNode }) {
  return (
    <span className="rounded border border-alarm-500 px-1.5 py-0.5 font-bold text-alarm-700 dark:text-alarm-300">
      <span aria-hidden="true">◆ </span>
      {children}
    </span>
  );
}

function Facts({ d, now }: { d: FleetBoardPending; now: Date }) {
  return (
    <div className="text-sm sm:col-span-2">
      <p className="whitespace-pre-line">
        <span className="text-ink-500">Reason: </span>“{d.reason}”
      </p>
      {d.counter && (
        <p className="text-xs text-ink-600 dark:text-ink-300">
          Counter {d.counter.name}:{" "}
          {d.counter.hoursPerDay === null
            ? "no running rate yet"
            : `${formatRate(d.counter.hoursPerDay)} (${d.counter.basis === "measured" ? "measured over the last 30 days" : "the planned rate"})`}
          {d.counter.lastReadAt ? ` · last reading ${ageOf(d.counter.lastReadAt, now)}` : " · no reading"}
        </p>
      )}
    </div>
  );
}

/** Approve, or reject with a note, from the board: the same decision as on the work order page. */
function Decide({ d }: { d: FleetBoardPending }) {
  const client = useQueryClient();
  const [note, setNote] = useState("");
  const [problem, setProblem] = useState<string | null>(null);
  const decide = useMutation({
    mutationFn: (decision: "approve" | "reject") =>
      fetchJson(`/api/vessels/${d.vessel.id}/deferrals/${d.id}/decision`, { method: "POST", body: JSON.stringify({ decision, note }) }),
    onSuccess: () =>
      Promise.all([client.invalidateQueries({ queryKey: queryKeys.fleetBoard() }), client.invalidateQueries({ queryKey: ["vessel", d.vessel.id] })]),
  });
  async function send(decision: "approve" | "reject") {
    setProblem(null);
    try {
      await decide.mutateAsync(decision);
    } catch (error) {
      setProblem(problemSentence(error, "nothing was decided"));
    }
  }
  return (
    <div className="grid gap-1.5 sm:col-span-2">
      <div className="flex flex-wrap items-center gap-2">
        <input
          aria-label={`Note on the request for ${d.workOrder.number} (needed to reject)`}
          placeholder="Note (needed to reject)"
          className="field min-w-0 flex-1"
          value={note}
          onChange={(e) => setNote(e.target.value)}
        />
        <button type="button" className="btn-primary" disabled={decide.isPending} onClick={() => send("approve")}>
          Approve<span className="sr-only"> the deferral of {d.workOrder.number}</span>
        </button>
        <button type="button" className="btn-quiet" disabled={decide.isPending} onClick={() => send("reject")}>
          Reject<span className="sr-only"> the deferral of {d.workOrder.number}</span>
        </button>
      </div>
      <Notice tone="problem" message={problem} />
    </div>
  );
}
