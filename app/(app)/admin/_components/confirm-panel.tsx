"use client";

import { useState } from "react";
import { ProblemError } from "@/app/_components/fetch-json";
import { FormActions } from "@/app/_components/forms/form-actions";
import { SidePanel } from "@/app/_components/forms/side-panel";

type Props = {
  title: string;
  subtitle?: string;
  children: React.ReactNode;
  confirmLabel: string;
  /** Disabling a person or retiring a vessel is shown in the alarm colour; enabling is not. */
  tone: "alarm" | "plain";
  onConfirm: () => Promise<string>;
  onDone: (message: string) => void;
  onClose: () => void;
  /** False where a "Cancel" button would read as the action itself (cancelling a message). */
  offerCancel?: boolean;
};

/** Asks once before a change that takes effect at once for other people. */
export function ConfirmPanel({
  title,
  subtitle,
  children,
  confirmLabel,
  tone,
  onConfirm,
  onDone,
  onClose,
  offerCancel = true,
}: Props) {
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);

  async function confirm(event: React.FormEvent) {
    event.preventDefault();
    setBusy(true);
    setProblem(null);
    try {
      onDone(await onConfirm());
    } catch (error) {
      setProblem(
        error instanceof ProblemError ? error.problem.detail : "The server could not be reached; nothing was changed.",
      );
      setBusy(false);
    }
  }

  return (
    <SidePanel title={title} subtitle={subtitle} onClose={onClose} closeOnBackdrop>
      <form onSubmit={confirm} className="grid gap-4">
        <div className="grid gap-2 text-ink-700 dark:text-ink-200">{children}</div>
        <FormActions
          submitLabel={confirmLabel}
          busyLabel="Working…"
          busy={busy}
          problem={problem}
          onCancel={offerCancel ? onClose : undefined}
          danger={tone === "alarm"}
        />
      </form>
    </SidePanel>
  );
}
