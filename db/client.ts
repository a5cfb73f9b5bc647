import { drizzle } from "drizzle-orm/node-postgres";
import { Pool, type PoolClient } from "pg";
import { env } from "../server/env";
import { actorStamp, currentActor } from "./actor";
import * as schema from "./schema";

// The one arrow from db/ to server/: the connection URL is configuration like any other, checked
// by the one schema (server/env.ts, which imports nothing of the domain).
export function databaseUrl(): string {
  return env().DATABASE_URL;
}

export function createDb(pool: Pool) {
  return drizzle({ client: pool, schema, casing: "snake_case" });
}

export type Db = ReturnType<typeof createDb>;
export type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];

// One pool per process (and one more for the read-only copy when it is configured); kept on
// globalThis so that dev-mode reloads do not open new pools.
const globalForDb = globalThis as unknown as {
  keelsonPool?: Pool;
  keelsonDb?: Db;
  keelsonReadPool?: Pool;
  keelsonReadDb?: Db;
};

function poolFor(connectionString: string): Pool {
  const timeout = env().KEELSON_STATEMENT_TIMEOUT_MS;
  const pool = new Pool({
    connectionString,
    max: 10,
    ...(timeout ? { statement_timeout: timeout, idle_in_transaction_session_timeout: timeout } : {}),
  });
  // An idle connection the database ends (a restart, a stop) is dropped by the pool, which reports
  // it here; unheard, that report ended the worker (tests/faults/database-outage.test.ts). The next
  // query opens a new connection, or fails as any query does while the database is away.
  pool.on("error", (error) => console.error(`[db] an idle connection ended: ${error.message}`));
  stampActorOnConnect(pool);
  return pool;
}

type StampedClient = PoolClient & { keelsonActor?: string };

/**
 * Every connection taken from the pool (by `pool.query`, a transaction, anything) carries the
 * acting person of the caller's context in its settings, for the audit trigger (db/actor.ts). The
 * actor is read when `connect` is called, in the caller's own async context, and set only when it
 * differs from what the connection already carries: one extra round trip when the actor changes.
 */
function stampActorOnConnect(pool: Pool): void {
  const connect = pool.connect.bind(pool) as () => Promise<PoolClient>;
  const stamped = async (): Promise<PoolClient> => {
    const actor = currentActor();
    const stamp = actorStamp(actor);
    const client = (await connect()) as StampedClient;
    if ((client.keelsonActor ?? "|") !== stamp) {
      try {
        await client.query("select set_config('keelson.actor', $1, false), set_config('keelson.company', $2, false)", [
          actor?.actor ?? "",
          actor?.companyId ?? "",
        ]);
      } catch (error) {
        client.release(error as Error);
        throw error;
      }
      client.keelsonActor = stamp;
    }
    return client;
  };
  // pg-pool's own `query` calls `this.connect(callback)`; keep both forms.
  pool.connect = ((callback?: (error: Error | undefined, client?: PoolClient, done?: () => void) => void) => {
    const pending = stamped();
    if (!callback) return pending;
    pending.then(
      (client) => callback(undefined, client, client.release),
      (error: Error) => callback(error),
    );
    return undefined;
  }) as Pool["connect"];
}

export function getDb(): Db {
  if (!globalForDb.keelsonDb) {
    globalForDb.keelsonPool = poolFor(databaseUrl());
    globalForDb.keelsonDb = createDb(globalForDb.keelsonPool);
  }
  return globalForDb.keelsonDb;
}

/**
 * For reads that may lag the primary by the replica's delay: the views of the worker's own rows
 * (Fleet board, overdue list). The replica of KEELSON_READ_DATABASE_URL, else the primary's pool.
 * Never for the access door or anything a person just wrote: a session must see its own writes.
 */
export function getReadDb(): Db {
  const url = env().KEELSON_READ_DATABASE_URL;
  if (!url) return getDb();
  if (!globalForDb.keelsonReadDb) {
    globalForDb.keelsonReadPool = poolFor(url);
    globalForDb.keelsonReadDb = createDb(globalForDb.keelsonReadPool);
  }
  return globalForDb.keelsonReadDb;
}

export async function closeDb(): Promise<void> {
  await Promise.all([globalForDb.keelsonPool?.end(), globalForDb.keelsonReadPool?.end()]);
  globalForDb.keelsonPool = undefined;
  globalForDb.keelsonDb = undefined;
  globalForDb.keelsonReadPool = undefined;
  globalForDb.keelsonReadDb = undefined;
}
