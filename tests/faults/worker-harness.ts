// What the worker fault tests need around the real worker (workers/index.ts): a database of their
// own on the stack's cluster, worker processes they start and kill, a fleet to recompute, and
// pg-boss's job rows to read.
import { type ChildProcess, spawn } from "node:child_process";
import { randomUUID } from "node:crypto";
import { createWriteStream, mkdirSync } from "node:fs";
import path from "node:path";
import { sql } from "drizzle-orm";
import { Pool } from "pg";
import { createDb, type Db } from "@/db/client";
import * as s from "@/db/schema";

const OUTPUT = process.env.TEST_OUTPUT ?? path.resolve("test-output");

/** Runs a command to its end; throws with its exit code otherwise. */
export async function run(command: string, args: string[], env: NodeJS.ProcessEnv): Promise<void> {
  const child = spawn(command, args, { env, stdio: "inherit" });
  const code = await new Promise<number | null>((resolve) => child.on("exit", resolve));
  if (code !== 0) throw new Error(`${command} ${args.join(" ")} exited with ${code}`);
}

/**
 * A migrated database of its own on the stack's cluster (DATABASE_URL names the stack's), so the
 * stack's own worker never takes these jobs: which worker runs what is the point of the tests.
 */
export async function ownDatabase(label: string) {
  const main = process.env.DATABASE_URL!;
  const name = `keelson_${label}_${randomUUID().slice(0, 8)}`;
  const url = main.replace(/\/[^/]+$/, `/${name}`);
  const admin = new Pool({ connectionString: main, max: 1 });
  await admin.query(`create database ${name}`);
  await admin.end();
  await run("node_modules/.bin/tsx", ["scripts/migrate.ts"], { ...process.env, DATABASE_URL: url });
  const pool = new Pool({ connectionString: url, max: 4 });
  return {
    url,
    db: createDb(pool),
    async drop() {
      await pool.end();
      const again = new Pool({ connectionString: main, max: 1 });
      await again.query(`drop database if exists ${name} with (force)`);
      await again.end();
    },
  };
}

export type Worker = { child: ChildProcess; label: string; output: () => string; ready: Promise<void> };

/**
 * The real worker in its own process group (SIGKILL then reaches tsx's node child too), its output
 * kept in memory and in `<TEST_OUTPUT>/faults-<label>.log`; `ready` resolves on its "ready" line.
 */
export function startWorker(label: string, env: NodeJS.ProcessEnv): Worker {
  mkdirSync(OUTPUT, { recursive: true });
  const log = createWriteStream(path.join(OUTPUT, `faults-${label}.log`));
  const child = spawn("node_modules/.bin/tsx", ["--conditions=react-server", "workers/index.ts"], {
    env,
    detached: true,
    stdio: ["ignore", "pipe", "pipe"],
  });
  let text = "";
  const ready = new Promise<void>((resolve, reject) => {
    const take = (chunk: Buffer) => {
      text += chunk.toString();
      log.write(chunk);
      if (text.includes("[worker] ready")) resolve();
    };
    child.stdout!.on("data", take);
    child.stderr!.on("data", take);
    child.once("exit", (code, signal) => reject(new Error(`worker ${label} ended before it was ready (${code ?? signal}):\n${text}`)));
  });
  ready.catch(() => undefined);
  return { child, label, output: () => text, ready };
}

export function killGroup(child: ChildProcess, signal: NodeJS.Signals): void {
  try {
    process.kill(-child.pid!, signal);
  } catch {
    /* already gone */
  }
}

export const exited = (child: ChildProcess): Promise<void> =>
  child.exitCode !== null || child.signalCode !== null
    ? Promise.resolve()
    : new Promise<void>((resolve) => child.once("exit", () => resolve()));

export async function waitUntil<T>(what: string, probe: () => Promise<T | null | undefined | false>, timeoutMs: number): Promise<T> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const value = await probe();
    if (value) return value;
    if (Date.now() > until) throw new Error(`timed out after ${timeoutMs} ms waiting for ${what}`);
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}

/**
 * A company with `vessels` vessels of `routines` calendar routines each (monthly to yearly, last
 * done at staggered days), enough that a vessel's recompute takes a noticeable moment.
 */
export async function seedFleet(db: Db, vessels: number, routines: number) {
  const tag = randomUUID().slice(0, 8);
  const [company] = await db.insert(s.company).values({ name: `Faults ${tag}`, slug: `faults-${tag}` }).returning();
  const companyId = company!.id;
  const ids: string[] = [];
  for (let v = 0; v < vessels; v++) {
    const [ship] = await db
      .insert(s.vessel)
      .values({ companyId, name: `Faults ${v + 1}`, code: `FV${v + 1}`, imoNumber: String(9_100_000 + v), timeZone: "UTC" })
      .returning();
    const [part] = await db
      .insert(s.component)
      .values({ companyId, vesselId: ship!.id, code: "DK", name: "Deck machinery" })
      .returning();
    const rules = ["FREQ=MONTHLY", "FREQ=MONTHLY;INTERVAL=3", "FREQ=MONTHLY;INTERVAL=6", "FREQ=YEARLY"];
    await db.insert(s.routine).values(
      Array.from({ length: routines }, (_, r) => ({
        companyId,
        vesselId: ship!.id,
        componentId: part!.id,
        title: `Check ${r + 1}`,
        calendarRule: rules[r % rules.length]!,
        baselineAt: new Date(Date.now() - (r % 400) * 86_400_000),
      })),
    );
    ids.push(ship!.id);
  }
  return { companyId, vesselIds: ids };
}

export type JobRow = { id: string; state: string; retryCount: number; key: string | null; output: unknown };

/** pg-boss's rows of one queue created since `since` (the database's clock). */
export async function jobsOf(db: Db, queue: string, since: Date): Promise<JobRow[]> {
  const result = await db.execute<JobRow>(
    sql`select id, state::text as state, retry_count as "retryCount", singleton_key as key, output
          from pgboss.job where name = ${queue} and created_on >= ${since} order by created_on`,
  );
  return result.rows;
}

export async function databaseNow(db: Db): Promise<Date> {
  const result = await db.execute<{ now: Date }>(sql`select now() as now`);
  return new Date(result.rows[0]!.now);
}

/**
 * Per vessel: routines, open work orders, and open work orders beyond one per routine. The unique
 * index on (routine, occurrence) already forbids the same occurrence twice; this also catches a
 * second *open* occurrence, which the index would let through.
 */
export async function workOrderTally(db: Db, companyId: string) {
  const result = await db.execute<{ vesselId: string; routines: number; open: number; extra: number }>(sql`
    select v.id as "vesselId",
           (select count(*)::int from routine r where r.vessel_id = v.id) as routines,
           (select count(*)::int from work_order w where w.vessel_id = v.id and w.completed_at is null) as open,
           (select coalesce(sum(n - 1), 0)::int from (
              select count(*) as n from work_order w
               where w.vessel_id = v.id and w.completed_at is null group by w.routine_id) per) as extra
      from vessel v where v.company_id = ${companyId} order by v.code`);
  return result.rows;
}

/**
 * Makes the next `statement` on `table` fail once, then never again: a statement trigger that
 * raises when a sequence, which a rollback does not undo, gives 1. The real handler that runs the
 * statement throws as it would on any database error; nothing in the product changes.
 */
export async function failOnce(db: Db, name: string, table: string, statement: "insert" | "update"): Promise<void> {
  await db.execute(sql.raw(`create sequence ${name}_trip`));
  await db.execute(
    sql.raw(`create function ${name}() returns trigger language plpgsql as $$
      begin
        if nextval('${name}_trip') = 1 then
          raise exception 'fault injected by tests/faults: first % on ${table}', tg_op;
        end if;
        return null;
      end $$`),
  );
  await db.execute(sql.raw(`create trigger ${name} before ${statement} on ${table} for each statement execute function ${name}()`));
}

/** How many times the trigger of `failOnce` fired (1 = it failed its statement and let the rest by). */
export async function tripped(db: Db, name: string): Promise<number> {
  const result = await db.execute<{ n: string | null }>(
    sql.raw(`select case when is_called then last_value end as n from ${name}_trip`),
  );
  return Number(result.rows[0]?.n ?? 0);
}
