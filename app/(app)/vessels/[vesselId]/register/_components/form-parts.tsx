// The pieces every register form is made of: a labelled field with its hint and error, and the
// buttons with the server's answer above them.

type FieldProps = { id: string; label: string; hint?: React.ReactNode; error?: string; children: React.ReactNode };

export function FormField({ id, label, hint, error, children }: FieldProps) {
  return (
    <div>
      <label htmlFor={id} className="label">
        {label}
      </label>
      {children}
      {hint && !error && (
        <p id={`${id}-hint`} className="mt-1 text-xs text-ink-500 dark:text-ink-400">
          {hint}
        </p>
      )}
      {error && (
        <p id={`${id}-error`} className="field-error">
          {error}
        </p>
      )}
    </div>
  );
}

/** The aria attributes that tie an input to its hint or error. */
export function describedBy(id: string, error: string | undefined, hasHint = false) {
  return {
    id,
    "aria-invalid": error ? true : undefined,
    "aria-describedby": error ? `${id}-error` : hasHint ? `${id}-hint` : undefined,
  } as const;
}

type FooterProps = {
  submitLabel: string;
  busyLabel: string;
  busy: boolean;
  problem: string | null;
  onCancel: () => void;
  danger?: boolean;
};

export function FormFooter({ submitLabel, busyLabel, busy, problem, onCancel, danger }: FooterProps) {
  return (
    <div className="grid gap-3 border-t border-ink-200 pt-4 dark:border-ink-800">
      <div aria-live="polite" className="empty:hidden">
        {problem && (
          <p
            role="alert"
            className="rounded-md bg-alarm-50 px-3 py-2 font-medium text-alarm-700 dark:bg-alarm-700/20 dark:text-alarm-300"
          >
            {problem}
          </p>
        )}
      </div>
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
        <button type="button" className="btn-quiet" onClick={onCancel}>
          Cancel
        </button>
      </div>
    </div>
  );
}
