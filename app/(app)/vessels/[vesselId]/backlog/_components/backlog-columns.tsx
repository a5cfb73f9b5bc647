"use client";

import { createColumnHelper } from "@tanstack/react-table";
import Link from "next/link";
import { useParams } from "next/navigation";
import { StateBadge } from "@/app/_components/state-badge";
import type { BacklogItem } from "@/server/backlog/contract";
import { formatHours, formatShipDate } from "@/server/format/hours";
import { RankName } from "@/app/_components/rank-words-provider";

const column = createColumnHelper<BacklogItem>();

function WorkOrderLink({ id, number }: { id: string; number: string }) {
  const { vesselId } = useParams<{ vesselId: string }>();
  return (
    <Link
      href={`/vessels/${vesselId}/work-orders/${id}`}
      className="-my-1 inline-block py-1 font-mono text-xs whitespace-nowrap text-tide-700 underline underline-offset-2 hover:text-tide-900 dark:text-tide-300 dark:hover:text-tide-100"
    >
      {number}
    </Link>
  );
}

function Remaining({ item }: { item: BacklogItem }) {
  const days = item.remainingDays;
  const hours = item.remainingHours;
  const late = (days ?? 0) < 0 || (hours ?? 0) < 0;
  return (
    <span className={late ? "font-semibold text-alarm-700 dark:text-alarm-300" : ""}>
      {days !== null && (days < 0 ? `${-days} d over` : days === 0 ? "today" : `${days} d`)}
      {hours !== null && (
        <span className="block text-xs text-ink-500">
          {hours < 0 ? `${formatHours(-hours)} over` : `${formatHours(hours)} left`}
        </span>
      )}
    </span>
  );
}

export function backlogColumns(timeZone: string) {
  return [
    column.accessor("number", {
      header: "Work order",
      cell: ({ row }) => <WorkOrderLink id={row.original.id} number={row.original.number} />,
    }),
    column.accessor("title", {
      header: "Job",
      cell: ({ row }) => (
        <>
          <span className="block font-medium text-ink-900 dark:text-ink-50">{row.original.title}</span>
          <span className="block text-xs text-ink-500">
            <span className="font-mono">{row.original.component.code}</span> {row.original.component.name}
          </span>
        </>
      ),
    }),
    column.accessor("state", { header: "State", cell: (c) => <StateBadge state={c.getValue()} /> }),
    column.accessor("dueDate", {
      header: "Due",
      cell: ({ row }) => {
        const w = row.original;
        // Done: what was due, and when it was done (not a projection from a counter long past it).
        if (w.state === "done") {
          return (
            <span className="whitespace-nowrap">
              {w.dueDate ? `due ${formatShipDate(new Date(w.dueDate), timeZone)}` : w.dueHours !== null ? `due at ${formatHours(w.dueHours)}` : "—"}
              <span className="block text-xs text-ink-500">{w.completedAt ? `done ${formatShipDate(new Date(w.completedAt), timeZone)}` : "done"}</span>
            </span>
          );
        }
        // A defect not yet planned has no due day; an hours routine with no reading cannot be projected.
        if (!w.dueDate) return <span className="text-ink-500">{w.kind === "corrective" ? "not planned yet" : "needs a first reading"}</span>;
        const projected = w.governing === "hours" && w.dueHours !== null;
        return (
          <span
            className="whitespace-nowrap"
            title={
              projected
                ? `Projected: due at ${formatHours(w.dueHours ?? 0)}, from the last reading and the running rate`
                : "Calendar due date"
            }
          >
            {formatShipDate(new Date(w.dueDate), timeZone)}
            <span className="block text-xs text-ink-500">
              {projected ? `≈ at ${formatHours(w.dueHours ?? 0)}` : "calendar"}
            </span>
          </span>
        );
      },
    }),
    column.display({ id: "remaining", header: "Remaining", cell: ({ row }) => <Remaining item={row.original} /> }),
    column.accessor("rank", {
      header: "Rank",
      cell: (c) => <span className="whitespace-nowrap"><RankName rank={c.getValue()} /></span>,
    }),
    column.accessor("estimatedManHours", {
      header: "Man-hours",
      cell: (c) => <span className="tabular-nums">{c.getValue()}</span>,
    }),
    column.display({
      id: "flags",
      header: "Marks",
      cell: ({ row }) => (
        <span className="flex flex-wrap gap-1 text-xs">
          {row.original.critical && <Mark>⚠ critical</Mark>}
          {row.original.classRelated && <Mark>◆ class</Mark>}
          {row.original.needsEngineStop && <Mark>⏻ engine stop</Mark>}
          {row.original.kind === "corrective" && <Mark>✚ corrective</Mark>}
          {row.original.awaitingApproval && <Mark>◷ awaiting approval</Mark>}
          {row.original.pendingDeferral && <Mark>⇢ deferral asked</Mark>}
        </span>
      ),
    }),
  ];
}

function Mark({ children }: { children: React.ReactNode }) {
  return (
    <span className="rounded bg-ink-100 px-1 whitespace-nowrap text-ink-700 dark:bg-ink-800 dark:text-ink-200">
      {children}
    </span>
  );
}
