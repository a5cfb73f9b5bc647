"use client";

import { useState } from "react";
import { FormActions } from "@/app/_components/forms/form-actions";
import { problemSentence } from "@/app/_components/forms/form-problem";
import { LoadProblem } from "@/app/_components/notice";
import { SearchField } from "@/app/_components/search-field";
import type { CopyTarget, RoutineSummary } from "@/server/routines/contract";
import { useCopyRoutine, useCopyTargets } from "./use-routines";

type Props = { vesselId: string; routine: RoutineSummary; onDone: (message: string) => void; onCancel: () => void };

/** Targets by vessel: this vessel's components first, then sister ships' components with the same code. */
function byVessel(targets: CopyTarget[], vesselId: string): [string, CopyTarget[]][] {
  const groups = new Map<string, CopyTarget[]>();
  for (const t of [...targets].sort((a, b) => Number(b.vessel.id === vesselId) - Number(a.vessel.id === vesselId))) {
    groups.set(t.vessel.name, [...(groups.get(t.vessel.name) ?? []), t]);
  }
  return [...groups];
}

export function CopyRoutine({ vesselId, routine, onDone, onCancel }: Props) {
  const targets = useCopyTargets(vesselId, routine.id);
  const copy = useCopyRoutine(vesselId);
  const [chosen, setChosen] = useState<Set<string>>(new Set());
  // A register runs to hundreds of components: the list narrows as one types a code or a name.
  const [find, setFind] = useState("");
  const [problem, setProblem] = useState<string | null>(null);

  if (targets.isPending) return <p aria-busy="true">Finding components to copy to…</p>;
  if (targets.error) return <LoadProblem what="components to copy to" error={targets.error} />;

  const needle = find.trim().toLowerCase();
  const shown = needle
    ? targets.data.filter((t) => `${t.code} ${t.name}`.toLowerCase().includes(needle))
    : targets.data;

  const toggle = (id: string) =>
    setChosen((current) => {
      const next = new Set(current);
      if (next.has(id)) next.delete(id);
      else next.add(id);
      return next;
    });

  async function onSubmit(event: React.FormEvent) {
    event.preventDefault();
    setProblem(null);
    if (chosen.size === 0) {
      setProblem("Choose at least one component to copy to.");
      return;
    }
    try {
      const result = await copy.mutateAsync({ id: routine.id, componentIds: [...chosen] });
      const where = result.created.map((c) => `${c.componentCode} (${c.vesselName})`).join(", ");
      onDone(`${routine.title} copied to ${where}. Check each copy’s baseline against its own counter.`);
    } catch (error) {
      setProblem(problemSentence(error, "nothing was copied"));
    }
  }

  return (
    <form onSubmit={onSubmit} className="grid gap-4">
      <p className="text-ink-600 dark:text-ink-300">
        Copy to other components of this vessel, or to <span className="font-mono">{routine.component.code}</span> on
        sister ships. Each copy keeps this routine’s interval, checklist, limits and baseline; its work orders are its
        own.
      </p>
      {targets.data.length === 0 ? (
        <p>There is no other component to copy to.</p>
      ) : (
        // Enter in the search box narrows the list; it must not send the copy.
        <div
          className="flex flex-wrap items-center gap-3"
          onKeyDown={(event) => {
            if (event.key === "Enter") event.preventDefault();
          }}
        >
          <SearchField label="Find a component" placeholder="Code or name" value={find} onChange={setFind} />
          <p className="text-xs text-ink-500 dark:text-ink-400" aria-live="polite">
            {chosen.size === 0 ? "None chosen yet" : `${chosen.size} chosen`}
          </p>
        </div>
      )}
      {targets.data.length > 0 && shown.length === 0 && <p>No component matches “{find.trim()}”.</p>}
      {byVessel(shown, vesselId).map(([vesselName, list]) => (
        <fieldset key={vesselName} className="grid gap-1">
          <legend className="label">{vesselName}</legend>
          {list.map((t) => (
            <label key={t.id} className="flex items-center gap-2">
              <input
                type="checkbox"
                className="accent-brass-600"
                checked={chosen.has(t.id)}
                onChange={() => toggle(t.id)}
              />
              <span className="font-mono text-xs font-semibold">{t.code}</span> {t.name}
            </label>
          ))}
        </fieldset>
      ))}
      <FormActions
        submitLabel={chosen.size > 1 ? `Copy to ${chosen.size} components` : "Copy"}
        busyLabel="Copying…"
        busy={copy.isPending}
        problem={problem}
        onCancel={onCancel}
      />
    </form>
  );
}
