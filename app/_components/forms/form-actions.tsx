// The end of a form: the server's answer to the last attempt, then the buttons.
import { Notice } from "@/app/_components/notice";

type FormActionsProps = {
  submitLabel: string;
  /** Said on the submit button while the request runs. */
  busyLabel?: string;
  busy: boolean;
  problem: string | null;
  /** Without it there is no Cancel button (the panel's Close does the same). */
  onCancel?: () => void;
  /** For a change that takes something out of use (retiring, disabling): the alarm colour. */
  danger?: boolean;
};

export function FormActions({ submitLabel, busyLabel = "Saving…", busy, problem, onCancel, danger }: FormActionsProps) {
  return (
    <div className="grid gap-3 border-t border-ink-200 pt-4 dark:border-ink-800">
      <Notice tone="problem" message={problem} />
      <div className="flex gap-2">
        <button
          type="submit"
          className={
            danger
              ? "btn bg-alarm-600 text-white hover:bg-alarm-700 dark:bg-alarm-500 dark:hover:bg-alarm-600"
              : "btn-primary"
          }
          disabled={busy}
        >
          {busy ? busyLabel : submitLabel}
        </button>
        {onCancel && (
          <button type="button" className="btn-quiet" onClick={onCancel}>
            Cancel
          </button>
        )}
      </div>
    </div>
  );
}
