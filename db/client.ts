import { drizzle } from "drizzle-orm/node-postgres";
import { Pool } from "pg";
import { env } from "../server/env";
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

// One pool per process; kept on globalThis so that dev-mode reloads do not open new pools.
const globalForDb = globalThis as unknown as { keelsonPool?: Pool; keelsonDb?: Db };

export function getDb(): Db {
  if (!globalForDb.keelsonDb) {
    const timeout = env().KEELSON_STATEMENT_TIMEOUT_MS;
    globalForDb.keelsonPool = new Pool({
      connectionString: databaseUrl(),
      max: 10,
      ...(timeout ? { statement_timeout: timeout, idle_in_transaction_session_timeout: timeout } : {}),
    });
    globalForDb.keelsonDb = createDb(globalForDb.keelsonPool);
  }
  return globalForDb.keelsonDb;
}

export async function closeDb(): Promise<void> {
  await globalForDb.keelsonPool?.end();
  globalForDb.keelsonPool = undefined;
  globalForDb.keelsonDb = undefined;
}
