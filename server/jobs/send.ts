// Sending a job: an INSERT into pg-boss's job table on the caller's own connection, so a job
// caused by a write commits with it or not at all (pg-boss 10 accepts a `db` per send). The web
// never opens a pg-boss pool of its own; the worker creates the queues (and `npm start` / the
// tests create them at migration, so a send before the worker's first start is not lost).
import PgBoss from "pg-boss";
import { type SQL, sql } from "drizzle-orm";
import type { z } from "zod";
import type { Db, Tx } from "@/db/client";
import type { JobDefinition } from "./definition";

/** A connection a job is sent on: the app's pool, or the transaction of the write that caused it. */
export type JobConnection = Db | Tx;

// A boss that is never started: it only words the INSERT; every send names its connection.
const globalForBoss = globalThis as unknown as { keelsonJobSender?: PgBoss };
function sender(): PgBoss {
  globalForBoss.keelsonJobSender ??= new PgBoss({
    db: {
      executeSql: () => Promise.reject(new Error("a job must be sent on a connection (sendJob)")),
    },
  });
  return globalForBoss.keelsonJobSender;
}

/**
 * pg-boss's SQL with `$1…$n` placeholders, run through Drizzle on the given connection. Every
 * value is one bound parameter (`sql.param`), so an array or an object is never spread into SQL.
 */
export function bossConnection(connection: JobConnection): PgBoss.Db {
  return {
    async executeSql(text: string, values: unknown[] = []) {
      const parts = text.split(/\$(\d+)/);
      const chunks: SQL[] = parts.map((part, i) =>
        i % 2 === 0 ? sql.raw(part) : sql`${sql.param(values[Number(part) - 1] ?? null)}`,
      );
      const result = await connection.execute(sql.join(chunks));
      return { rows: result.rows };
    },
  };
}

/**
 * Sends a job on `connection`. Inside a transaction, call it as the write's last statement: a
 * send coalesced per key ("short", "stately") waits for another uncommitted send of the same key,
 * and holding no further locks after it is what keeps two such writers from deadlocking.
 */
export async function sendJob<S extends z.ZodType>(
  connection: JobConnection,
  job: JobDefinition<S>,
  payload: z.input<S>,
): Promise<void> {
  const data = job.payload.parse(payload) as object;
  await sender().send(job.name, data, {
    db: bossConnection(connection),
    ...(job.singletonKey ? { singletonKey: job.singletonKey(data as z.output<S>) } : {}),
  });
}
