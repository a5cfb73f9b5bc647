"use client";
import { useRankWords } from "@/app/_components/rank-words-provider";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { problemSentence } from "@/app/_components/forms/form-problem";
import { SidePanel } from "@/app/_components/forms/side-panel";
import { LoadProblem, Notice } from "@/app/_components/notice";
import { formatShipTime } from "@/server/format/hours";
import type { PortStayDetail } from "@/server/port-stays/contract";
import { StayForm } from "../../_components/stay-form";
import { crewWords, engineStopWords, personLabel, shipClockLabel, stayPeriod } from "../../_components/stay-words";
import { useDeleteStay, usePortStay } from "../../_components/use-port-stays";
import { PackagePanel } from "./package-panel";

type Props = { vesselId: string; stayId: string };

const LINK = "text-tide-700 underline-offset-2 hover:underline dark:text-tide-300";

export function StayView({ vesselId, stayId }: Props) {
  const ranks = useRankWords();
  const query = usePortStay(vesselId, stayId);
  const [open, setOpen] = useState<"edit" | "delete" | null>(null);
  const [notice, setNotice] = useState<string | null>(null);
  if (query.error) return <LoadProblem what="port stay" error={query.error} />;
  if (!query.data) return <div className="h-96 animate-pulse panel" aria-busy="true" aria-label="Loading the port stay" />;
  const detail = query.data;
  const { stay, vessel } = detail;
  const over = new Date(stay.departsAt) <= new Date(detail.now);

  return (
    <div className="grid gap-4">
      <p className="flex flex-wrap gap-4 text-sm">
        <Link href={`/vessels/${vesselId}/port-stays`} className={LINK}>
          ← Port stays
        </Link>
        <Link href={`/vessels/${vesselId}/calendar`} className={LINK}>
          Calendar
        </Link>
      </p>
      <header className="panel p-4">
        <div className="flex flex-wrap items-start justify-between gap-3">
          <div>
            <h1 className="text-xl font-bold text-ink-900 dark:text-ink-50">{stay.port}</h1>
            <p className="text-ink-600 tabular-nums dark:text-ink-300">
              {stayPeriod(stay.arrivesAt, stay.departsAt, vessel.timeZone)} ship’s time ({vessel.timeZone}) ·{" "}
              {stay.days.length} day{stay.days.length === 1 ? "" : "s"}
              {over && " · over"}
            </p>
          </div>
          {detail.may.plan && (
            <div className="flex gap-2">
              <button type="button" className="btn-quiet" onClick={() => setOpen("edit")}>
                Edit stay
              </button>
              <button type="button" className="btn-quiet" onClick={() => setOpen("delete")}>
                Delete
              </button>
            </div>
          )}
        </div>
        <dl className="mt-4 grid gap-x-6 gap-y-3 text-sm sm:grid-cols-3">
          <Fact label="Working day">
            {stay.workdayFrom}–{stay.workdayTo} on each of {stay.days.length} day{stay.days.length === 1 ? "" : "s"}
          </Fact>
          <Fact label="Main engine">{engineStopWords(stay.engineStop)}</Fact>
          <Fact label="Crew on board">{crewWords(stay.crew, ranks)}</Fact>
          <Fact label="Port watches">
            {stay.watches.length === 0
              ? "none"
              : stay.watches.map((w, i) => (
                  <span key={i} className="block">
                    {personLabel(`${w.rank}#${w.person}`, ranks, stay.crew)}: {w.label}, {shipClockLabel(w.fromLocal)} – {shipClockLabel(w.toLocal)}
                  </span>
                ))}
          </Fact>
          <Fact label="Work package">
            {stay.packageAcceptedAt
              ? `accepted ${formatShipTime(new Date(stay.packageAcceptedAt), vessel.timeZone)}${stay.packageAcceptedBy ? ` by ${stay.packageAcceptedBy}` : ""}, ${stay.itemCount} job${stay.itemCount === 1 ? "" : "s"}`
              : "not accepted yet"}
          </Fact>
        </dl>
        {stay.remarks && <p className="mt-3 max-w-prose whitespace-pre-line">{stay.remarks}</p>}
      </header>
      <Notice message={notice} />
      <PackagePanel detail={detail} over={over} />

      {open === "edit" && (
        <SidePanel title={`Edit ${stay.port}`} onClose={() => setOpen(null)} wide>
          <StayForm
            vesselId={vesselId}
            timeZone={vessel.timeZone}
            stay={stay}
            latest={null}
            onDone={(message) => {
              setOpen(null);
              setNotice(message);
            }}
          />
        </SidePanel>
      )}
      {open === "delete" && <DeletePanel detail={detail} onClose={() => setOpen(null)} />}
    </div>
  );
}

function DeletePanel({ detail, onClose }: { detail: PortStayDetail; onClose: () => void }) {
  const { stay, vessel } = detail;
  const remove = useDeleteStay(vessel.id);
  const router = useRouter();
  const [problem, setProblem] = useState<string | null>(null);
  const withPackage = stay.itemCount > 0;
  async function confirm() {
    setProblem(null);
    try {
      await remove.mutateAsync({ id: stay.id, releasePackage: withPackage });
      router.push(`/vessels/${vessel.id}/port-stays`);
    } catch (error) {
      setProblem(problemSentence(error, "the stay was not deleted"));
    }
  }
  return (
    <SidePanel title={`Delete ${stay.port}?`} onClose={onClose}>
      <div className="grid gap-3">
        {withPackage ? (
          <p>
            Its accepted work package of {stay.itemCount} job{stay.itemCount === 1 ? "" : "s"} goes with it: those work
            orders lose the planned dates this stay gave them and come back to the Backlog unplanned. Their due dates do
            not change.
          </p>
        ) : (
          <p>The stay and its crew table are deleted. No work is planned on it.</p>
        )}
        <Notice tone="problem" message={problem} />
        <div className="flex gap-2">
          <button
            type="button"
            className="btn bg-alarm-600 text-white hover:bg-alarm-700 dark:bg-alarm-500 dark:hover:bg-alarm-600"
            disabled={remove.isPending}
            onClick={confirm}
          >
            {remove.isPending ? "Deleting…" : withPackage ? "Delete stay and its package" : "Delete stay"}
          </button>
          <button type="button" className="btn-quiet" onClick={onClose}>
            Cancel
          </button>
        </div>
      </div>
    </SidePanel>
  );
}

function Fact({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div>
      <dt className="text-xs font-semibold tracking-wide text-ink-500 uppercase dark:text-ink-400">{label}</dt>
      <dd>{children}</dd>
    </div>
  );
}
