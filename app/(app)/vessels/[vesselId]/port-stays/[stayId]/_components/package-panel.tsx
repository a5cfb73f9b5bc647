"use client";
// The stay's work package: the accepted one (read-only until "Re-plan"), or the planner's proposal
// on the timeline, moved by hand and checked by the server after every change, then accepted.
import Link from "next/link";
import { useState } from "react";
import { problemSentence } from "@/app/_components/forms/form-problem";
import { Notice } from "@/app/_components/notice";
import type { PortStayDetail, ProposalView } from "@/server/port-stays/contract";
import { ENGINE_STOP_CAUTION } from "../../_components/stay-words";
import { useAcceptPackage, usePropose } from "../../_components/use-port-stays";
import { LeftOutList, PlacedList, ProposalFacts } from "./proposal-lists";
import { StayPartsPanel } from "./stay-parts-panel";
import { Timeline } from "./timeline";
import { usePackageDraft } from "./use-package-draft";

type Props = { detail: PortStayDetail; over: boolean };

export function PackagePanel({ detail, over }: Props) {
  const { stay, vessel } = detail;
  const propose = usePropose(vessel.id, stay.id);
  const accept = useAcceptPackage(vessel.id, stay.id);
  const draft = usePackageDraft(vessel.id, stay.id);
  const [proposal, setProposal] = useState<ProposalView | null>(null);
  const [notice, setNotice] = useState<string | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const canPlan = detail.may.plan && !over;

  async function runProposal() {
    setProblem(null);
    setNotice(null);
    try {
      const p = await propose.mutateAsync();
      draft.start(p);
      setProposal(p);
    } catch (error) {
      setProblem(problemSentence(error, "no package was proposed"));
    }
  }

  async function acceptDraft() {
    setProblem(null);
    try {
      const result = await accept.mutateAsync({ items: draft.inputs });
      setProposal(null);
      setNotice(`Package accepted: ${result.items} job${result.items === 1 ? "" : "s"} planned on this stay.`);
    } catch (error) {
      if (!draft.refused(error)) setProblem(problemSentence(error, "the package was not accepted"));
    }
  }

  if (stay.crew.every((c) => c.count === 0)) {
    return <p className="panel p-4">No crew is entered for this stay: edit the stay and list the crew on board before planning its work.</p>;
  }

  const caution = <p className="text-sm text-ink-700 dark:text-ink-200">⚠ {ENGINE_STOP_CAUTION}</p>;

  if (!proposal) {
    const accepted = detail.items;
    return (
      <section aria-labelledby="package-heading" className="grid gap-3">
        <div className="flex flex-wrap items-center justify-between gap-2">
          <h2 id="package-heading" className="text-lg font-semibold">
            {accepted.length ? "Accepted work package" : "Work package"}
          </h2>
          <div className="flex flex-wrap gap-2">
            {accepted.length > 0 && (
              <Link href={`/vessels/${vessel.id}/port-stays/${stay.id}/sheet`} className="btn-quiet">
                Package sheet
              </Link>
            )}
            {(accepted.length > 0 || canPlan) && (
              <a href={`/api/vessels/${vessel.id}/port-stays/${stay.id}/package/pdf`} className="btn-quiet" download>
                {accepted.length > 0 ? "Work package (PDF)" : "Proposal (PDF)"}
              </a>
            )}
            {canPlan && (
              <button type="button" className="btn-primary" disabled={propose.isPending} onClick={runProposal}>
                {propose.isPending ? "Proposing…" : accepted.length ? "Re-plan" : "Propose a package"}
              </button>
            )}
          </div>
        </div>
        <Notice message={notice} />
        <Notice tone="problem" message={problem} />
        {accepted.length === 0 ? (
          <p className="panel p-4 text-ink-600 dark:text-ink-300">
            {canPlan ? "No package yet: have Keelson propose one from the due work, then shape it on the timeline." : "No package was accepted for this stay."}
          </p>
        ) : (
          <>
            <Timeline stay={stay} timeZone={vessel.timeZone} label="The accepted package on the stay’s timeline" jobs={accepted.map((job) => ({ job, wanted: job.startLocal }))} />
            {caution}
            <PlacedList entries={accepted.map((p) => ({ input: { workOrderId: p.workOrderId, start: p.startLocal }, job: p, placed: p }))} problems={new Map()} />
            <StayPartsPanel vesselId={vessel.id} stayId={stay.id} port={stay.port} jobs={null} canRequest={detail.may.plan && !over} />
          </>
        )}
      </section>
    );
  }

  const byItem = new Map(draft.problems.map((p) => [p.item, p.message]));
  const jobs = draft.entries.flatMap((e, i) => (e.placed ? [{ job: e.placed, wanted: e.input.start, problem: byItem.get(i) }] : []));
  return (
    <section aria-labelledby="package-heading" className="grid gap-4">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 id="package-heading" className="text-lg font-semibold">
          Proposed package
        </h2>
        <div className="flex flex-wrap gap-2">
          <button type="button" className="btn-quiet" onClick={() => setProposal(null)}>
            Discard
          </button>
          <button
            type="button"
            className="btn-primary"
            disabled={accept.isPending || draft.checking || draft.problems.length > 0 || draft.entries.length === 0}
            onClick={acceptDraft}
          >
            {accept.isPending ? "Accepting…" : "Accept package"}
          </button>
        </div>
      </div>
      <p className="text-sm text-ink-700 dark:text-ink-200">
        Drag a job along its lane, or focus it and move it with the arrow keys (Shift: an hour; Page Up/Down: a day); each move is checked against the working day,
        the engine stop, the watches and who is free.
      </p>
      <p aria-live="polite" className="min-h-5 text-sm font-medium" data-draft-status={draft.checking ? "checking" : "checked"}>
        {draft.said}
      </p>
      <Notice tone="problem" message={problem} />
      {draft.entries.length === 0 ? (
        <p className="panel p-4">No job can be placed in this stay: see what was left out, and why, below.</p>
      ) : (
        <Timeline stay={stay} timeZone={vessel.timeZone} label="The proposed package on the stay’s timeline" jobs={jobs} slotMinutes={proposal.slotMinutes} onMove={draft.move} onMoveTo={draft.moveTo} />
      )}
      {caution}
      <PlacedList entries={draft.entries} problems={byItem} onRemove={draft.remove} />
      <StayPartsPanel vesselId={vessel.id} stayId={stay.id} port={stay.port} jobs={draft.entries.map((e) => e.input.workOrderId)} canRequest={canPlan} />
      <LeftOutList stay={stay} outside={draft.outside} slotMinutes={proposal.slotMinutes} onAdd={draft.add} />
      <ProposalFacts proposal={proposal} crew={stay.crew} />
    </section>
  );
}
