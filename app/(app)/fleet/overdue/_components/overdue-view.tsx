"use client";

import Link from "next/link";
import { usePathname, useSearchParams } from "next/navigation";
import { type DataColumn, DataTable } from "@/app/_components/data-table";
import { LoadProblem } from "@/app/_components/notice";
import { RankName } from "@/app/_components/rank-words-provider";
import { StateBadge } from "@/app/_components/state-badge";
import type { FleetOverdue, FleetOverdueItem } from "@/server/fleet/overdue-contract";
import { formatHours } from "@/server/format/hours";
import { useFleetOverdue } from "./use-fleet-overdue";

function overdueWords(i: FleetOverdueItem): string {
  const days =
    i.daysOverdue === null
      ? ""
      : i.daysOverdue === 0
        ? "under a day"
        : `${i.daysOverdue} day${i.daysOverdue === 1 ? "" : "s"}`;
  const parts = [days, i.hoursOverdue !== null ? formatHours(i.hoursOverdue) : ""].filter(Boolean);
  return parts.length ? `${parts.join(" · ")} over` : "—";
}

const COLUMNS: DataColumn<FleetOverdueItem>[] = [
  { id: "vessel", header: "Vessel", cellClassName: "font-normal whitespace-nowrap", cell: (i) => i.vessel.name },
  {
    id: "work-order",
    header: "Work order",
    cell: (i) => (
      <span data-work-order={i.number}>
        <Link
          className="font-mono text-xs underline-offset-2 hover:underline"
          href={`/vessels/${i.vessel.id}/work-orders/${i.id}`}
        >
          {i.number}
        </Link>
        <span className="block">{i.title}</span>
        <span className="block text-xs text-ink-500">
          {i.component.code} {i.component.name}
        </span>
      </span>
    ),
  },
  { id: "state", header: "State", cell: (i) => <StateBadge state={i.state} /> },
  {
    id: "due",
    header: "Due",
    cellClassName: "whitespace-nowrap tabular-nums",
    cell: (i) => (
      <>
        {i.dueDay ?? ""}
        {i.dueHours !== null && <span className="block text-xs text-ink-500">{formatHours(i.dueHours)}</span>}
      </>
    ),
  },
  { id: "overdue", header: "Overdue by", cellClassName: "whitespace-nowrap tabular-nums", cell: overdueWords },
  { id: "rank", header: "Rank", cellClassName: "whitespace-nowrap", cell: (i) => <RankName rank={i.rank} /> },
  {
    id: "notes",
    header: "Notes",
    cellClassName: "text-xs",
    cell: (i) =>
      [
        i.critical && "critical",
        i.classRelated && "class item",
        i.plannedDate && `planned ${i.plannedDate}`,
        i.pendingDeferral && "deferral asked",
        i.awaitingApproval && "done, awaiting approval",
      ]
        .filter(Boolean)
        .join(" · "),
  },
];

export function OverdueView() {
  const pathname = usePathname();
  const params = useSearchParams();
  const search = params.toString();
  const { data, error, isPending, isFetching } = useFleetOverdue(search);

  const setFilter = (name: string, value: string) => {
    const next = new URLSearchParams(params);
    if (value) next.set(name, value);
    else next.delete(name);
    const q = next.toString();
    // The History API, as on the Backlog: Next keeps useSearchParams in step at once, and the
    // filter is only a new query to the route handler, not a new page.
    window.history.replaceState(null, "", q ? `${pathname}?${q}` : pathname);
  };

  return (
    <div className="grid grid-cols-[minmax(0,1fr)] gap-4">
      <form
        role="search"
        aria-label="Narrow the overdue list"
        className="no-print flex flex-wrap items-end gap-3 panel p-3"
        onSubmit={(e) => e.preventDefault()}
      >
        <label className="grid gap-1">
          <span className="label">State</span>
          <select
            className="field"
            value={params.get("state") ?? ""}
            onChange={(e) => setFilter("state", e.target.value)}
          >
            <option value="">Late and out of tolerance</option>
            <option value="out-of-tolerance">Out of tolerance only</option>
            <option value="late">Late only</option>
          </select>
        </label>
        <label className="grid gap-1">
          <span className="label">Vessel</span>
          <select
            className="field"
            value={params.get("vesselId") ?? ""}
            onChange={(e) => setFilter("vesselId", e.target.value)}
          >
            <option value="">Every vessel</option>
            {data?.vessels.map((v) => (
              <option key={v.id} value={v.id}>
                {v.name}
              </option>
            ))}
          </select>
        </label>
        <label className="flex items-center gap-2 pb-2">
          <input
            type="checkbox"
            checked={params.get("flagged") === "true"}
            onChange={(e) => setFilter("flagged", e.target.checked ? "true" : "")}
          />
          Critical or class-related only
        </label>
        <div className="ml-auto flex flex-wrap gap-2">
          <a className="btn-quiet" href={`/api/fleet/overdue/export${search ? `?${search}` : ""}`} download>
            Download CSV
          </a>
          <a className="btn-quiet" href={`/api/fleet/overdue/pdf${search ? `?${search}` : ""}`} download>
            Download PDF
          </a>
          <button type="button" className="btn-quiet" onClick={() => window.print()}>
            Print
          </button>
          <Link className="btn-quiet" href="/fleet">
            Fleet board
          </Link>
        </div>
      </form>
      {error ? (
        <LoadProblem what="overdue list" error={error} />
      ) : isPending ? (
        <div className="h-72 animate-pulse panel" aria-busy="true" aria-label="Loading the overdue list" />
      ) : (
        <OverdueTable data={data} busy={isFetching} />
      )}
    </div>
  );
}

function OverdueTable({ data, busy }: { data: FleetOverdue; busy: boolean }) {
  const generated = new Date(data.generatedAt);
  return (
    <section className="grid gap-2" aria-labelledby="overdue-heading" aria-busy={busy}>
      <div className="flex flex-wrap items-baseline justify-between gap-2 px-1">
        <h2 id="overdue-heading" className="font-semibold">
          Overdue work orders <span className="font-normal text-ink-500">{data.items.length}</span>
        </h2>
        <p className="text-xs text-ink-500">
          As the worker last computed them; listed {generated.toISOString().slice(0, 16).replace("T", " ")} UTC. Due
          days are ship’s days.
        </p>
      </div>
      {data.truncated && (
        <p role="status" className="px-1 text-sm">
          Only the first {data.items.length} are listed: narrow the list by vessel or state.
        </p>
      )}
      <DataTable
        columns={COLUMNS}
        rows={data.items}
        rowKey={(i) => i.id}
        labelledBy="overdue-heading"
        empty="Nothing is late or out of tolerance under these filters."
        density="compact"
        alignTop
        className="text-sm"
      />
    </section>
  );
}
