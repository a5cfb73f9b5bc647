"use client";

import Link from "next/link";
import { useState } from "react";
import { problemSentence } from "@/app/_components/forms/form-problem";
import { Notice } from "@/app/_components/notice";
import { ProblemError } from "@/app/_components/fetch-json";
import { formatHours, formatShipDate } from "@/server/format/hours";
import type { PackageJob, PortStayDetail, ProposalView } from "@/server/port-stays/contract";
import type { Tier } from "@/server/planning/proposal";
import { dayLabel, rankLabel } from "../../_components/stay-words";
import { useAcceptPackage, usePropose } from "../../_components/use-port-stays";
import { type DraftItem, dayUsage, firstFittingDay, immobilisation, whyNotOn } from "./package-draft";

/** Work not in the draft that the chief may put back: left out by the proposal, or taken out by hand. */
type Aside = PackageJob & { tier: Tier | null; message: string };

type Draft = { items: DraftItem[]; aside: Aside[]; proposal: ProposalView | null; changed: boolean };

export const TIER_WORDS: Record<Tier, string> = {
  "would-go-out-of-tolerance": "would go out of tolerance",
  "engine-stop": "needs the engine stopped",
  urgency: "by urgency",
};

function horizonWords(p: ProposalView, timeZone: string): string {
  const when = formatShipDate(new Date(p.horizon), timeZone);
  return p.nextStay
    ? `before the next port stay, ${p.nextStay.port}, on ${when}`
    : `within ${p.lookAheadDays} days of departure, to ${when} (no next port stay is planned)`;
}

const LINK = "text-tide-700 underline-offset-2 hover:underline dark:text-tide-300";

export function PackageEditor({ detail, over }: { detail: PortStayDetail; over: boolean }) {
  const { stay, vessel } = detail;
  const propose = usePropose(vessel.id, stay.id);
  const accept = useAcceptPackage(vessel.id, stay.id);
  const [draft, setDraft] = useState<Draft>({ items: detail.items, aside: [], proposal: null, changed: false });
  const [notice, setNotice] = useState<{ tone: "done" | "problem"; text: string } | null>(null);
  const [accepted, setAccepted] = useState(false);
  const editable = detail.may.plan && !over;
  const stop = immobilisation(stay, draft.items);

  async function onPropose() {
    setNotice(null);
    try {
      const p = await propose.mutateAsync();
      setDraft({ items: p.items, aside: p.leftOut, proposal: p, changed: true });
      setAccepted(false);
    } catch (error) {
      setNotice({ tone: "problem", text: problemSentence(error, "no proposal was made") });
    }
  }

  async function onAccept() {
    setNotice(null);
    try {
      const result = await accept.mutateAsync({
        items: draft.items.map((i) => ({ workOrderId: i.workOrderId, date: i.date, reason: i.reason })),
      });
      setDraft((d) => ({ ...d, proposal: null, changed: false }));
      setAccepted(true);
      setNotice({
        tone: "done",
        text: `Package accepted: ${result.items} job${result.items === 1 ? "" : "s"} planned on the stay’s days${
          result.cleared ? `; ${result.cleared} taken out lost their planned date` : ""
        }.`,
      });
    } catch (error) {
      const rows = error instanceof ProblemError ? (error.problem.errors ?? []) : [];
      const named = rows
        .map((e) => {
          const n = /^items\.(\d+)\./.exec(e.field);
          const item = n ? draft.items[Number(n[1])] : undefined;
          return item ? `${item.number}: ${e.message}` : e.message;
        })
        .join(" ");
      setNotice({ tone: "problem", text: named || problemSentence(error, "nothing was saved") });
    }
  }

  const move = (id: string, date: string) =>
    setDraft((d) => ({ ...d, changed: true, items: d.items.map((i) => (i.workOrderId === id ? { ...i, date } : i)) }));
  const takeOut = (item: DraftItem) =>
    setDraft((d) => ({
      ...d,
      changed: true,
      items: d.items.filter((i) => i.workOrderId !== item.workOrderId),
      aside: [{ ...item, message: "Taken out of the package by you." }, ...d.aside],
    }));
  const putBack = (job: Aside, date: string) =>
    setDraft((d) => ({
      ...d,
      changed: true,
      aside: d.aside.filter((a) => a.workOrderId !== job.workOrderId),
      items: [...d.items, { ...job, date, reason: job.message.startsWith("Taken out") ? "Added to the package by the chief engineer." : `Added by the chief engineer. ${job.message}`, tier: job.tier }],
    }));

  return (
    <section aria-labelledby="package-heading" className="grid gap-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h2 id="package-heading" className="text-lg font-semibold">
            Work package
          </h2>
          <p className="text-sm text-ink-600 dark:text-ink-300">
            {draft.proposal
              ? `Proposed from the open work orders that fall due ${horizonWords(draft.proposal, vessel.timeZone)}: first what would go out of tolerance, then engine-stop jobs, then by urgency and criticality. Move or take out jobs, then accept.`
              : detail.items.length
                ? "The accepted package. Propose again to start over from the Backlog as it is now."
                : "No package yet. Keelson proposes one from the open work orders, within the crew’s hours and the immobilisation allowed."}
          </p>
        </div>
        <div className="flex flex-wrap gap-2">
          {editable && (
            <button type="button" className="btn-quiet" onClick={onPropose} disabled={propose.isPending}>
              {propose.isPending ? "Proposing…" : "Propose work package"}
            </button>
          )}
          {editable && (draft.changed || draft.proposal) && (
            <button type="button" className="btn-primary" onClick={onAccept} disabled={accept.isPending}>
              {accept.isPending ? "Accepting…" : "Accept package"}
            </button>
          )}
          {detail.items.length > 0 && !draft.changed && (
            <Link href={`/vessels/${vessel.id}/port-stays/${stay.id}/sheet`} className="btn-quiet">
              Package sheet
            </Link>
          )}
        </div>
      </div>
      {notice && (
        <div className="grid gap-1">
          <Notice tone={notice.tone} message={notice.text} />
          {accepted && notice.tone === "done" && (
            <p className="flex gap-4 text-sm">
              <Link href={`/vessels/${vessel.id}/calendar`} className={LINK}>
                See it on the Calendar
              </Link>
              <Link href={`/vessels/${vessel.id}/port-stays/${stay.id}/sheet`} className={LINK}>
                Print the package sheet
              </Link>
            </p>
          )}
        </div>
      )}
      {over && <p className="text-sm text-ink-600 dark:text-ink-300">The stay is over: its package can no longer change.</p>}

      <div className="flex max-w-xl items-center gap-3 text-sm tabular-nums">
        <span className="shrink-0">
          <span className="font-semibold">Immobilisation:</span>{" "}
          {stay.engineMayStop
            ? `${formatHours(stop.used)} used of ${formatHours(stop.allowed)} allowed`
            : "not allowed in this stay"}
        </span>
        {stay.engineMayStop && <Meter used={stop.used} available={stop.allowed} label="Immobilisation used" />}
      </div>

      <div className="grid gap-3 lg:grid-cols-2">
        {stay.days.map((day) => (
          <DayCard key={day} day={day} detail={detail} draft={draft} editable={editable} onMove={move} onTakeOut={takeOut} />
        ))}
      </div>

      {draft.aside.length > 0 && (
        <section aria-labelledby="aside-heading" className="panel p-4">
          <h3 id="aside-heading" className="text-base font-semibold">
            Not in the package ({draft.aside.length})
          </h3>
          <ul className="mt-2 grid gap-3">
            {draft.aside.map((job) => {
              const day = firstFittingDay(stay, draft.items, job);
              return (
                <li key={job.workOrderId} className="grid gap-1 border-t border-ink-100 pt-2 first:border-0 first:pt-0 dark:border-ink-800">
                  <JobLine vesselId={vessel.id} job={job} tier={job.tier} />
                  <p className="text-sm text-ink-600 dark:text-ink-300">{job.message}</p>
                  {editable && (
                    <div>
                      <button
                        type="button"
                        className="btn-quiet text-xs"
                        disabled={day === null}
                        onClick={() => day && putBack(job, day)}
                      >
                        {day ? `Add on ${dayLabel(day)}` : "Does not fit in this stay"}
                        <span className="sr-only"> {job.number}</span>
                      </button>
                    </div>
                  )}
                </li>
              );
            })}
          </ul>
        </section>
      )}
    </section>
  );
}

function DayCard({
  day,
  detail,
  draft,
  editable,
  onMove,
  onTakeOut,
}: {
  day: string;
  detail: PortStayDetail;
  draft: Draft;
  editable: boolean;
  onMove: (id: string, date: string) => void;
  onTakeOut: (item: DraftItem) => void;
}) {
  const { stay, vessel } = detail;
  const items = draft.items.filter((i) => i.date === day);
  const id = `day-${day}`;
  return (
    <section aria-labelledby={id} data-day={day} className="panel p-4">
      <h3 id={id} className="flex items-baseline justify-between gap-2 text-base font-semibold">
        {dayLabel(day)}
        <span className="text-sm font-normal text-ink-500 tabular-nums dark:text-ink-400">
          {items.length} job{items.length === 1 ? "" : "s"} · {formatHours(items.reduce((h, i) => h + i.manHours, 0))}
        </span>
      </h3>
      <ul className="mt-2 grid gap-1 text-xs" aria-label={`Crew’s hours on ${dayLabel(day)}`}>
        {dayUsage(stay, draft.items, day).map((u) => (
          <li key={u.rank} className="grid grid-cols-[9rem_1fr_6rem] items-center gap-2 tabular-nums">
            <span>{rankLabel(u.rank)}</span>
            <Meter used={u.used} available={u.available} label={`${rankLabel(u.rank)} on ${dayLabel(day)}`} />
            <span className={u.used > u.available ? "font-semibold text-alarm-700 dark:text-alarm-300" : ""}>
              {formatHours(u.used)} / {formatHours(u.available)}
            </span>
          </li>
        ))}
      </ul>
      {items.length === 0 ? (
        <p className="mt-3 text-sm text-ink-500 dark:text-ink-400">No work planned on this day.</p>
      ) : (
        <ol className="mt-3 grid gap-3">
          {items.map((item) => (
            <li key={item.workOrderId} data-work-order={item.number} className="grid gap-1 border-t border-ink-100 pt-2 dark:border-ink-800">
              <JobLine vesselId={vessel.id} job={item} tier={item.tier} />
              <p className="text-sm text-ink-600 dark:text-ink-300">{item.reason}</p>
              {editable && (
                <div className="flex flex-wrap items-center gap-2">
                  <label className="text-xs" htmlFor={`move-${item.workOrderId}`}>
                    Day
                  </label>
                  <select
                    id={`move-${item.workOrderId}`}
                    className="field w-auto py-1 text-xs"
                    value={item.date}
                    onChange={(e) => onMove(item.workOrderId, e.target.value)}
                  >
                    {stay.days.map((d) => {
                      const why = d === item.date ? null : whyNotOn(stay, draft.items, item, d);
                      return (
                        <option key={d} value={d} disabled={why !== null}>
                          {dayLabel(d)}
                          {why ? ` — ${why}` : ""}
                        </option>
                      );
                    })}
                  </select>
                  <button type="button" className="btn-quiet py-1 text-xs" onClick={() => onTakeOut(item)}>
                    Take out<span className="sr-only"> {item.number}</span>
                  </button>
                </div>
              )}
            </li>
          ))}
        </ol>
      )}
    </section>
  );
}

function JobLine({ vesselId, job, tier }: { vesselId: string; job: PackageJob; tier: Tier | null }) {
  return (
    <div className="flex flex-wrap items-baseline gap-x-2 gap-y-1">
      <Link href={`/vessels/${vesselId}/work-orders/${job.workOrderId}`} className={`font-mono text-sm ${LINK}`}>
        {job.number}
      </Link>
      <span className="font-medium">{job.title}</span>
      <span className="text-sm text-ink-500 dark:text-ink-400">
        <span className="font-mono">{job.componentCode}</span> · {rankLabel(job.rank)} · {formatHours(job.manHours)}
        {job.needsEngineStop && " · engine stopped"}
        {job.critical && " · ⚠ critical"}
        {job.classRelated && " · ◆ class"}
      </span>
      {tier && (
        <span className="rounded border border-ink-300 px-1.5 text-xs text-ink-700 dark:border-ink-600 dark:text-ink-200">
          {TIER_WORDS[tier]}
        </span>
      )}
    </div>
  );
}

/** A bar of hours used against hours available; the figures beside it say the same in words. */
function Meter({ used, available, label }: { used: number; available: number; label: string }) {
  const share = available > 0 ? Math.min(1, used / available) : used > 0 ? 1 : 0;
  const full = used > available;
  return (
    <span
      role="meter"
      aria-label={label}
      aria-valuemin={0}
      aria-valuemax={available}
      aria-valuenow={used}
      className="inline-block h-2 w-full min-w-16 overflow-hidden rounded bg-ink-100 align-middle dark:bg-ink-800"
    >
      <span
        className={`block h-full ${full ? "bg-alarm-500" : share === 1 ? "bg-brass-500" : "bg-tide-500"}`}
        style={{ width: `${share * 100}%` }}
      />
    </span>
  );
}
