"use client";

import { flexRender, getCoreRowModel, useReactTable } from "@tanstack/react-table";
import { usePathname, useSearchParams } from "next/navigation";
import { useMemo, useState } from "react";
import { ageOf } from "@/app/_components/relative-age";
import { BACKLOG_SORTS, type BacklogFilter } from "@/server/backlog/contract";
import { RANKS } from "@/server/routines/contract";
import { backlogColumns } from "./backlog-columns";
import { BacklogFilters } from "./backlog-filters";
import { backlogExportSearch, backlogSearch, readBacklogUrl } from "./backlog-url";
import { useBacklog } from "./use-backlog";

const SORT_LABEL: Record<(typeof BACKLOG_SORTS)[number], string> = {
  urgency: "Most urgent first",
  due: "Due date, soonest first",
  "-due": "Due date, latest first",
  number: "Work-order number",
  component: "Component code",
  "remaining-hours": "Fewest hours left",
};
export function BacklogView({ vesselId, timeZone }: { vesselId: string; timeZone: string }) {
  const pathname = usePathname();
  const urlParams = useSearchParams();
  // The filter just chosen shows at once, before the URL round-trips through the router: while
  // the URL is still the one it was changed from, the pending query stands in for it.
  const [pending, setPending] = useState<{ from: string; to: string } | null>(null);
  const current = pending && pending.from === urlParams.toString() ? pending.to : urlParams.toString();
  const filter = useMemo(() => readBacklogUrl(new URLSearchParams(current)), [current]);
  // The API's query is the page's: the same names, read by the same schema.
  const search = backlogSearch(filter);
  const { data, error, isPending, isFetching } = useBacklog(vesselId, search);

  function update(next: Partial<BacklogFilter>) {
    // Another filter or sort starts again at the first page.
    const to = backlogSearch({ ...filter, page: 1, ...next });
    // The History API, not router.replace: Next keeps useSearchParams in step, and the ship's link
    // is spared a server round trip for what is only a new query to the route handler.
    setPending({ from: urlParams.toString(), to });
    window.history.replaceState(null, "", `${pathname}${to ? `?${to}` : ""}`);
  }

  const columns = useMemo(() => backlogColumns(timeZone), [timeZone]);
  // eslint-disable-next-line react-hooks/incompatible-library -- TanStack Table hands back functions the compiler cannot memoise
  const table = useReactTable({
    data: data?.items ?? [],
    columns,
    getCoreRowModel: getCoreRowModel(),
    manualPagination: true,
  });
  const pages = data ? Math.max(1, Math.ceil(data.total / data.pageSize)) : 1;

  return (
    <section className="panel" aria-labelledby="backlog-heading" aria-busy={isFetching}>
      <div className="flex flex-wrap items-center justify-between gap-3 border-b border-ink-200 px-4 py-3 dark:border-ink-800">
        <h2 id="backlog-heading" className="font-semibold">
          Backlog{" "}
          <span className="font-normal text-ink-500">
            {data ? `${data.total} work order${data.total === 1 ? "" : "s"}` : ""}
            {data?.computedAt ? ` · worked out ${ageOf(data.computedAt, new Date())}` : ""}
          </span>
        </h2>
        <div className="flex flex-wrap items-center gap-3">
          <a
            className="btn-quiet"
            href={`/api/vessels/${vesselId}/backlog/export${exportQuery(filter)}`}
            download
            title="Every work order under these filters, in this order, as a spreadsheet file"
          >
            Download CSV
          </a>
          <label className="flex items-center gap-2">
            <span className="text-ink-600 dark:text-ink-300">Sort</span>
            <select
              className="field w-auto"
              value={filter.sort}
              onChange={(e) => update({ sort: BACKLOG_SORTS.find((s) => s === e.target.value) })}
            >
              {BACKLOG_SORTS.map((s) => (
                <option key={s} value={s}>
                  {SORT_LABEL[s]}
                </option>
              ))}
            </select>
          </label>
        </div>
      </div>
      <PendingDeferrals
        count={data?.pendingDeferrals ?? 0}
        filtered={filter.deferral === "pending"}
        onFilter={(on) => update({ deferral: on ? "pending" : undefined })}
      />
      <BacklogFilters values={filter} counts={data?.counts} ranks={[...RANKS]} onChange={update} />
      {error ? (
        <p role="alert" className="p-4 text-alarm-700 dark:text-alarm-300">
          The Backlog could not be loaded: {error.message}
        </p>
      ) : isPending ? (
        <div className="m-4 h-64 animate-pulse rounded bg-ink-100 dark:bg-ink-850" aria-label="Loading the Backlog" />
      ) : data.items.length === 0 ? (
        <div className="p-8 text-center text-ink-600 dark:text-ink-300">
          <p className="font-medium">No work order matches these filters.</p>
          <p className="text-sm">Clear a filter above, or choose more states.</p>
        </div>
      ) : (
        <div className="overflow-x-auto">
          <table className="w-full text-left">
            <thead className="text-xs tracking-wide text-ink-500 uppercase dark:text-ink-400">
              {table.getHeaderGroups().map((group) => (
                <tr key={group.id} className="border-b border-ink-200 dark:border-ink-800">
                  {group.headers.map((h) => (
                    <th key={h.id} scope="col" className="px-3 py-2 font-semibold first:pl-4">
                      {flexRender(h.column.columnDef.header, h.getContext())}
                    </th>
                  ))}
                </tr>
              ))}
            </thead>
            <tbody>
              {table.getRowModel().rows.map((row) => (
                <tr
                  key={row.id}
                  className="border-b border-ink-100 align-top last:border-0 hover:bg-ink-50 dark:border-ink-850 dark:hover:bg-ink-850"
                >
                  {row.getVisibleCells().map((cell) => (
                    <td key={cell.id} className="px-3 py-2 first:pl-4">
                      {flexRender(cell.column.columnDef.cell, cell.getContext())}
                    </td>
                  ))}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      {data && pages > 1 && (
        <nav
          aria-label="Pages"
          className="flex items-center justify-between gap-3 border-t border-ink-200 px-4 py-3 dark:border-ink-800"
        >
          <button
            type="button"
            className="btn-quiet"
            disabled={filter.page <= 1}
            onClick={() => update({ page: filter.page - 1 })}
          >
            ← Previous
          </button>
          <span className="text-ink-600 dark:text-ink-300">
            Page {filter.page} of {pages}
          </span>
          <button
            type="button"
            className="btn-quiet"
            disabled={filter.page >= pages}
            onClick={() => update({ page: filter.page + 1 })}
          >
            Next →
          </button>
        </nav>
      )}
    </section>
  );
}

/** The page's filters and sort without its paging: the export carries every page. */
function exportQuery(filter: BacklogFilter): string {
  const search = backlogExportSearch(filter);
  return search ? `?${search}` : "";
}

/** Requests someone has to decide: said above the list, with the filter that shows just those. */
function PendingDeferrals({
  count,
  filtered,
  onFilter,
}: {
  count: number;
  filtered: boolean;
  onFilter: (on: boolean) => void;
}) {
  if (count === 0 && !filtered) return null;
  return (
    <div
      role="status"
      className="flex flex-wrap items-center gap-3 border-b border-brass-400 bg-brass-100 px-4 py-2 text-ink-900 dark:border-brass-500 dark:bg-brass-700/30 dark:text-ink-50"
    >
      <p className="font-medium">
        <span aria-hidden="true">⇢ </span>
        {count === 0
          ? "No deferral request awaits a decision."
          : `${count} deferral request${count === 1 ? " awaits" : "s await"} a decision.`}
      </p>
      <button type="button" className="btn-quiet px-2 py-1" onClick={() => onFilter(!filtered)}>
        {filtered ? "Show every work order" : count === 1 ? "Show it" : "Show them"}
      </button>
    </div>
  );
}
