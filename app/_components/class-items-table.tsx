import Link from "next/link";
import type { ClassItem, ClassItemSort } from "@/server/class-items/contract";
import { formatDayKey } from "@/server/format/dates";
import { formatHours } from "@/server/format/hours";
import { DataTable } from "./data-table";
import { PrintButton } from "./print-button";
import { StateBadge } from "./state-badge";

const SORT_LABEL: Record<ClassItemSort, string> = {
  reference: "Class item",
  component: "Component",
  due: "Due",
  state: "State",
};

const day = (d: string | null) => (d ? formatDayKey(d) : "—");

/**
 * The class-related routines as a surveyor goes through them: reference, component, last done,
 * anniversary or due point, window, state, deferral. Sorted on the server (ClassItemsSort's links),
 * so the page needs no script and prints as it is shown.
 */
export function ClassItemsTable({
  items,
  showVessel,
  labelledBy,
}: {
  items: ClassItem[];
  showVessel: boolean;
  labelledBy: string;
}) {
  return (
    <DataTable<ClassItem>
      labelledBy={labelledBy}
      rows={items}
      rowKey={(i) => i.routineId}
      density="compact"
      alignTop
      empty="No routine is marked class-related. Mark a routine “class-related” with its class item reference on the Routines page."
      columns={[
        {
          id: "reference",
          header: "Class item",
          cellClassName: "font-mono whitespace-nowrap",
          cell: (i) => i.reference ?? <span className="text-ink-500 italic">no reference</span>,
        },
        ...(showVessel ? [{ id: "vessel", header: "Vessel", cell: (i: ClassItem) => i.vessel.name }] : []),
        {
          id: "component",
          header: "Component and routine",
          cell: (i) => (
            <>
              <span className="font-mono text-xs">{i.component.code}</span> {i.component.name}
              <span className="block">
                {i.title}
                {i.critical ? (
                  <span className="ml-1 text-xs font-semibold text-alarm-700 dark:text-alarm-300">critical</span>
                ) : null}
              </span>
              <span className="block text-xs text-ink-500 dark:text-ink-400">{i.interval}</span>
            </>
          ),
        },
        {
          id: "last",
          header: "Last done",
          cellClassName: "whitespace-nowrap tabular-nums",
          cell: (i) =>
            i.lastDone ? (
              <>
                {day(i.lastDone.day)}
                {i.lastDone.hours !== null && <span className="block text-xs">{formatHours(i.lastDone.hours)}</span>}
              </>
            ) : (
              "not yet in Keelson"
            ),
        },
        {
          id: "due",
          header: "Anniversary or due",
          cellClassName: "whitespace-nowrap tabular-nums",
          cell: (i) => (
            <>
              {i.anniversary && <span className="block">anniversary {day(i.anniversary).replace(/ \d{4}$/, "")}</span>}
              {i.workOrder?.dueDay && <span className="block">due {day(i.workOrder.dueDay)}</span>}
              {i.workOrder?.dueHours !== null && i.workOrder?.dueHours !== undefined && (
                <span className="block text-xs">at {formatHours(i.workOrder.dueHours)}</span>
              )}
              {!i.workOrder && "—"}
            </>
          ),
        },
        {
          id: "window",
          header: "Window",
          cellClassName: "whitespace-nowrap tabular-nums text-sm",
          cell: (i) =>
            i.workOrder?.windowFrom || i.workOrder?.windowUntil
              ? `${day(i.workOrder.windowFrom)} – ${day(i.workOrder.windowUntil)}`
              : "—",
        },
        {
          id: "state",
          header: "State",
          cell: (i) =>
            i.workOrder ? (
              <Link
                href={`/vessels/${i.vessel.id}/work-orders/${i.workOrder.id}`}
                className="inline-flex flex-col gap-0.5"
              >
                <StateBadge state={i.workOrder.state} />
                <span className="font-mono text-xs underline">{i.workOrder.number}</span>
              </Link>
            ) : (
              "—"
            ),
        },
        {
          id: "deferral",
          header: "Deferral",
          cell: (i) =>
            i.deferral ? (
              <span className="text-sm">
                {i.deferral.status === "pending" ? "asked" : "approved"}
                {i.deferral.toDay ? ` to ${day(i.deferral.toDay)}` : ""}
                {i.deferral.toHours !== null ? ` to ${formatHours(i.deferral.toHours)}` : ""}
              </span>
            ) : (
              "—"
            ),
        },
      ]}
    />
  );
}

/** The sort links above the table, for keyboard and screen-reader users: the same as the headers. */
export function ClassItemsSort({ sort, base }: { sort: ClassItemSort; base: string }) {
  return (
    <p className="no-print text-sm">
      Sort by:{" "}
      {(Object.keys(SORT_LABEL) as ClassItemSort[]).map((s, n) => (
        <span key={s}>
          {n > 0 && " · "}
          {s === sort ? (
            <strong aria-current="true">{SORT_LABEL[s]}</strong>
          ) : (
            <Link href={`${base}?sort=${s}`}>{SORT_LABEL[s]}</Link>
          )}
        </span>
      ))}
    </p>
  );
}

/** A class-items page: its heading and words, the print button, the sort links and the table. */
export function ClassItemsView({
  heading,
  intro,
  items,
  sort,
  base,
  showVessel,
}: {
  heading: string;
  intro: React.ReactNode;
  items: ClassItem[];
  sort: ClassItemSort;
  base: string;
  showVessel: boolean;
}) {
  return (
    <>
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 id="class-items-heading" className="text-lg font-bold">
            {heading}
          </h1>
          <p className="max-w-3xl text-sm text-ink-600 dark:text-ink-300">{intro}</p>
        </div>
        <div className="no-print">
          <PrintButton />
        </div>
      </div>
      <ClassItemsSort sort={sort} base={base} />
      <ClassItemsTable items={items} showVessel={showVessel} labelledBy="class-items-heading" />
    </>
  );
}
