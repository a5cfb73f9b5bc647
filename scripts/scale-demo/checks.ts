// What the scale demo asks of the databases afterwards: did the fleet recompute finish for every
// vessel, is any work order doubled, and has the replica caught up with the primary's snapshots.
import { sql } from "drizzle-orm";
import type { Db } from "@/db/client";
import { latestSnapshotsQuery } from "@/server/fleet/board";

const num = (v: unknown) => Number(v ?? 0);

export type RecomputeState = { vessels: number; recomputed: number; waiting: number; retried: number };

/**
 * Vessels whose recompute ran after `since` (a job started after it and completed), jobs still
 * waiting or running, and jobs pg-boss took back from a dead worker (retried after expiring).
 */
export async function recomputeState(primary: Db, since: Date): Promise<RecomputeState> {
  const { rows } = await primary.execute<{ vessels: string; recomputed: string; waiting: string; retried: string }>(sql`
    with jobs as (
      select data->>'vesselId' as vessel_id, state, started_on, retry_count
      from pgboss.job where name = 'vessel-recompute' and created_on > ${since}::timestamptz - interval '1 minute'
    )
    select
      (select count(*) from vessel where retired_at is null) as vessels,
      (select count(*) from vessel v where v.retired_at is null and exists (
        select 1 from jobs j where j.vessel_id = v.id::text and j.state = 'completed' and j.started_on > ${since}::timestamptz
      )) as recomputed,
      (select count(*) from jobs where state in ('created', 'retry', 'active')) as waiting,
      (select count(*) from jobs where retry_count > 0) as retried`);
  const r = rows[0]!;
  return { vessels: num(r.vessels), recomputed: num(r.recomputed), waiting: num(r.waiting), retried: num(r.retried) };
}

export async function activeRecomputes(primary: Db): Promise<number> {
  const { rows } = await primary.execute<{ n: string }>(
    sql`select count(*) as n from pgboss.job where name = 'vessel-recompute' and state = 'active'`,
  );
  return num(rows[0]?.n);
}

/** Two work orders for one occurrence of a routine, or two open ones for one routine. */
export async function duplicateWorkOrders(primary: Db): Promise<{ total: number; sameOccurrence: number; twoOpen: number }> {
  const { rows } = await primary.execute<{ total: string; same: string; open: string }>(sql`
    select (select count(*) from work_order) as total,
      (select count(*) from (select 1 from work_order where routine_id is not null
         group by routine_id, occurrence having count(*) > 1) d) as same,
      (select count(*) from (select 1 from work_order where routine_id is not null and state <> 'done'
         group by routine_id having count(*) > 1) d) as open`);
  const r = rows[0]!;
  return { total: num(r.total), sameOccurrence: num(r.same), twoOpen: num(r.open) };
}

/** How many of the acknowledged Hour log batches (their instants) the primary holds readings of. */
export async function storedBatches(primary: Db, vesselId: string, instants: Date[]): Promise<number> {
  if (!instants.length) return 0;
  const { rows } = await primary.execute<{ n: string }>(sql`
    select count(distinct read_at) as n from reading
    where vessel_id = ${vesselId} and read_at = any(${sql.param(instants.map((d) => d.toISOString()))}::timestamptz[])`);
  return num(rows[0]?.n);
}

/** Scans of the snapshot table on this server: the board's reads, where they were served. */
export async function snapshotScans(db: Db): Promise<number> {
  const { rows } = await db.execute<{ n: string }>(sql`
    select coalesce(seq_scan, 0) + coalesce(idx_scan, 0) as n from pg_stat_user_tables where relname = 'vessel_snapshot'`);
  return num(rows[0]?.n);
}

export type ReplicaState = {
  inRecovery: boolean;
  streaming: string;
  caughtUpMs: number | null;
  sameBoard: boolean;
  freshVessels: number;
};

/**
 * Waits for the replica to replay the primary's WAL up to now, then compares the board's snapshot
 * rows on both and counts the vessels whose snapshot on the replica was retaken after `since`.
 */
export async function replicaState(primary: Db, replica: Db, companyId: string, since: Date, limitMs = 30_000): Promise<ReplicaState> {
  const [recovery] = (await replica.execute<{ r: boolean }>(sql`select pg_is_in_recovery() as r`)).rows;
  const [sender] = (
    await primary.execute<{ state: string; sync_state: string }>(sql`select state, sync_state from pg_stat_replication`)
  ).rows;
  const [target] = (await primary.execute<{ lsn: string }>(sql`select pg_current_wal_lsn()::text as lsn`)).rows;
  const started = Date.now();
  let caughtUpMs: number | null = null;
  while (Date.now() - started < limitMs) {
    const [r] = (
      await replica.execute<{ done: boolean }>(sql`select pg_last_wal_replay_lsn() >= ${target!.lsn}::pg_lsn as done`)
    ).rows;
    if (r?.done) {
      caughtUpMs = Date.now() - started;
      break;
    }
    await new Promise((resolve) => setTimeout(resolve, 20));
  }
  const board = async (db: Db) => {
    const { rows } = await db.execute<{ id: string }>(latestSnapshotsQuery(companyId));
    return JSON.stringify([...rows].sort((a, b) => a.id.localeCompare(b.id)));
  };
  const [fresh] = (
    await replica.execute<{ n: string }>(sql`
      select count(*) as n from vessel v where v.retired_at is null and v.company_id = ${companyId}
        and (select max(taken_at) from vessel_snapshot s where s.vessel_id = v.id) > ${since}::timestamptz`)
  ).rows;
  return {
    inRecovery: recovery?.r === true,
    streaming: sender ? `${sender.state} (${sender.sync_state})` : "no standby connected",
    caughtUpMs,
    sameBoard: (await board(primary)) === (await board(replica)),
    freshVessels: num(fresh?.n),
  };
}
