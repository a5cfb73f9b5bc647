"use client";

import { useState } from "react";
import { ProblemError } from "@/app/_components/fetch-json";
import { SidePanel } from "./dialog";

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
};

/** Asks once before a change that takes effect at once for other people. */
export function ConfirmPanel({ title, subtitle, children, confirmLabel, tone, onConfirm, onDone, onClose }: Props) {
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);

  async function confirm() {
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
    <SidePanel title={title} subtitle={subtitle} onClose={onClose}>
      <div className="grid gap-4">
        <div className="grid gap-2 text-ink-700 dark:text-ink-200">{children}</div>
        {problem && (
          <p
            role="alert"
            className="rounded-md bg-alarm-50 px-3 py-2 font-medium text-alarm-700 dark:bg-alarm-700/20 dark:text-alarm-300"
          >
            {problem}
          </p>
        )}
        <div className="flex gap-2">
          <button
            type="button"
            onClick={confirm}
            disabled={busy}
            className={
              tone === "alarm"
                ? "btn bg-alarm-600 text-white hover:bg-alarm-700 dark:bg-alarm-500 dark:hover:bg-alarm-600"
                : "btn-primary"
            }
          >
            {busy ? "Working…" : confirmLabel}
          </button>
          <button type="button" onClick={onClose} className="btn-quiet" disabled={busy}>
            Cancel
          </button>
        </div>
      </div>
    </SidePanel>
  );
}
