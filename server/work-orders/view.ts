// A work order row as the pages and route handlers send it: the chosen columns, instants as ISO
// strings. The Backlog, the Calendar, the work-order page and the fleet's lists all reshape their
// rows here, each with its own list of columns (fields.ts).
import { workOrder } from "@/db/schema";
import type { WorkOrderField, WorkOrderRow } from "./fields";

/** A stored value as JSON carries it. */
type Sent<T> = T extends Date ? string : T;

export type WorkOrderView<K extends WorkOrderField> = { [P in K]: Sent<WorkOrderRow[P]> };

export function workOrderView<K extends WorkOrderField>(
  row: Pick<WorkOrderRow, K>,
  fields: readonly K[],
): WorkOrderView<K> {
  const view: Partial<Record<K, unknown>> = {};
  for (const field of fields) {
    const value = row[field];
    view[field] = value instanceof Date ? value.toISOString() : value;
  }
  return view as WorkOrderView<K>;
}

/** The columns of `fields`, for a `select({ …, w: workOrderColumns(fields) })`. */
export function workOrderColumns<K extends WorkOrderField>(fields: readonly K[]): Pick<typeof workOrder, K> {
  return Object.fromEntries(fields.map((f) => [f, workOrder[f]])) as Pick<typeof workOrder, K>;
}
