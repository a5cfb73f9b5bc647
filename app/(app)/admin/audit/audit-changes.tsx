import type { AuditItem } from "@/server/audit/contract";

/** One entry's values: old → new for a change, the values set or removed otherwise; its reason. */
export function AuditChanges({ item }: { item: AuditItem }) {
  const changed = item.action === "changed";
  return (
    <div className="text-sm">
      {item.reason && (
        <p className="mb-1">
          <span className="font-medium">Reason:</span> {item.reason}
        </p>
      )}
      {item.lines.length > 0 && (
        <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5 text-xs">
          {item.lines.slice(0, 8).map((l) => (
            <div key={l.label} className="contents">
              <dt className="text-ink-500 dark:text-ink-400">{l.label}</dt>
              <dd className="break-words">
                {changed ? (
                  <>
                    <del className="text-ink-500 dark:text-ink-400">{l.before ?? "—"}</del> → <ins className="no-underline">{l.after ?? "—"}</ins>
                  </>
                ) : (
                  (l.after ?? l.before)
                )}
              </dd>
            </div>
          ))}
        </dl>
      )}
      {item.lines.length > 8 && (
        <p className="text-xs text-ink-500">and {item.lines.length - 8} more values (in the CSV)</p>
      )}
    </div>
  );
}
