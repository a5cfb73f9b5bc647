"use client";
// A requisition drafted or changed on board: the port stay to deliver at, the parts with their
// quantities and why, and a note for the office. Checked by the server line by line.
import { zodResolver } from "@hookform/resolvers/zod";
import { type Resolver, useFieldArray, useForm, useWatch } from "react-hook-form";
import { describedBy, Field } from "@/app/_components/forms/field";
import { FormActions } from "@/app/_components/forms/form-actions";
import { rowFields, useSendForm } from "@/app/_components/forms/use-send-form";
import { LoadProblem } from "@/app/_components/notice";
import { formatShipTime } from "@/server/format/hours";
import { type CataloguePart, type RequisitionList, RequisitionInput, type RequisitionValues, type RequisitionView, UNIT_LABEL } from "@/server/parts/contract";
import { useCatalogue } from "../../stores/_components/use-stores";
import { useDraftRequisition, useEditRequisition } from "./use-requisitions";

type Values = { portStayId: string; note: string; lines: { partId: string; quantity: string; reason: string }[] };
type Props = { vesselId: string; list: RequisitionList; requisition?: RequisitionView; onDone: (message: string) => void; onCancel: () => void };

export function RequisitionForm(props: Props) {
  const catalogue = useCatalogue();
  if (catalogue.error) return <LoadProblem what="parts catalogue" error={catalogue.error} />;
  if (!catalogue.data) return <p aria-busy="true">Loading the parts catalogue…</p>;
  return <LoadedForm {...props} parts={catalogue.data.parts} />;
}

function LoadedForm({ vesselId, list, requisition, onDone, onCancel, parts }: Props & { parts: CataloguePart[] }) {
  const draft = useDraftRequisition(vesselId);
  const edit = useEditRequisition(vesselId, requisition?.id ?? "");
  const form = useForm<Values, unknown, RequisitionValues>({
    resolver: zodResolver(RequisitionInput) as unknown as Resolver<Values, unknown, RequisitionValues>,
    defaultValues: {
      portStayId: requisition?.portStay?.id ?? list.stays[0]?.id ?? "",
      note: requisition?.note ?? "",
      lines: requisition ? requisition.lines.map((l) => ({ partId: l.partId, quantity: String(l.quantity), reason: l.reason })) : [{ partId: "", quantity: "1", reason: "" }],
    },
  });
  const { register, control, formState } = form;
  const { errors, isSubmitting } = formState;
  const rows = useFieldArray({ control, name: "lines" });
  const chosen = useWatch({ control, name: "lines" });
  const byId = new Map(parts.map((p) => [p.id, p]));
  const { onSubmit, problem } = useSendForm(form, {
    fields: (values) => ["portStayId", "note", ...rowFields("lines", values.lines.length, ["partId", "quantity", "reason"]), "lines"],
    send: async (values) => {
      const saved = requisition ? await edit.mutateAsync(values) : await draft.mutateAsync(values);
      onDone(requisition ? `${saved.number} changed.` : `${saved.number} drafted: check it, then send it to the office.`);
    },
  });

  return (
    <form onSubmit={onSubmit} noValidate className="grid gap-4">
      <Field id="req-stay" label="Deliver at" hint="The port stay the parts are wanted for." error={errors.portStayId?.message}>
        <select className="field" {...describedBy("req-stay", errors.portStayId?.message, true)} {...register("portStayId")}>
          <option value="">No port stay named</option>
          {list.stays.map((s) => (
            <option key={s.id} value={s.id}>
              {s.port}, arriving {formatShipTime(new Date(s.arrivesAt), list.vessel.timeZone)}
            </option>
          ))}
        </select>
      </Field>
      <fieldset className="grid gap-2">
        <legend className="label">Parts asked for</legend>
        {rows.fields.map((row, i) => {
          const part = byId.get(chosen[i]?.partId ?? "");
          const e = errors.lines?.[i];
          const error = e?.partId?.message ?? e?.quantity?.message ?? e?.reason?.message;
          return (
            <div key={row.id} className="grid gap-1 rounded-md border border-ink-200 p-2 dark:border-ink-800">
              <div className="flex flex-wrap items-center gap-2">
                <select aria-label={`Part ${i + 1}`} className="field min-w-0 flex-1" aria-invalid={e?.partId ? true : undefined} {...register(`lines.${i}.partId`)}>
                  <option value="">Choose a part…</option>
                  {parts.map((p) => (
                    <option key={p.id} value={p.id}>
                      {p.number} — {p.description}
                    </option>
                  ))}
                </select>
                <input
                  aria-label={`Quantity of part ${i + 1}`}
                  className="field w-24 text-right tabular-nums"
                  inputMode="decimal"
                  autoComplete="off"
                  aria-invalid={e?.quantity ? true : undefined}
                  {...register(`lines.${i}.quantity`)}
                />
                <span className="w-10 text-sm text-ink-500">{part ? UNIT_LABEL[part.unit] : ""}</span>
                <button type="button" className="btn-quiet" onClick={() => rows.remove(i)} disabled={rows.fields.length === 1}>
                  Remove<span className="sr-only"> part {i + 1}</span>
                </button>
              </div>
              <input aria-label={`Why part ${i + 1} is needed`} placeholder="Why (e.g. short for the piston overhaul)" className="field" autoComplete="off" {...register(`lines.${i}.reason`)} />
              {error && <p className="field-error">{error}</p>}
            </div>
          );
        })}
        <div>
          <button type="button" className="btn-quiet" onClick={() => rows.append({ partId: "", quantity: "1", reason: "" })}>
            Add a part
          </button>
        </div>
        {errors.lines?.message && <p className="field-error">{errors.lines.message}</p>}
        {errors.lines?.root?.message && <p className="field-error">{errors.lines.root.message}</p>}
      </fieldset>
      <Field id="req-note" label="Note for the office" hint="Optional: the agent, a deadline, a maker’s contact." error={errors.note?.message}>
        <textarea className="field min-h-20" {...describedBy("req-note", errors.note?.message, true)} {...register("note")} />
      </Field>
      <FormActions submitLabel={requisition ? "Save the changes" : "Draft the requisition"} busy={isSubmitting} problem={problem} onCancel={onCancel} />
    </form>
  );
}
