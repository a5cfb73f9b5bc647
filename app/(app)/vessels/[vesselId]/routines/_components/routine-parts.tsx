"use client";
// The parts a routine needs each time it is done, chosen from the company's catalogue with their
// quantities; the work order then shows them against what is on board.
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { fetchJson } from "@/app/_components/fetch-json";
import { FormActions } from "@/app/_components/forms/form-actions";
import { problemSentence } from "@/app/_components/forms/form-problem";
import { LoadProblem } from "@/app/_components/notice";
import { queryKeys } from "@/app/_components/query-keys";
import type { PartUnit } from "@/db/schema/parts";
import { type Catalogue, UNIT_LABEL } from "@/server/parts/contract";
import type { RoutineSummary } from "@/server/routines/contract";

type Row = { partId: string; quantity: string };
type Saved = { parts: { partId: string; number: string; description: string; unit: PartUnit; quantity: number }[] };
type Props = { vesselId: string; routine: RoutineSummary; onDone: (m: string) => void; onCancel: () => void };

export function RoutineParts({ vesselId, routine, onDone, onCancel }: Props) {
  const path = `/api/vessels/${vesselId}/routines/${routine.id}/parts`;
  const saved = useQuery({ queryKey: [...queryKeys.routine(vesselId, routine.id), "parts"], queryFn: () => fetchJson<Saved>(path) });
  const catalogue = useQuery({ queryKey: queryKeys.parts(), queryFn: () => fetchJson<Catalogue>("/api/parts") });
  if (saved.error) return <LoadProblem what="routine’s parts" error={saved.error} />;
  if (catalogue.error) return <LoadProblem what="parts catalogue" error={catalogue.error} />;
  if (!saved.data || !catalogue.data) return <p aria-busy="true">Loading the parts…</p>;
  return <PartsEditor path={path} vesselId={vesselId} routine={routine} initial={saved.data} catalogue={catalogue.data} onDone={onDone} onCancel={onCancel} />;
}

function PartsEditor({ path, vesselId, routine, initial, catalogue, onDone, onCancel }: Omit<Props, never> & { path: string; initial: Saved; catalogue: Catalogue }) {
  const client = useQueryClient();
  const [rows, setRows] = useState<Row[]>(initial.parts.map((p) => ({ partId: p.partId, quantity: String(p.quantity) })));
  const [problem, setProblem] = useState<string | null>(null);
  const [rowErrors, setRowErrors] = useState<Record<string, string>>({});
  const save = useMutation({
    mutationFn: () => fetchJson<unknown>(path, { method: "PUT", body: JSON.stringify({ parts: rows.filter((r) => r.partId).map((r) => ({ partId: r.partId, quantity: r.quantity })) }) }),
    onSuccess: () => client.invalidateQueries({ queryKey: queryKeys.routine(vesselId, routine.id) }),
  });
  const set = (i: number, change: Partial<Row>) => setRows((all) => all.map((r, j) => (j === i ? { ...r, ...change } : r)));
  const unitOf = (id: string) => catalogue.parts.find((p) => p.id === id)?.unit;

  async function submit(event: React.FormEvent) {
    event.preventDefault();
    setProblem(null);
    setRowErrors({});
    try {
      await save.mutateAsync();
      const n = rows.filter((r) => r.partId).length;
      onDone(n ? `${routine.title} needs ${n} part${n === 1 ? "" : "s"} each time; its work orders show them against what is on board.` : `${routine.title} names no parts now.`);
    } catch (error) {
      const errors = (error as { problem?: { errors?: { field: string; message: string }[] } }).problem?.errors ?? [];
      setRowErrors(Object.fromEntries(errors.map((e) => [e.field, e.message])));
      // A row's own message stands beside the row; above the buttons, what happened.
      setProblem(errors.some((e) => e.field.startsWith("parts.")) ? "Nothing was saved: correct the rows marked." : problemSentence(error, "nothing was saved"));
    }
  }

  return (
    <form onSubmit={submit} noValidate className="grid gap-4">
      <p className="text-sm text-ink-600 dark:text-ink-300">
        What the job takes each time: parts renewed, used once (bolts with locking compound, seals, O-rings) or consumed.
        {!catalogue.parts.length && " The company’s catalogue is empty: add parts under Parts first."}
      </p>
      {rows.length === 0 && <p className="text-sm">No parts yet.</p>}
      <ul className="grid gap-3">
        {rows.map((r, i) => {
          const unit = unitOf(r.partId);
          const partError = rowErrors[`parts.${i}.partId`];
          const quantityError = rowErrors[`parts.${i}.quantity`];
          return (
            <li key={i} className="grid gap-1">
              <div className="flex flex-wrap items-end gap-2">
                <div className="min-w-0 flex-1">
                  <label htmlFor={`routine-part-${i}`} className="label">
                    Part {i + 1}
                  </label>
                  <select id={`routine-part-${i}`} className="field" value={r.partId} aria-invalid={partError ? true : undefined} onChange={(e) => set(i, { partId: e.target.value })}>
                    <option value="">Choose a part…</option>
                    {catalogue.parts.map((p) => (
                      <option key={p.id} value={p.id}>
                        {p.number} — {p.description}
                      </option>
                    ))}
                  </select>
                </div>
                <div>
                  <label htmlFor={`routine-part-qty-${i}`} className="label">
                    Quantity{unit ? ` (${UNIT_LABEL[unit]})` : ""}
                  </label>
                  <input id={`routine-part-qty-${i}`} className="field w-24 text-right tabular-nums" inputMode="decimal" autoComplete="off" value={r.quantity} aria-invalid={quantityError ? true : undefined} onChange={(e) => set(i, { quantity: e.target.value })} />
                </div>
                <button type="button" className="btn-quiet" aria-label={`Remove part ${i + 1}`} onClick={() => setRows((all) => all.filter((_, j) => j !== i))}>
                  Remove
                </button>
              </div>
              {(partError || quantityError) && <p className="field-error">{partError ?? quantityError}</p>}
            </li>
          );
        })}
      </ul>
      <div>
        <button type="button" className="btn-quiet" onClick={() => setRows((all) => [...all, { partId: "", quantity: "1" }])} disabled={rows.length >= 100}>
          Add a part
        </button>
      </div>
      <FormActions submitLabel="Save parts" busy={save.isPending} problem={problem} onCancel={onCancel} />
    </form>
  );
}
