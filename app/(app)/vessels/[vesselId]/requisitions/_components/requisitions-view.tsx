"use client";
// The vessel's requisitions: parts asked of the office for delivery at a port stay. The chief
// engineer drafts and sends them; the office orders them; on board they are received line by line
// into the stores, and a requisition received in full is delivered.
import { useSearchParams } from "next/navigation";
import { useState } from "react";
import { FormActions } from "@/app/_components/forms/form-actions";
import { problemSentence } from "@/app/_components/forms/form-problem";
import { SidePanel } from "@/app/_components/forms/side-panel";
import { LoadProblem, Notice } from "@/app/_components/notice";
import { formatShipTime, shipDay } from "@/server/format/hours";
import { amountText, type RequisitionView } from "@/server/parts/contract";
import { STATE_WORDS } from "@/server/parts/requisition-rules";
import { ReceiptForm } from "./receipt-form";
import { RequisitionForm } from "./requisition-form";
import { useMoveRequisition, useRequisitions } from "./use-requisitions";

type Panel = { kind: "new" } | { kind: "edit" | "receive" | "order"; requisition: RequisitionView } | null;

export const STATE_TONE: Record<RequisitionView["state"], string> = {
  drafted: "border-ink-300 text-ink-700 dark:text-ink-200",
  sent: "border-tide-400 text-tide-700 dark:text-tide-300",
  ordered: "border-brass-400 text-brass-700 dark:text-brass-300",
  delivered: "border-ink-200 text-ink-500",
  cancelled: "border-ink-200 text-ink-500 line-through",
};

export function StateBadge({ state }: { state: RequisitionView["state"] }) {
  return <span className={`rounded border px-1.5 py-0.5 text-xs font-semibold ${STATE_TONE[state]}`}>{STATE_WORDS[state]}</span>;
}

export function RequisitionsView({ vesselId }: { vesselId: string }) {
  const { data, error, isPending } = useRequisitions(vesselId);
  const [panel, setPanel] = useState<Panel>(null);
  const [notice, setNotice] = useState<string | null>(null);
  const [showClosed, setShowClosed] = useState(false);
  const highlighted = useSearchParams().get("show");
  if (isPending) return <div className="h-64 animate-pulse panel" aria-busy="true" aria-label="Loading the requisitions" />;
  if (error) return <LoadProblem what="requisitions" error={error} />;
  const done = (message: string) => {
    setPanel(null);
    setNotice(message);
  };
  const open = data.requisitions.filter((r) => r.state !== "delivered" && r.state !== "cancelled");
  const closed = data.requisitions.filter((r) => !open.includes(r));
  const shown = showClosed ? data.requisitions : open;

  return (
    <div className="grid gap-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-xl font-bold">Requisitions</h1>
          <p className="max-w-prose text-ink-600 dark:text-ink-300">
            Parts {data.vessel.name} asks of the office, for delivery at a port stay. The chief engineer drafts and sends them (a port stay’s page drafts one from
            its shortfalls); the office orders them; what arrives is received here into the stores.
          </p>
        </div>
        {data.canDraft && (
          <button type="button" className="btn-primary" onClick={() => setPanel({ kind: "new" })}>
            New requisition
          </button>
        )}
      </div>
      <Notice message={notice} />
      <div className="flex flex-wrap items-center gap-3 text-sm">
        <span>
          {open.length} open{closed.length ? `, ${closed.length} delivered or cancelled` : ""}
        </span>
        {closed.length > 0 && (
          <label className="flex items-center gap-2">
            <input type="checkbox" className="accent-tide-600" checked={showClosed} onChange={(e) => setShowClosed(e.target.checked)} />
            Show delivered and cancelled
          </label>
        )}
      </div>
      {shown.length === 0 ? (
        <p className="panel p-4 text-ink-600 dark:text-ink-300">
          {data.requisitions.length ? "No requisition is open." : "No requisition yet."}{" "}
          {data.canDraft ? "Draft one here, or from a port stay’s parts." : ""}
        </p>
      ) : (
        shown.map((r) => <RequisitionCard key={r.id} requisition={r} vesselId={vesselId} timeZone={data.vessel.timeZone} highlighted={r.number === highlighted} onPanel={setPanel} onNotice={setNotice} />)
      )}
      {panel?.kind === "new" && (
        <SidePanel title="New requisition" onClose={() => setPanel(null)} wide>
          <RequisitionForm vesselId={vesselId} list={data} onDone={done} onCancel={() => setPanel(null)} />
        </SidePanel>
      )}
      {panel?.kind === "edit" && (
        <SidePanel title={`Change ${panel.requisition.number}`} onClose={() => setPanel(null)} wide>
          <RequisitionForm vesselId={vesselId} list={data} requisition={panel.requisition} onDone={done} onCancel={() => setPanel(null)} />
        </SidePanel>
      )}
      {panel?.kind === "receive" && (
        <SidePanel title={`Receive ${panel.requisition.number}`} subtitle="Into the stores, line by line" onClose={() => setPanel(null)} wide>
          <ReceiptForm vesselId={vesselId} requisition={panel.requisition} locations={data.locations} onDone={done} onCancel={() => setPanel(null)} />
        </SidePanel>
      )}
      {panel?.kind === "order" && (
        <SidePanel title={`Order ${panel.requisition.number}`} onClose={() => setPanel(null)}>
          <OrderForm vesselId={vesselId} requisition={panel.requisition} onDone={done} onCancel={() => setPanel(null)} />
        </SidePanel>
      )}
    </div>
  );
}

type CardProps = {
  requisition: RequisitionView;
  vesselId: string;
  timeZone: string;
  highlighted: boolean;
  onPanel: (panel: Panel) => void;
  onNotice: (message: string) => void;
};

function RequisitionCard({ requisition: r, vesselId, timeZone, highlighted, onPanel, onNotice }: CardProps) {
  const move = useMoveRequisition(vesselId, r.id);
  const [problem, setProblem] = useState<string | null>(null);
  const headingId = `req-${r.id}`;
  async function moveTo(to: "sent" | "cancelled") {
    setProblem(null);
    try {
      await move.mutateAsync({ to });
      onNotice(to === "sent" ? `${r.number} sent to the office.` : `${r.number} cancelled.`);
    } catch (error) {
      setProblem(problemSentence(error, "nothing changed"));
    }
  }
  const when = (iso: string | null) => (iso ? shipDay(new Date(iso), timeZone) : null);
  const steps = [
    ["drafted", when(r.createdAt)],
    ["sent", when(r.sentAt)],
    ["ordered", when(r.orderedAt)],
    ["delivered", when(r.deliveredAt)],
  ] as const;
  return (
    <section aria-labelledby={headingId} className={`panel p-4 ${highlighted ? "ring-2 ring-tide-500" : ""}`} data-requisition={r.number}>
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <h2 id={headingId} className="flex flex-wrap items-center gap-2 font-semibold">
            <span className="font-mono">{r.number}</span> <StateBadge state={r.state} />
          </h2>
          <p className="text-sm text-ink-600 dark:text-ink-300">
            {r.portStay ? `Deliver at ${r.portStay.port}, arriving ${formatShipTime(new Date(r.portStay.arrivesAt), timeZone)}` : "No port stay named"}
            {r.orderRef && ` · office order ${r.orderRef}`}
            {r.createdBy && ` · drafted by ${r.createdBy}`}
          </p>
          <ol className="mt-1 flex flex-wrap gap-x-3 text-xs text-ink-500" aria-label="Its steps">
            {steps.map(([step, day]) => (
              <li key={step} className={day ? "text-ink-700 dark:text-ink-200" : ""}>
                {day ? "●" : "○"} {step} {day ?? ""}
              </li>
            ))}
          </ol>
        </div>
        <div className="no-print flex flex-wrap gap-2">
          {r.may.edit && (
            <button type="button" className="btn-quiet" onClick={() => onPanel({ kind: "edit", requisition: r })}>
              Change<span className="sr-only"> {r.number}</span>
            </button>
          )}
          {r.may.send && (
            <button type="button" className="btn-primary" disabled={move.isPending} onClick={() => moveTo("sent")}>
              Send to the office<span className="sr-only"> ({r.number})</span>
            </button>
          )}
          {r.may.order && (
            <button type="button" className="btn-primary" onClick={() => onPanel({ kind: "order", requisition: r })}>
              Mark ordered<span className="sr-only"> ({r.number})</span>
            </button>
          )}
          {r.may.receive && (
            <button type="button" className="btn-primary" onClick={() => onPanel({ kind: "receive", requisition: r })}>
              Receive parts<span className="sr-only"> of {r.number}</span>
            </button>
          )}
          {r.may.cancel && (
            <button type="button" className="btn-quiet" disabled={move.isPending} onClick={() => moveTo("cancelled")}>
              Cancel<span className="sr-only"> {r.number}</span>
            </button>
          )}
        </div>
      </div>
      <Notice tone="problem" message={problem} />
      <table className="mt-3 w-full text-sm">
        <caption className="sr-only">Parts asked for on {r.number}</caption>
        <thead className="text-left text-xs text-ink-500 uppercase">
          <tr>
            <th className="pr-3 font-semibold">Part number</th>
            <th className="pr-3 font-semibold">Part</th>
            <th className="pr-3 text-right font-semibold">Asked</th>
            <th className="pr-3 text-right font-semibold">Received</th>
            <th className="font-semibold">Why</th>
          </tr>
        </thead>
        <tbody>
          {r.lines.map((l) => (
            <tr key={l.id} className="border-t border-ink-100 align-top dark:border-ink-800">
              <td className="pr-3 font-mono whitespace-nowrap">{l.number}</td>
              <td className="pr-3">{l.description}</td>
              <td className="pr-3 text-right whitespace-nowrap tabular-nums">{amountText(l.quantity, l.unit)}</td>
              <td className={`pr-3 text-right whitespace-nowrap tabular-nums ${l.received > 0 && l.received < l.quantity ? "font-semibold text-brass-700 dark:text-brass-300" : ""}`}>
                {l.received > 0 ? amountText(l.received, l.unit) : "—"}
              </td>
              <td className="text-ink-600 dark:text-ink-300">{l.reason}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {r.note && <p className="mt-2 text-sm whitespace-pre-line">{r.note}</p>}
    </section>
  );
}

function OrderForm({ vesselId, requisition, onDone, onCancel }: { vesselId: string; requisition: RequisitionView; onDone: (m: string) => void; onCancel: () => void }) {
  const move = useMoveRequisition(vesselId, requisition.id);
  const [orderRef, setOrderRef] = useState("");
  const [problem, setProblem] = useState<string | null>(null);
  async function submit(event: React.FormEvent) {
    event.preventDefault();
    setProblem(null);
    try {
      await move.mutateAsync({ to: "ordered", orderRef });
      onDone(`${requisition.number} ordered${orderRef ? ` (${orderRef})` : ""}.`);
    } catch (error) {
      setProblem(problemSentence(error, "it was not marked ordered"));
    }
  }
  return (
    <form onSubmit={submit} className="grid gap-4" noValidate>
      <p>
        {requisition.vessel.name} asks for {requisition.lines.length} part{requisition.lines.length === 1 ? "" : "s"}
        {requisition.portStay ? `, to be delivered at ${requisition.portStay.port}` : ""}.
      </p>
      <label className="grid gap-1">
        <span className="label">Your order reference (optional)</span>
        <input className="field" maxLength={60} value={orderRef} onChange={(e) => setOrderRef(e.target.value)} placeholder="e.g. PO-7781" autoComplete="off" />
      </label>
      <FormActions submitLabel="Mark ordered" busy={move.isPending} problem={problem} onCancel={onCancel} />
    </form>
  );
}

