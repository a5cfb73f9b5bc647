"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { describedBy, Field } from "@/app/_components/forms/field";
import { FormActions } from "@/app/_components/forms/form-actions";
import { useSendForm } from "@/app/_components/forms/use-send-form";
import { ComponentInput, type RegisterComponent, type RegisterView } from "@/server/register/contract";
import { inheritedUnder, lookupOf } from "./counter-words";
import { useAddComponent, useChangeComponent } from "./use-register";

// The edit form changes everything but the place in the tree, which the move form does.
const ComponentEdit = ComponentInput.omit({ parentId: true });
type Values = z.input<typeof ComponentEdit>;
type Output = z.output<typeof ComponentEdit>;
const FIELDS = ["code", "name", "critical", "classItemRef", "counterId", "maker", "model"] as const;

type Props = {
  view: RegisterView;
  /** Adding under a parent (null: at the top level), or editing a component. */
  target: { parentId: string | null } | { component: RegisterComponent };
  onDone: (message: string) => void;
  onCancel: () => void;
};

export function ComponentForm({ view, target, onDone, onCancel }: Props) {
  const editing = "component" in target ? target.component : null;
  const parentId = editing ? editing.parentId : "parentId" in target ? target.parentId : null;
  const lookup = lookupOf(view);
  const add = useAddComponent(view.vessel.id);
  const change = useChangeComponent(view.vessel.id);
  const form = useForm<Values, unknown, Output>({
    resolver: zodResolver(ComponentEdit),
    defaultValues: {
      code: editing?.code ?? "",
      name: editing?.name ?? "",
      critical: editing?.critical ?? false,
      classItemRef: editing?.classItemRef ?? "",
      counterId: editing?.counterId ?? null,
      maker: editing?.maker ?? "",
      model: editing?.model ?? "",
    },
  });
  const { register, formState } = form;
  const { errors, isSubmitting } = formState;
  const activeCounters = view.counters.filter((c) => !c.retiredAt || c.id === editing?.counterId);

  const { onSubmit, problem } = useSendForm(form, {
    fields: FIELDS,
    send: async (values) => {
      if (editing) {
        await change.mutateAsync({ id: editing.id, change: values });
        onDone(`${values.code} saved.`);
      } else {
        await add.mutateAsync({ ...values, parentId });
        onDone(`${values.code} added${parentId ? ` under ${lookup.components.get(parentId)?.code}` : ""}.`);
      }
    },
  });

  return (
    <form onSubmit={onSubmit} noValidate className="grid gap-4">
      <p className="text-ink-600 dark:text-ink-300">
        {parentId ? (
          <>
            Part of <span className="font-mono font-semibold">{lookup.components.get(parentId)?.code}</span>{" "}
            {lookup.components.get(parentId)?.name}
          </>
        ) : (
          "At the top level of the register"
        )}
      </p>
      <div className="grid grid-cols-[12rem_1fr] gap-3">
        <Field id="component-code" label="Code" error={errors.code?.message}>
          <input
            className="field font-mono uppercase"
            autoComplete="off"
            spellCheck={false}
            autoFocus
            {...describedBy("component-code", errors.code?.message)}
            {...register("code")}
          />
        </Field>
        <Field id="component-name" label="Name" error={errors.name?.message}>
          <input
            className="field"
            autoComplete="off"
            {...describedBy("component-name", errors.name?.message)}
            {...register("name")}
          />
        </Field>
      </div>
      <p className="-mt-2 text-xs text-ink-500 dark:text-ink-400">
        Letters, digits and . _ - , up to 40 characters; typed in lower case, it is kept in capitals (me.cyl.3 →
        ME.CYL.3).
      </p>

      <div className="flex items-start gap-2">
        <input
          id="component-critical"
          type="checkbox"
          className="accent-brass-600"
          aria-describedby="component-critical-hint"
          {...register("critical")}
        />
        <div>
          <label htmlFor="component-critical" className="font-semibold">
            Critical equipment
          </label>
          <p id="component-critical-hint" className="text-xs text-ink-500 dark:text-ink-400">
            Its sudden failure could lead to a hazardous situation (ISM Code 10.3); its work comes first in planning.
          </p>
        </div>
      </div>

      <Field
        id="component-class"
        label="Class item reference"
        hint="Optional: the item’s number in the class survey list."
        error={errors.classItemRef?.message}
      >
        <input
          className="field font-mono"
          autoComplete="off"
          {...describedBy("component-class", errors.classItemRef?.message, true)}
          {...register("classItemRef")}
        />
      </Field>

      <Field
        id="component-counter"
        label="Counter"
        hint={`Without a counter of its own it uses ${inheritedUnder(parentId, lookup)}.`}
        error={errors.counterId?.message}
      >
        <select
          className="field"
          {...describedBy("component-counter", errors.counterId?.message, true)}
          {...register("counterId", { setValueAs: (v: string | null) => v || null })}
        >
          <option value="">None of its own</option>
          {activeCounters.map((c) => (
            <option key={c.id} value={c.id}>
              {c.name}
            </option>
          ))}
        </select>
      </Field>

      <div className="grid grid-cols-2 gap-3">
        <Field id="component-maker" label="Maker" error={errors.maker?.message}>
          <input
            className="field"
            autoComplete="off"
            {...describedBy("component-maker", errors.maker?.message)}
            {...register("maker")}
          />
        </Field>
        <Field id="component-model" label="Model" error={errors.model?.message}>
          <input
            className="field"
            autoComplete="off"
            {...describedBy("component-model", errors.model?.message)}
            {...register("model")}
          />
        </Field>
      </div>

      <FormActions
        submitLabel={editing ? "Save component" : "Add component"}
        busy={isSubmitting}
        problem={problem}
        onCancel={onCancel}
      />
    </form>
  );
}
