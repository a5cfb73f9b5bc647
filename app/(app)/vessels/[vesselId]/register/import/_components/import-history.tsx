"use client";
// The vessel's past imports: when, who, which files, what each did.
import { useQuery } from "@tanstack/react-query";
import { fetchJson } from "@/app/_components/fetch-json";
import type { ImportRecord } from "@/server/import/history";

export function ImportHistory({ vesselId, refresh }: { vesselId: string; refresh: number }) {
  const { data } = useQuery({
    queryKey: ["vessel-imports", vesselId, refresh],
    queryFn: () => fetchJson<{ imports: ImportRecord[] }>(`/api/vessels/${vesselId}/import`),
  });
  if (!data?.imports.length) return null;
  return (
    <section aria-labelledby="import-history-heading" className="panel grid gap-2 p-4">
      <h2 id="import-history-heading" className="font-semibold">
        Earlier imports
      </h2>
      <ul className="grid gap-1 text-sm">
        {data.imports.map((i) => {
          const c = i.counts;
          return (
            <li key={i.id}>
              {new Date(i.importedAt).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short" })} by {i.importedBy ?? "a former user"}:{" "}
              {i.files.join(", ")} — routines: {c.routines.created} new, {c.routines.changed} changed, {c.routines.retired} retired;
              components: {c.components.created} new, {c.components.changed} changed; counters: {c.counters.created} new,{" "}
              {c.counters.changed} changed{c.readings?.created ? `; readings: ${c.readings.created} added` : ""}
            </li>
          );
        })}
      </ul>
    </section>
  );
}
