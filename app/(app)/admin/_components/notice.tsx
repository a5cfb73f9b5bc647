// The line that says what just happened, read out by screen readers as it changes.
export function Notice({ message }: { message: string | null }) {
  return (
    <div aria-live="polite" className="empty:hidden">
      {message && (
        <p className="mb-3 rounded-md bg-go-50 px-3 py-2 font-medium text-go-700 dark:bg-go-700/20 dark:text-go-300">
          {message}
        </p>
      )}
    </div>
  );
}

export function LoadProblem({ what, error }: { what: string; error: Error }) {
  return (
    <p role="alert" className="panel p-4 text-alarm-700 dark:text-alarm-300">
      The {what} could not be loaded: {error.message}
    </p>
  );
}

export function TableSkeleton({ label, rows = 6 }: { label: string; rows?: number }) {
  return (
    <div className="animate-pulse panel p-4" aria-busy="true" aria-label={label}>
      {Array.from({ length: rows }, (_, i) => (
        <div key={i} className="mb-2 h-8 rounded bg-ink-100 dark:bg-ink-850" />
      ))}
    </div>
  );
}
