"use client";

import Link from "next/link";
import { useState } from "react";
import { LoadProblem, Notice } from "@/app/_components/notice";
import type { WorkOrderDetail } from "@/server/completions/contract";
import { amountText } from "@/server/parts/contract";
import { AttachmentsSection } from "./attachments-section";
import { Cautions } from "./cautions";
import { ComponentHistory } from "./component-history";
import { CompletionForm } from "./completion-form";
import { CompletionRecordView, DecisionForm } from "./completion-record";
import { DefectReport } from "./defect-report";
import { DeferralSection } from "./deferral-section";
import { MeasurementTrends } from "./measurement-trends";
import { useWorkOrder } from "./use-work-order";
import { WorkOrderSummary } from "./work-order-summary";

type Props = { vesselId: string; workOrderId: string };

export function WorkOrderView({ vesselId, workOrderId }: Props) {
  const query = useWorkOrder(vesselId, workOrderId);
  const [message, setMessage] = useState<string | null>(null);
  if (query.error) return <LoadProblem what="work order" error={query.error} />;
  if (!query.data) return <div className="h-96 animate-pulse panel" aria-busy="true" />;
  const detail = query.data;
  return (
    <div className="grid gap-4">
      <p className="no-print text-sm">
        <Link
          href={`/vessels/${vesselId}/backlog`}
          className="text-tide-700 underline-offset-2 hover:underline dark:text-tide-300"
        >
          ← Backlog
        </Link>
      </p>
      <WorkOrderSummary detail={detail} />
      {detail.routine && detail.routine.measurements.length > 0 && (
        <MeasurementTrends vesselId={vesselId} workOrderId={workOrderId} routineId={detail.routine.id} timeZone={detail.vessel.timeZone} />
      )}
      {detail.defect && <DefectReport defect={detail.defect} timeZone={detail.vessel.timeZone} />}
      <Cautions cautions={detail.routine?.cautions ?? []} />
      {(detail.routine?.spareParts || detail.partsOnBoard.length > 0) && (
        <section aria-labelledby="parts-heading" className="panel p-4">
          <h2 id="parts-heading" className="text-base font-semibold">
            Spare parts to have ready
          </h2>
          {detail.routine?.spareParts && <p className="mt-1 whitespace-pre-line">{detail.routine.spareParts}</p>}
          {detail.partsOnBoard.length > 0 && <PartsOnBoard detail={detail} />}
        </section>
      )}
      <Notice message={message} className="no-print" />
      <CompletionPart detail={detail} onMessage={setMessage} />
      {(detail.workOrder.state !== "done" || detail.deferrals.history.length > 0) && (
        <DeferralSection detail={detail} onMessage={setMessage} />
      )}
      <ComponentHistory detail={detail} />
    </div>
  );
}

/** What this user may do with the completion now: record it, read it, decide on it, or correct it. */
function CompletionPart({ detail, onMessage }: { detail: WorkOrderDetail; onMessage: (m: string) => void }) {
  const { completion, may } = detail;
  const counterName = detail.counter?.name ?? null;
  // Photos and documents sit with the record, above the chief's decision: they are part of the evidence.
  const attachments = (
    <AttachmentsSection vesselId={detail.vessel.id} workOrderId={detail.workOrder.id} timeZone={detail.vessel.timeZone} />
  );
  const record = completion && (
    <>
      <CompletionRecordView record={completion} timeZone={detail.vessel.timeZone} counterName={counterName} />
      {attachments}
    </>
  );
  if (!completion) {
    if (may.record) {
      return (
        <>
          <CompletionForm key="new" detail={detail} onDone={onMessage} />
          {attachments}
        </>
      );
    }
    return (
      <>
        <p className="panel p-4 text-ink-600 dark:text-ink-300">
          {detail.workOrder.state === "done"
            ? "This work order is done."
            : "No completion is recorded yet; engineers and the chief engineer record it here."}
        </p>
        {attachments}
      </>
    );
  }
  if (completion.status === "awaiting-approval") {
    return (
      <>
        {record}
        {may.approve ? (
          <DecisionForm vesselId={detail.vessel.id} workOrderId={detail.workOrder.id} onDecided={onMessage} closesDefect={detail.defect?.state === "done" ? detail.defect.number : null} />
        ) : (
          <p className="text-ink-600 dark:text-ink-300">
            The chief engineer approves it; until then it shows as awaiting approval.
          </p>
        )}
      </>
    );
  }
  if (completion.status === "returned" && may.record) {
    return (
      <>
        {record}
        <CompletionForm key={`resubmit-${completion.id}`} detail={detail} onDone={onMessage} />
      </>
    );
  }
  return record;
}

/** The parts the job needs and the catalogue's parts for this component, against what the vessel holds. */
function PartsOnBoard({ detail }: { detail: WorkOrderDetail }) {
  const short = detail.partsOnBoard.filter((p) => p.short > 0);
  return (
    <div className="mt-3">
      <p className="text-sm text-ink-600 dark:text-ink-300">
        What the routine needs, and the catalogue’s parts for {detail.component.code} and the machinery it belongs to,
        against what is on board (
        <Link href={`/vessels/${detail.vessel.id}/stores`} className="text-tide-700 underline underline-offset-2 dark:text-tide-300">
          Stores
        </Link>
        ).{" "}
        {short.length > 0 && (
          <strong className="text-alarm-700 dark:text-alarm-300">
            {short.length} part{short.length === 1 ? " is" : "s are"} short for this job.
          </strong>
        )}
      </p>
      <table className="mt-2 w-full max-w-3xl text-left text-sm">
        <thead>
          <tr className="text-ink-600 dark:text-ink-300">
            <th scope="col" className="py-1 pr-3 font-medium">Part</th>
            <th scope="col" className="py-1 pr-3 font-medium">For</th>
            <th scope="col" className="py-1 pr-3 text-right font-medium">Needed</th>
            <th scope="col" className="py-1 text-right font-medium">On board</th>
          </tr>
        </thead>
        <tbody>
          {detail.partsOnBoard.map((p) => (
            <tr key={p.id} className="border-t border-ink-100 align-top dark:border-ink-800">
              <th scope="row" className="py-1 pr-3 font-normal">
                <span className="font-mono">{p.number}</span> {p.description}
                {p.critical && <span className="ml-1 text-xs font-semibold text-brass-700 dark:text-brass-300">(critical spare)</span>}
              </th>
              <td className="py-1 pr-3 font-mono text-xs">{p.fits || "—"}</td>
              <td className="py-1 pr-3 text-right tabular-nums">{p.needed === null ? "—" : amountText(p.needed, p.unit)}</td>
              <td className={`py-1 text-right tabular-nums ${p.short > 0 || p.low ? "font-semibold text-alarm-700 dark:text-alarm-300" : ""}`}>
                {amountText(p.onBoard, p.unit)}
                {p.short > 0 ? (
                  <span className="block text-xs">{p.short} short</span>
                ) : (
                  p.low && <span className="block text-xs">{p.onBoard <= 0 ? "none on board" : `under the minimum of ${p.minimumOnBoard}`}</span>
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
