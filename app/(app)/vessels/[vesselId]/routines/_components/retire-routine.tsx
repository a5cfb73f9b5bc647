"use client";

import { useState } from "react";
import { FormActions } from "@/app/_components/forms/form-actions";
import { problemSentence } from "@/app/_components/forms/form-problem";
import type { RoutineSummary } from "@/server/routines/contract";
import { useRetireRoutine } from "./use-routines";

type Props = { vesselId: string; routine: RoutineSummary; onDone: (message: string) => void; onCancel: () => void };

export function RetireRoutine({ vesselId, routine, onDone, onCancel }: Props) {
  const retire = useRetireRoutine(vesselId);
  const [problem, setProblem] = useState<string | null>(null);

  async function onSubmit(event: React.FormEvent) {
    event.preventDefault();
    setProblem(null);
    try {
      const result = await retire.mutateAsync(routine.id);
      onDone(
        `${routine.title} on ${routine.component.code} retired.${
          result.openWorkOrdersRemoved ? " Its open work order left the Backlog." : ""
        } Its history stays on record.`,
      );
    } catch (error) {
      setProblem(problemSentence(error, "nothing was retired"));
    }
  }

  return (
    <form onSubmit={onSubmit} className="grid gap-4">
      <p>
        <span className="font-semibold">{routine.title}</span> on{" "}
        <span className="font-mono font-semibold">{routine.component.code}</span> leaves the maintenance plan. Its open
        work order leaves the Backlog unless work on it has already been recorded; completed work orders and their
        records stay for audits and surveys.
      </p>
      <FormActions
        submitLabel="Retire routine"
        busyLabel="Retiring…"
        busy={retire.isPending}
        problem={problem}
        onCancel={onCancel}
        danger
      />
    </form>
  );
}
