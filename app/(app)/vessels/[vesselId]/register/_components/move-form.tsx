"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useMemo } from "react";
import { useForm, useWatch } from "react-hook-form";
import type { z } from "zod";
import { describedBy, Field } from "@/app/_components/forms/field";
import { FormActions } from "@/app/_components/forms/form-actions";
import { useSendForm } from "@/app/_components/forms/use-send-form";
import { ComponentMove, type RegisterComponent, type RegisterView } from "@/server/register/contract";
import { buildTree, descendantIds, inTreeOrder } from "@/server/register/tree";
import { inheritedUnder, lookupOf } from "./counter-words";
import { useChangeComponent } from "./use-register";

type Values = z.input<typeof ComponentMove>;
type Output = z.output<typeof ComponentMove>;

type Props = {
  view: RegisterView;
  component: RegisterComponent;
  onDone: (message: string) => void;
  onCancel: () => void;
};

export function MoveForm({ view, component, onDone, onCancel }: Props) {
  const lookup = lookupOf(view);
  const move = useChangeComponent(view.vessel.id);
  // A component cannot go under itself or under one of its own parts: those are not offered.
  const choices = useMemo(() => {
    const below = descendantIds(view.components, component.id);
    return inTreeOrder(buildTree(view.components)).filter((n) => n.row.id !== component.id && !below.has(n.row.id));
  }, [view.components, component.id]);
  const form = useForm<Values, unknown, Output>({
    resolver: zodResolver(ComponentMove),
    defaultValues: { parentId: component.parentId },
  });
  const { register, formState, control } = form;
  const parentId = useWatch({ control, name: "parentId" }) ?? null;
  const below = descendantIds(view.components, component.id).size;

  const { onSubmit, problem } = useSendForm(form, {
    fields: ["parentId"],
    send: async (values) => {
      const to = values.parentId ? lookup.components.get(values.parentId)?.code : null;
      await move.mutateAsync({ id: component.id, change: { parentId: values.parentId } });
      onDone(`${component.code} moved ${to ? `under ${to}` : "to the top level"}.`);
    },
  });

  const counterAfter = component.counterId
    ? `It keeps its own counter, ${lookup.counters.get(component.counterId)?.name ?? "as it is"}.`
    : `It will use ${inheritedUnder(parentId, lookup)}.`;

  return (
    <form onSubmit={onSubmit} noValidate className="grid gap-4">
      <p className="text-ink-600 dark:text-ink-300">
        Moves <span className="font-mono font-semibold">{component.code}</span> {component.name}
        {below ? ` with the ${below} component${below === 1 ? "" : "s"} below it` : ""}. Codes stay as they are.
      </p>
      <Field id="move-parent" label="New place" hint={counterAfter} error={formState.errors.parentId?.message}>
        <select
          autoFocus
          className="field font-mono"
          {...describedBy("move-parent", formState.errors.parentId?.message, true)}
          {...register("parentId", { setValueAs: (v: string | null) => v || null })}
        >
          <option value="">Top level of the register</option>
          {choices.map((n) => (
            <option key={n.row.id} value={n.row.id}>
              {"\u00a0\u00a0".repeat(n.depth + 1)}
              {n.row.code} · {n.row.name}
            </option>
          ))}
        </select>
      </Field>
      <FormActions
        submitLabel="Move component"
        busyLabel="Moving…"
        busy={formState.isSubmitting}
        problem={problem}
        onCancel={onCancel}
      />
    </form>
  );
}
