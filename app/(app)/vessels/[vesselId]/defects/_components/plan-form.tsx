"use client";
// The chief engineer plans a defect's repair: the target day, the rank who does it, the man-hours
// and the parts it needs (counted against the stores when the stay's parts are counted).
import { useState } from "react";
import { ProblemError } from "@/app/_components/fetch-json";
import { Field } from "@/app/_components/forms/field";
import { FormActions } from "@/app/_components/forms/form-actions";
import { problemSentence } from "@/app/_components/forms/form-problem";
import { LoadProblem } from "@/app/_components/notice";
import { useRankWords } from "@/app/_components/rank-words-provider";
import type { DefectView } from "@/server/defects/contract";
import { UNIT_LABEL } from "@/server/parts/contract";
import { RANKS } from "@/server/routines/contract";
import { useCatalogue } from "../../stores/_components/use-stores";
import { usePlanDefect } from "./use-defects";
import { formatDayKey } from "@/server/format/dates";

type Props = { vesselId: string; defect: DefectView; today: string; onDone: (message: string) => void; onCancel: () => void };

export function PlanForm({ vesselId, defect, today, onDone, onCancel }: Props) {
  const plan = usePlanDefect(vesselId, defect.id);
  const catalogue = useCatalogue();
  const { label: rankLabel } = useRankWords();
  const [targetDay, setTargetDay] = useState(defect.targetDay ?? today);
  const [rank, setRank] = useState(defect.rank);
  const [manHours, setManHours] = useState(String(defect.manHours));
  const [parts, setParts] = useState(defect.parts.map((p) => ({ partId: p.partId, quantity: String(p.quantity) })));
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [problem, setProblem] = useState<string | null>(null);
  if (catalogue.error) return <LoadProblem what="parts catalogue" error={catalogue.error} />;
  const catalogueParts = catalogue.data?.parts ?? [];

  async function submit(event: React.FormEvent) {
    event.preventDefault();
    setProblem(null);
    setErrors({});
    try {
      const saved = await plan.mutateAsync({ targetDay, rank: rank as (typeof RANKS)[number], manHours, parts });
      onDone(`${saved.number} planned for ${saved.targetDay ? formatDayKey(saved.targetDay) : "no day yet"}.`);
    } catch (error) {
      const named = error instanceof ProblemError ? (error.problem.errors ?? []) : [];
      setErrors(Object.fromEntries(named.map((e) => [e.field, e.message])));
      // Said beside each field; above the buttons only that nothing was saved.
      setProblem(named.length ? "It was not planned: see the fields marked." : problemSentence(error, "it was not planned"));
    }
  }

  return (
    <form onSubmit={submit} noValidate className="grid gap-4">
      <p>
        <span className="font-mono">{defect.number}</span> {defect.title} — {defect.component.code} {defect.component.name}
      </p>
      <div className="grid gap-4 sm:grid-cols-3">
        <Field id="plan-day" label="Target day" error={errors.targetDay}>
          <input id="plan-day" type="date" className="field" value={targetDay} onChange={(e) => setTargetDay(e.target.value)} aria-invalid={errors.targetDay ? true : undefined} />
        </Field>
        <Field id="plan-rank" label="Rank" error={errors.rank}>
          <select id="plan-rank" className="field" value={rank} onChange={(e) => setRank(e.target.value)}>
            {RANKS.map((r) => (
              <option key={r} value={r}>
                {rankLabel(r)}
              </option>
            ))}
          </select>
        </Field>
        <Field id="plan-hours" label="Man-hours" error={errors.manHours}>
          <input id="plan-hours" className="field text-right tabular-nums" inputMode="decimal" value={manHours} onChange={(e) => setManHours(e.target.value)} aria-invalid={errors.manHours ? true : undefined} />
        </Field>
      </div>
      <fieldset className="grid gap-2">
        <legend className="label">Parts the repair needs</legend>
        {parts.map((p, i) => {
          const chosen = catalogueParts.find((c) => c.id === p.partId);
          const error = errors[`parts.${i}.partId`] ?? errors[`parts.${i}.quantity`];
          return (
            <div key={i} className="grid gap-1">
              <div className="flex flex-wrap items-center gap-2">
                <select aria-label={`Part ${i + 1}`} className="field min-w-0 flex-1" value={p.partId} onChange={(e) => setParts(parts.map((x, j) => (j === i ? { ...x, partId: e.target.value } : x)))}>
                  <option value="">Choose a part…</option>
                  {catalogueParts.map((c) => (
                    <option key={c.id} value={c.id}>
                      {c.number} — {c.description}
                    </option>
                  ))}
                </select>
                <input aria-label={`Quantity of part ${i + 1}`} className="field w-20 text-right tabular-nums" inputMode="decimal" value={p.quantity} onChange={(e) => setParts(parts.map((x, j) => (j === i ? { ...x, quantity: e.target.value } : x)))} />
                <span className="w-10 text-sm text-ink-500">{chosen ? UNIT_LABEL[chosen.unit] : ""}</span>
                <button type="button" className="btn-quiet" onClick={() => setParts(parts.filter((_, j) => j !== i))}>
                  Remove<span className="sr-only"> part {i + 1}</span>
                </button>
              </div>
              {error && <p className="field-error">{error}</p>}
            </div>
          );
        })}
        <div>
          <button type="button" className="btn-quiet" onClick={() => setParts([...parts, { partId: "", quantity: "1" }])}>
            Add a part
          </button>
        </div>
        {errors.parts && <p className="field-error">{errors.parts}</p>}
      </fieldset>
      <FormActions submitLabel="Plan the repair" busy={plan.isPending} problem={problem} onCancel={onCancel} />
    </form>
  );
}
