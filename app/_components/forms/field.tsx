// A labelled form field with its hint or error underneath, wired for screen readers.

type FieldProps = { id: string; label: string; hint?: React.ReactNode; error?: string; children: React.ReactNode };

export function Field({ id, label, hint, error, children }: FieldProps) {
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

/**
 * The input's id and the aria attributes that tie it to its label and to the message under it: the
 * error when there is one, else the hint. Pass `hasHint` where the Field has a hint, so that
 * `aria-describedby` never names a message that is not on the page.
 */
export function describedBy(id: string, error: string | undefined, hasHint = false) {
  return {
    id,
    "aria-invalid": error ? true : undefined,
    "aria-describedby": error ? `${id}-error` : hasHint ? `${id}-hint` : undefined,
  } as const;
}
