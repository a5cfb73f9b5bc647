"use client";

import { useState } from "react";
import { FormActions } from "@/app/_components/forms/form-actions";
import { problemSentence } from "@/app/_components/forms/form-problem";
import type { RegisterCounter } from "@/server/register/contract";
import { useRetireCounter } from "./use-register";

type Props = { vesselId: string; counter: RegisterCounter; onDone: (message: string) => void; onCancel: () => void };

export function RetireCounter({ vesselId, counter, onDone, onCancel }: Props) {
  const retire = useRetireCounter(vesselId);
  const [problem, setProblem] = useState<string | null>(null);

  if (counter.usedBy.length) {
    return (
      <div className="grid gap-3">
        <p>
          {counter.name} is still the counter of{" "}
          {counter.usedBy.map((u, i) => (
            <span key={u.id}>
              {i > 0 && ", "}
              <span className="font-mono font-semibold">{u.code}</span> {u.name}
            </span>
          ))}
          .
        </p>
        <p className="text-ink-600 dark:text-ink-300">
          Give {counter.usedBy.length === 1 ? "that component" : "those components"} another counter, or none, in the
          register first; then the counter can be retired.
        </p>
        <div>
          <button type="button" className="btn-quiet" onClick={onCancel} autoFocus>
            Back to the register
          </button>
        </div>
      </div>
    );
  }

  async function onSubmit(event: React.FormEvent) {
    event.preventDefault();
    setProblem(null);
    try {
      await retire.mutateAsync(counter.id);
      onDone(`${counter.name} retired. Its readings stay on record.`);
    } catch (error) {
      setProblem(problemSentence(error));
    }
  }

  return (
    <form onSubmit={onSubmit} className="grid gap-4">
      <p>
        {counter.name} leaves the Hour log and can no longer be given to a component. Its readings stay on record for
        audits and surveys.
      </p>
      <FormActions
        submitLabel="Retire counter"
        busyLabel="Retiring…"
        busy={retire.isPending}
        problem={problem}
        onCancel={onCancel}
        danger
      />
    </form>
  );
}
