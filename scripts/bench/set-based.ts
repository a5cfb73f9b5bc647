// The nightly fleet recompute's work-order writes done set-based, beside the worker's way (one
// vessel after another, each reading, planning and writing in its own transaction). Given the rows
// the engine computed in the sequential run, it puts the fleet back as it was before that run and
// writes the same rows again in one UPDATE … FROM unnest over every vessel, with the run's state
// changes in one INSERT, then checks the fleet's rows are exactly those the sequential run left.
import { performance } from "node:perf_hooks";
import { and, eq, inArray, ne, sql } from "drizzle-orm";
import type { Db } from "@/db/client";
import { workOrder } from "@/db/schema";
import type { WorkOrderState } from "@/db/schema/work-order-states";
import { insertStateChanges, updateWorkOrders } from "@/server/scheduling/work-order-bulk-write";
import type { StateChange, WorkOrderUpdate } from "@/server/scheduling/work-order-diff";
import { WRITTEN_FIELDS, type WorkOrderRow, type WrittenFields } from "@/server/work-orders/fields";

type Fleet = { companyId: string; vessels: string[] };

/** The fleet's open work orders, as a recompute run leaves them. */
export function openWorkOrders(db: Db, { companyId, vessels }: Fleet): Promise<WorkOrderRow[]> {
  return db
    .select()
    .from(workOrder)
    .where(and(eq(workOrder.companyId, companyId), inArray(workOrder.vesselId, vessels), ne(workOrder.state, "done")));
}

/** One digest of every work order and state change of the fleet, to compare two ways of writing. */
async function fleetDigest(db: Db, { companyId, vessels }: Fleet): Promise<string> {
  const r = await db.execute<{ digest: string }>(sql`
    select md5(coalesce((select string_agg(w::text, '|' order by w.id) from work_order w
                         where w.company_id = ${companyId} and w.vessel_id = any(${sql.param(vessels)}::uuid[])), '')
               || coalesce((select string_agg(concat_ws(',', c.work_order_id, c.from_state, c.to_state, c.changed_at), '|'
                                              order by c.work_order_id, c.changed_at, c.to_state)
                            from work_order_state_change c join work_order w on w.id = c.work_order_id
                            where c.company_id = ${companyId} and w.vessel_id = any(${sql.param(vessels)}::uuid[])), '')) as digest`);
  return r.rows[0]!.digest;
}

function written(row: WorkOrderRow): WrittenFields {
  return Object.fromEntries(WRITTEN_FIELDS.map((k) => [k, row[k]])) as WrittenFields;
}

/** `to`'s figures for the rows the run wrote; the state changed where `from` held another state. */
function updatesTo(rows: WorkOrderRow[], stateOf: Map<string, WorkOrderState>): WorkOrderUpdate[] {
  return rows.map((w) => ({ id: w.id, state: w.state, stateChanged: stateOf.get(w.id) !== w.state, ...written(w) }));
}

export type SetBasedRun = { rows: number; stateChanges: number; seconds: number; sameAsSequential: true };

/**
 * `before` are the open work orders as they stood before the sequential run at `at`, stamped at
 * `before`'s own run time `was`; the fleet now holds what the sequential run wrote.
 */
export async function timeSetBasedWrite(
  db: Db,
  fleet: Fleet,
  before: WorkOrderRow[],
  was: Date,
  at: Date,
): Promise<SetBasedRun> {
  const after = (await openWorkOrders(db, fleet)).filter((w) => w.computedAt.getTime() === at.getTime());
  const written = new Set(after.map((w) => w.id));
  const stateBefore = new Map(before.map((w) => [w.id, w.state]));
  const stateAfter = new Map(after.map((w) => [w.id, w.state]));
  const digest = await fleetDigest(db, fleet);

  // Back to before the sequential run: its state changes removed (kept to write again), the rows
  // it wrote restored. Not timed.
  const changes = await db.transaction(async (tx) => {
    const removed = await tx.execute<{
      work_order_id: string;
      from_state: WorkOrderState | null;
      to_state: WorkOrderState;
    }>(sql`
      delete from work_order_state_change c using work_order w
      where w.id = c.work_order_id and c.company_id = ${fleet.companyId} and w.vessel_id = any(${sql.param(fleet.vessels)}::uuid[])
        and c.changed_at = ${at}::timestamptz
      returning c.work_order_id, c.from_state, c.to_state`);
    await updateWorkOrders(
      tx,
      updatesTo(
        before.filter((w) => written.has(w.id)),
        stateAfter,
      ),
      was,
    );
    return removed.rows.map((c): StateChange => ({
      workOrderId: c.work_order_id,
      fromState: c.from_state,
      toState: c.to_state,
    }));
  });
  await db.execute(sql`vacuum analyze work_order, work_order_state_change`);

  const updates = updatesTo(after, stateBefore);
  const start = performance.now();
  await db.transaction(async (tx) => {
    await updateWorkOrders(tx, updates, at, Infinity);
    await insertStateChanges(tx, changes, { companyId: fleet.companyId, now: at }, Infinity);
  });
  const seconds = Math.round(performance.now() - start) / 1000;
  if ((await fleetDigest(db, fleet)) !== digest)
    throw new Error("the set-based write left other rows than the sequential run");
  await db.execute(sql`vacuum analyze work_order, work_order_state_change`);
  console.log(
    `[bench] the same writes set-based: ${updates.length} rows, ${changes.length} state changes in ${seconds} s`,
  );
  return { rows: updates.length, stateChanges: changes.length, seconds, sameAsSequential: true };
}
