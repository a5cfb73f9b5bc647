"use client";
// Parts delivered against a requisition, received into the stores line by line: what came now and
// where it is kept. Received in full (or closed with what came), the requisition is delivered.
import { useState } from "react";
import { ProblemError } from "@/app/_components/fetch-json";
import { FormActions } from "@/app/_components/forms/form-actions";
import { problemSentence } from "@/app/_components/forms/form-problem";
import { type RequisitionView, UNIT_LABEL } from "@/server/parts/contract";
import { useReceiveRequisition } from "./use-requisitions";

type Props = {
  vesselId: string;
  requisition: RequisitionView;
  locations: { id: string; place: string }[];
  onDone: (message: string) => void;
  onCancel: () => void;
};

export function ReceiptForm({ vesselId, requisition, locations, onDone, onCancel }: Props) {
  const receive = useReceiveRequisition(vesselId, requisition.id);
  // What is still to come on each line is the likeliest delivery.
  const [rows, setRows] = useState(() =>
    requisition.lines.map((l) => ({ lineId: l.id, quantity: String(Math.max(0, Math.round((l.quantity - l.received) * 1000) / 1000) || ""), locationId: locations[0]?.id ?? "" })),
  );
  const [complete, setComplete] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const [rowErrors, setRowErrors] = useState<Map<number, string>>(new Map());

  if (!locations.length) {
    return <p>Add a store location on the Stores tab first: received parts are kept somewhere on board.</p>;
  }
  const set = (i: number, change: Partial<(typeof rows)[number]>) => setRows((all) => all.map((r, j) => (j === i ? { ...r, ...change } : r)));

  async function submit(event: React.FormEvent) {
    event.preventDefault();
    setProblem(null);
    setRowErrors(new Map());
    // Only the lines with a quantity are sent; the server's row numbers are mapped back to them.
    const sent = rows.map((r, i) => ({ ...r, i })).filter((r) => r.quantity.trim() !== "");
    try {
      const result = await receive.mutateAsync({ items: sent.map(({ lineId, locationId, quantity }) => ({ lineId, locationId, quantity })), complete });
      onDone(result.state === "delivered" ? `${requisition.number} delivered: the parts are in the stores.` : `Received into the stores; ${requisition.number} still waits for the rest.`);
    } catch (error) {
      if (error instanceof ProblemError && error.problem.errors?.length) {
        const byRow = new Map<number, string>();
        for (const e of error.problem.errors) {
          const m = /^items\.(\d+)\./.exec(e.field);
          if (m) byRow.set(sent[Number(m[1])]!.i, e.message);
        }
        setRowErrors(byRow);
      }
      setProblem(problemSentence(error, "nothing was received"));
    }
  }

  return (
    <form onSubmit={submit} noValidate className="grid gap-4">
      <table className="w-full text-sm">
        <caption className="sr-only">What came, line by line</caption>
        <thead className="text-left text-xs text-ink-500 uppercase">
          <tr>
            <th className="pr-2 font-semibold">Part</th>
            <th className="pr-2 text-right font-semibold">Asked / received</th>
            <th className="pr-2 font-semibold">Received now</th>
            <th className="font-semibold">Kept at</th>
          </tr>
        </thead>
        <tbody>
          {requisition.lines.map((l, i) => (
            <tr key={l.id} className="border-t border-ink-100 align-top dark:border-ink-800">
              <td className="py-1 pr-2">
                <span className="font-mono">{l.number}</span> {l.description}
                {rowErrors.get(i) && <p className="field-error">{rowErrors.get(i)}</p>}
              </td>
              <td className="py-1 pr-2 text-right whitespace-nowrap tabular-nums">
                {l.quantity} / {l.received} {UNIT_LABEL[l.unit]}
              </td>
              <td className="py-1 pr-2">
                <input
                  aria-label={`Received now of ${l.number}`}
                  className="field w-24 text-right tabular-nums"
                  inputMode="decimal"
                  autoComplete="off"
                  aria-invalid={rowErrors.has(i) ? true : undefined}
                  value={rows[i]!.quantity}
                  onChange={(e) => set(i, { quantity: e.target.value })}
                />
              </td>
              <td className="py-1">
                <select aria-label={`Where ${l.number} is kept`} className="field" value={rows[i]!.locationId} onChange={(e) => set(i, { locationId: e.target.value })}>
                  {locations.map((loc) => (
                    <option key={loc.id} value={loc.id}>
                      {loc.place}
                    </option>
                  ))}
                </select>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="text-sm text-ink-600 dark:text-ink-300">Leave a line empty if nothing of it came. Each quantity received is a movement into the stores.</p>
      <label className="flex items-center gap-2">
        <input type="checkbox" className="accent-tide-600" checked={complete} onChange={(e) => setComplete(e.target.checked)} />
        Nothing more will come: close it as delivered with what was received
      </label>
      <FormActions submitLabel="Receive into the stores" busyLabel="Receiving…" busy={receive.isPending} problem={problem} onCancel={onCancel} />
    </form>
  );
}
