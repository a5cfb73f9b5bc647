// Writes a recompute run's work-order diff (work-order-diff.ts) in a few statements rather than one
// per work order: a vessel of 3,000 routines made 3,000–6,000 round trips a run, several seconds,
// most of a nightly fleet run. Each statement binds one array per column and unnests them, so any
// number of rows fits its parameters (a multi-row VALUES of 1,000 rows cost about a second in
// query building alone). Column names and casts come from the Drizzle tables.
import "server-only";
import { getTableColumns, type SQL, sql } from "drizzle-orm";
import { CasingCache } from "drizzle-orm/casing";
import type { PgColumn, PgTable } from "drizzle-orm/pg-core";
import type { Tx } from "@/db/client";
import { workOrder, workOrderStateChange } from "@/db/schema";
import type { WorkOrderState } from "@/db/schema/work-order-states";
import { WRITTEN_FIELDS } from "@/server/work-orders/fields";
import type { StateChange, WorkOrderInsert, WorkOrderUpdate } from "./work-order-diff";

// Chunks only keep one statement's arrays and its returned rows modest on a very large vessel.
const INSERT_CHUNK = 2_000;
const UPDATE_CHUNK = 2_000;
const STATE_CHANGE_CHUNK = 5_000;

/** The same casing as the client's (db/client.ts), so names match the migrations. */
const casing = new CasingCache("snake_case");

type ColumnKey<T extends PgTable> = keyof T["_"]["columns"] & string;

function columnsOf<T extends PgTable>(table: T, keys: readonly ColumnKey<T>[]): PgColumn[] {
  const columns: Record<string, PgColumn> = getTableColumns(table);
  return keys.map((key) => columns[key]!);
}

/** `a, b, c` (or `v.a, v.b, v.c` with a prefix): the SQL names of the columns. */
function columnNames<T extends PgTable>(table: T, keys: readonly ColumnKey<T>[], prefix = ""): SQL {
  return sql.raw(
    columnsOf(table, keys)
      .map((c) => prefix + casing.getColumnCasing(c))
      .join(", "),
  );
}

/** `$1::uuid[], $2::text[], …`: one array parameter per column, cast to the column's type. */
function columnArrays<T extends PgTable, K extends ColumnKey<T>>(
  table: T,
  keys: readonly K[],
  rows: readonly Record<K, unknown>[],
): SQL {
  const columns = columnsOf(table, keys);
  return sql.join(
    keys.map((key, i) => {
      const type = columns[i]!.getSQLType();
      // A jsonb value (a team) goes as its JSON text: pg would turn an array of arrays into a 2-D array.
      const values = rows.map((r) => (type === "jsonb" && r[key] !== null ? JSON.stringify(r[key]) : r[key]));
      return sql`${sql.param(values)}::${sql.raw(type)}[]`;
    }),
    sql`, `,
  );
}

function* chunks<T>(rows: readonly T[], size: number): Generator<T[]> {
  for (let i = 0; i < rows.length; i += size) yield rows.slice(i, i + size);
}

const RUN_COLUMNS = ["companyId", "vesselId", "kind", "stateChangedAt", "computedAt"] as const;
const INSERTED = ["routineId", "number", "occurrence", "state", ...WRITTEN_FIELDS] as const;

/**
 * New work orders. A row whose (routine, occurrence) another writer inserted first is skipped, as
 * the single-row insert was; only rows really inserted come back.
 */
export async function insertWorkOrders(
  tx: Tx,
  rows: readonly WorkOrderInsert[],
  at: { companyId: string; vesselId: string; now: Date },
): Promise<{ id: string; state: WorkOrderState }[]> {
  const inserted: { id: string; state: WorkOrderState }[] = [];
  for (const chunk of chunks(rows, INSERT_CHUNK)) {
    const result = await tx.execute<{ id: string; state: WorkOrderState }>(sql`
      insert into ${workOrder} (${columnNames(workOrder, RUN_COLUMNS)}, ${columnNames(workOrder, INSERTED)})
      select ${at.companyId}::uuid, ${at.vesselId}::uuid, 'planned', ${at.now}::timestamptz, ${at.now}::timestamptz, v.*
      from unnest(${columnArrays(workOrder, INSERTED, chunk)}) as v
      on conflict do nothing
      returning id, state`);
    inserted.push(...result.rows);
  }
  return inserted;
}

/**
 * Open work orders whose figures or state moved. The state-change time moves only with the state.
 * The bench passes a chunk size of Infinity to write a whole fleet's rows in one statement.
 */
export async function updateWorkOrders(
  tx: Tx,
  rows: readonly WorkOrderUpdate[],
  now: Date,
  chunkSize = UPDATE_CHUNK,
): Promise<void> {
  const written = columnNames(workOrder, WRITTEN_FIELDS);
  for (const chunk of chunks(rows, chunkSize)) {
    await tx.execute(sql`
      update ${workOrder} as w set
        (${written}) = (select ${columnNames(workOrder, WRITTEN_FIELDS, "v.")}),
        state = v.state, computed_at = ${now}::timestamptz,
        state_changed_at = case when v.state_changed then ${now}::timestamptz else w.state_changed_at end
      from unnest(${columnArrays(workOrder, ["id", "state"], chunk)},
                  ${sql.param(chunk.map((r) => r.stateChanged))}::boolean[],
                  ${columnArrays(workOrder, WRITTEN_FIELDS, chunk)})
        as v(id, state, state_changed, ${written})
      where w.id = v.id`);
  }
}

const CHANGE_COLUMNS = ["workOrderId", "fromState", "toState"] as const;

/** The state-change rows of a run, all stamped with the run's time. */
export async function insertStateChanges(
  tx: Tx,
  rows: readonly StateChange[],
  at: { companyId: string; now: Date },
  chunkSize = STATE_CHANGE_CHUNK,
): Promise<void> {
  for (const chunk of chunks(rows, chunkSize)) {
    await tx.execute(sql`
      insert into ${workOrderStateChange} (company_id, ${columnNames(workOrderStateChange, CHANGE_COLUMNS)}, changed_at)
      select ${at.companyId}::uuid, v.*, ${at.now}::timestamptz
      from unnest(${columnArrays(workOrderStateChange, CHANGE_COLUMNS, chunk)}) as v`);
  }
}
