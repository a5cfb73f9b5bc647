"use client";
// Receiving, counting or moving a part: one movement, checked by the server against what is
// recorded (never below zero; a count needs its reason).
import { zodResolver } from "@hookform/resolvers/zod";
import { type Resolver, useForm, useWatch } from "react-hook-form";
import { describedBy, Field } from "@/app/_components/forms/field";
import { FormActions } from "@/app/_components/forms/form-actions";
import { useSendForm } from "@/app/_components/forms/use-send-form";
import { LoadProblem } from "@/app/_components/notice";
import { type CataloguePart, MovementInput, type MovementValues, type StockLine, UNIT_LABEL } from "@/server/parts/contract";
import { useCatalogue, useRecordMovement } from "./use-stores";

export type MoveKind = MovementValues["kind"];
type Values = { kind: MoveKind; partId: string; locationId: string; toLocationId: string; quantity: string; counted: string; reason: string };

type Props = {
  vesselId: string;
  kind: MoveKind;
  partId?: string;
  locations: { id: string; place: string }[];
  lines: StockLine[];
  onDone: (message: string) => void;
  onCancel: () => void;
};

export function MovementForm(props: Props) {
  const catalogue = useCatalogue();
  // The part list must be there before the form takes its values: a select without the chosen
  // part's option would read as "no part chosen".
  if (catalogue.error) return <LoadProblem what="parts catalogue" error={catalogue.error} />;
  if (!catalogue.data) return <p aria-busy="true">Loading the parts catalogue…</p>;
  return <LoadedMovementForm {...props} parts={catalogue.data.parts} />;
}

function LoadedMovementForm({ vesselId, kind, partId, locations, lines, onDone, onCancel, parts }: Props & { parts: CataloguePart[] }) {
  const record = useRecordMovement(vesselId);
  const line = lines.find((l) => l.part.id === partId);
  const form = useForm<Values, unknown, MovementValues>({
    resolver: zodResolver(MovementInput) as unknown as Resolver<Values, unknown, MovementValues>,
    defaultValues: { kind, partId: partId ?? "", locationId: line?.byLocation[0]?.locationId ?? locations[0]?.id ?? "", toLocationId: "", quantity: "", counted: "", reason: "" },
  });
  const { register, formState, control } = form;
  const { errors, isSubmitting } = formState;
  const chosen = useWatch({ control, name: "partId" });
  const part = parts.find((p) => p.id === chosen);
  const unit = part ? UNIT_LABEL[part.unit] : "";
  const { onSubmit, problem } = useSendForm(form, {
    fields: ["partId", "locationId", "toLocationId", "quantity", "counted", "reason"],
    send: async (values) => {
      const result = await record.mutateAsync(values);
      const name = part ? `${part.number} ${part.description}` : "The part";
      onDone(result.changed ? `${name}: ${result.onBoard} ${unit} on board now.` : `${name}: the count agrees with the record; nothing changed.`);
    },
  });
  const error = (name: keyof Values) => errors[name]?.message;

  return (
    <form onSubmit={onSubmit} noValidate className="grid gap-4">
      <input type="hidden" {...register("kind")} />
      <Field id="move-part" label="Part" error={error("partId")}>
        <select className="field" {...describedBy("move-part", error("partId"))} {...register("partId")}>
          <option value="">Choose a part…</option>
          {parts.map((p) => (
            <option key={p.id} value={p.id}>
              {p.number} — {p.description}
            </option>
          ))}
        </select>
      </Field>
      <Field id="move-from" label={kind === "moved" ? "From" : "Where"} error={error("locationId")}>
        <select className="field" {...describedBy("move-from", error("locationId"))} {...register("locationId")}>
          {locations.map((l) => (
            <option key={l.id} value={l.id}>
              {l.place}
            </option>
          ))}
        </select>
      </Field>
      {kind === "moved" && (
        <Field id="move-to" label="To" error={error("toLocationId")}>
          <select className="field" {...describedBy("move-to", error("toLocationId"))} {...register("toLocationId")}>
            <option value="">Choose where it goes…</option>
            {locations.map((l) => (
              <option key={l.id} value={l.id}>
                {l.place}
              </option>
            ))}
          </select>
        </Field>
      )}
      {kind === "counted" ? (
        <Field id="move-counted" label={`Counted on the shelf${unit ? ` (${unit})` : ""}`} hint="What you found; the difference from the record is stored with your reason." error={error("counted")}>
          <input className="field w-32 text-right tabular-nums" inputMode="decimal" autoComplete="off" {...describedBy("move-counted", error("counted"), true)} {...register("counted")} />
        </Field>
      ) : (
        <Field id="move-quantity" label={`Quantity${unit ? ` (${unit})` : ""}`} error={error("quantity")}>
          <input className="field w-32 text-right tabular-nums" inputMode="decimal" autoComplete="off" {...describedBy("move-quantity", error("quantity"), true)} {...register("quantity")} />
        </Field>
      )}
      <Field
        id="move-reason"
        label={kind === "counted" ? "Why the count differs" : "Remark"}
        hint={kind === "received" ? "Optional, e.g. delivered in Rotterdam, order 4411." : kind === "counted" ? "Required, e.g. two found in the wrong bin." : "Optional."}
        error={error("reason")}
      >
        <input className="field" autoComplete="off" {...describedBy("move-reason", error("reason"), true)} {...register("reason")} />
      </Field>
      <FormActions submitLabel={kind === "received" ? "Receive" : kind === "counted" ? "Save the count" : "Move"} busy={isSubmitting} problem={problem} onCancel={onCancel} />
    </form>
  );
}
