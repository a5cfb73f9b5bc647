import type { ReactNode } from "react";

// The one table of Keelson's plain lists (vessels, people, tolerance rules, outbox, port stays):
// column headers, one row per item with its first cell as the row header, an empty row that says
// why there is nothing, and the skeleton shown while the rows load. The Backlog, which sorts and
// filters, keeps TanStack Table; these lists only show rows, so a column list is all they need.

export type DataColumn<Row> = {
  /** Unique within the table (React key). */
  id: string;
  header: string;
  /** Read out but not shown, e.g. "Actions" over a column of buttons. */
  hideHeader?: boolean;
  align?: "left" | "right";
  /** Classes for the header and every cell of the column, e.g. `hidden lg:table-cell`. */
  className?: string;
  /** Classes for the body cells only, e.g. `font-mono whitespace-nowrap`. */
  cellClassName?: string;
  cell: (row: Row) => ReactNode;
};

type DataTableProps<Row> = {
  columns: DataColumn<Row>[];
  rows: readonly Row[];
  rowKey: (row: Row) => string;
  /** The id of the heading that names the table, or a label of its own. */
  labelledBy?: string;
  label?: string;
  /** Shown in one row across the table when there are no rows. */
  empty: ReactNode;
  rowClassName?: (row: Row) => string;
  /** `compact` for long lists read at a glance; `top` aligns cells holding two lines. */
  density?: "normal" | "compact";
  alignTop?: boolean;
  className?: string;
};

const HEAD = "px-3 py-2 font-semibold";

function edgeClass(index: number, count: number): string {
  return [index === 0 ? "pl-4" : "", index === count - 1 ? "pr-4" : ""].filter(Boolean).join(" ");
}

export function DataTable<Row>({
  columns,
  rows,
  rowKey,
  labelledBy,
  label,
  empty,
  rowClassName,
  density = "normal",
  alignTop = false,
  className = "",
}: DataTableProps<Row>) {
  const body = `px-3 ${density === "compact" ? "py-1.5" : "py-2"} ${alignTop ? "align-top" : ""}`;
  const cellClass = (column: DataColumn<Row>, index: number, head: boolean) =>
    [
      head ? HEAD : body,
      edgeClass(index, columns.length),
      column.align === "right" ? "text-right" : "",
      column.className ?? "",
      head ? "" : (column.cellClassName ?? ""),
    ]
      .filter(Boolean)
      .join(" ");

  return (
    <div className="relative overflow-x-auto panel">
      <table className={`w-full text-left ${className}`} aria-labelledby={labelledBy} aria-label={label}>
        <thead className="text-xs tracking-wide text-ink-500 uppercase dark:text-ink-400">
          <tr className="border-b border-ink-200 dark:border-ink-800">
            {columns.map((column, i) => (
              <th key={column.id} scope="col" className={cellClass(column, i, true)}>
                {column.hideHeader ? <span className="sr-only">{column.header}</span> : column.header}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {rows.length === 0 && (
            <tr>
              <td colSpan={columns.length} className="px-4 py-6 text-ink-500 dark:text-ink-400">
                {empty}
              </td>
            </tr>
          )}
          {rows.map((row) => (
            <tr
              key={rowKey(row)}
              className={`border-b border-ink-100 last:border-0 dark:border-ink-850 ${rowClassName?.(row) ?? ""}`}
            >
              {columns.map((column, i) =>
                i === 0 ? (
                  <th key={column.id} scope="row" className={cellClass(column, i, false)}>
                    {column.cell(row)}
                  </th>
                ) : (
                  <td key={column.id} className={cellClass(column, i, false)}>
                    {column.cell(row)}
                  </td>
                ),
              )}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

/** A table's shape while its rows load; `label` is what screen readers hear ("Loading the vessels"). */
export function TableSkeleton({ label, rows = 6 }: { label: string; rows?: number }) {
  return (
    <div className="animate-pulse panel p-4" aria-busy="true" aria-label={label}>
      {Array.from({ length: rows }, (_, i) => (
        <div key={i} className="mb-2 h-8 rounded bg-ink-100 dark:bg-ink-850" />
      ))}
    </div>
  );
}
