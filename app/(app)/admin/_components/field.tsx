// A labelled form field with its error or hint underneath, wired for screen readers.

type FieldProps = { id: string; label: string; error?: string; hint?: string; children: React.ReactNode };

export function Field({ id, label, error, hint, children }: FieldProps) {
  return (
    <div>
      <label htmlFor={id} className="label">
        {label}
      </label>
      {children}
      {error ? (
        <p id={`${id}-message`} className="field-error">
          {error}
        </p>
      ) : (
        hint && (
          <p id={`${id}-message`} className="mt-1 text-xs text-ink-500 dark:text-ink-400">
            {hint}
          </p>
        )
      )}
    </div>
  );
}

/** The input's attributes that tie it to the message under it (error or hint). */
export function describedBy(id: string, error: string | undefined) {
  return { "aria-invalid": error ? true : undefined, "aria-describedby": `${id}-message` };
}
