// The admin tables' shape while their rows load.
export function TableSkeleton({ label, rows = 6 }: { label: string; rows?: number }) {
  return (
    <div className="animate-pulse panel p-4" aria-busy="true" aria-label={label}>
      {Array.from({ length: rows }, (_, i) => (
        <div key={i} className="mb-2 h-8 rounded bg-ink-100 dark:bg-ink-850" />
      ))}
    </div>
  );
}
