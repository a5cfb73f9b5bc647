"use client";
// The preview of an import: what it would create, change, leave alone and retire per kind, every
// problem by file, row and column, and the changes one by one.
import type { ImportPreview } from "@/server/import/service";

const KINDS = [
  ["components", "Components"],
  ["counters", "Counters"],
  ["routines", "Routines"],
  ["readings", "Readings"],
] as const;
const ACTION = { create: "new", change: "changed", retire: "retired" } as const;

type Props = { preview: ImportPreview; onApply: () => void; busy: boolean; what?: "import" | "copy" };

export function PreviewView({ preview, onApply, busy, what = "import" }: Props) {
  const headingId = `${what}-preview-heading`;
  const problems = preview.problems.length + preview.moreProblems;
  const changes = preview.changes.length + preview.moreChanges;
  return (
    <section aria-labelledby={headingId} className="panel grid gap-4 p-4">
      <h2 id={headingId} className="font-semibold">
        What the {what} would do
      </h2>
      <p className="text-sm text-ink-600 dark:text-ink-300">From: {preview.files.join(", ")}</p>
      <table className="w-full max-w-xl text-left text-sm tabular-nums">
        <thead>
          <tr className="text-ink-600 dark:text-ink-300">
            <th scope="col" className="py-1 pr-4 font-medium">Kind</th>
            <th scope="col" className="py-1 pr-4 text-right font-medium">New</th>
            <th scope="col" className="py-1 pr-4 text-right font-medium">Changed</th>
            <th scope="col" className="py-1 pr-4 text-right font-medium">Unchanged</th>
            <th scope="col" className="py-1 text-right font-medium">Retired</th>
          </tr>
        </thead>
        <tbody>
          {KINDS.map(([kind, label]) => {
            const c = preview.counts[kind];
            return (
              <tr key={kind} className="border-t border-ink-100 dark:border-ink-800">
                <th scope="row" className="py-1 pr-4 font-normal">{label}</th>
                <td className="py-1 pr-4 text-right">{c.create}</td>
                <td className="py-1 pr-4 text-right">{c.change}</td>
                <td className="py-1 pr-4 text-right">{c.same}</td>
                <td className="py-1 text-right">{c.retire}</td>
              </tr>
            );
          })}
        </tbody>
      </table>

      {problems > 0 ? (
        <div className="grid gap-2">
          <h3 role="alert" className="font-semibold text-alarm-700 dark:text-alarm-300">
            {problems} problem{problems === 1 ? "" : "s"} to correct in the files — nothing can be imported until they are
          </h3>
          <div className="max-h-[28rem] overflow-auto rounded-md border border-ink-200 dark:border-ink-800">
            <table className="w-full text-left text-sm">
              <thead className="sticky top-0 bg-ink-50 dark:bg-ink-900">
                <tr>
                  <th scope="col" className="px-2 py-1 font-medium">File</th>
                  <th scope="col" className="px-2 py-1 text-right font-medium">Row</th>
                  <th scope="col" className="px-2 py-1 font-medium">Column</th>
                  <th scope="col" className="px-2 py-1 font-medium">What is wrong</th>
                </tr>
              </thead>
              <tbody>
                {preview.problems.map((p, i) => (
                  <tr key={i} className="border-t border-ink-100 align-top dark:border-ink-800" data-import-problem="">
                    <td className="px-2 py-1 whitespace-nowrap">{p.file}</td>
                    <td className="px-2 py-1 text-right tabular-nums">{p.row ?? "—"}</td>
                    <td className="px-2 py-1 font-mono text-xs">{p.column ?? "—"}</td>
                    <td className="px-2 py-1">{p.message}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          {preview.moreProblems > 0 && <p className="text-sm">…and {preview.moreProblems} more: correct these and check again.</p>}
        </div>
      ) : (
        <div className="grid gap-2">
          <p className="font-medium text-go-700 dark:text-go-300">No problems: every row reads.</p>
          {changes === 0 ? (
            <p>The files say what the vessel already holds: importing them would change nothing.</p>
          ) : (
            <>
              <details>
                <summary className="cursor-pointer">
                  {changes} change{changes === 1 ? "" : "s"}, one by one
                </summary>
                <ul className="mt-2 max-h-80 overflow-auto text-sm">
                  {preview.changes.map((c) => (
                    <li key={`${c.kind}:${c.key}`}>
                      {c.kind === "readings" ? (
                        <>
                          <span className="font-mono">{c.key}</span> (readings): {c.fields.join(", ")} to add
                        </>
                      ) : (
                        <>
                          <span className="font-mono">{c.key}</span> ({c.kind.replace(/s$/, "")}): {ACTION[c.action]}
                          {c.fields.length > 0 && ` — ${c.fields.join(", ")}`}
                        </>
                      )}
                    </li>
                  ))}
                  {preview.moreChanges > 0 && <li>…and {preview.moreChanges} more.</li>}
                </ul>
              </details>
              <div>
                <button type="button" className="btn-primary" disabled={busy} onClick={onApply}>
                  {what === "import" ? "Apply the import" : "Copy the plan"}
                </button>
              </div>
            </>
          )}
        </div>
      )}
    </section>
  );
}
