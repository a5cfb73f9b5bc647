// Killing the worker mid-batch: 50 messages, a worker process killed with SIGKILL after the first
// few arrive, a second worker started; every message arrives exactly once (by Message-ID).
//
// The workers run against a database of their own (same cluster, migrated here), so the stack's
// worker cannot take the messages first.
//
// The one window where at-least-once remains: the fake answered 250 and the worker died before
// its UPDATE … status = 'sent' committed; the next worker sends that message again (SMTP cannot
// ask a relay whether it holds a message). The claim makes the window tiny: the row is marked
// right after the 250 (a millisecond on loopback), rows claimed but not yet tried wait out their
// lease and then go exactly once, and no second worker can hold a row meanwhile (FOR UPDATE SKIP
// LOCKED, status 'sending'). So that the test is about the claim and not about that window, it
// kills the worker while the fake holds back the next 250: a kill timed by the arrival of a
// message lands in the window far more often than chance (a run on a busy machine did, once).
import { type ChildProcess, spawn } from "node:child_process";
import { randomUUID } from "node:crypto";
import { createWriteStream, mkdirSync } from "node:fs";
import path from "node:path";
import { eq } from "drizzle-orm";
import { Pool } from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createDb, type Db } from "@/db/client";
import { company, mailOutbox } from "@/db/schema";
import { enqueueMail } from "@/server/mail/outbox";
import { caughtFor, freshAddress, slowDown, testMail, waitFor } from "./mail-fake";

const OUTPUT = process.env.TEST_OUTPUT ?? path.resolve("test-output");
const MAIN_URL = process.env.DATABASE_URL!;
const dbName = `keelson_mailkill_${randomUUID().slice(0, 8)}`;
const url = MAIN_URL.replace(/\/[^/]+$/, `/${dbName}`);
const to = freshAddress("killed-worker");
const COUNT = 50;

let pool: Pool;
let db: Db;
const workers: ChildProcess[] = [];

async function run(command: string, args: string[], env: NodeJS.ProcessEnv): Promise<void> {
  const child = spawn(command, args, { env, stdio: "inherit" });
  const code = await new Promise<number | null>((resolve) => child.on("exit", resolve));
  if (code !== 0) throw new Error(`${command} ${args.join(" ")} exited with ${code}`);
}

/** A worker in its own process group, so SIGKILL reaches tsx's child node process too. */
function startWorker(label: string): ChildProcess {
  mkdirSync(OUTPUT, { recursive: true });
  const log = createWriteStream(path.join(OUTPUT, `mail-${label}.log`));
  const child = spawn("node_modules/.bin/tsx", ["--conditions=react-server", "workers/index.ts"], {
    env: { ...process.env, DATABASE_URL: url, KEELSON_MAIL_LEASE_SECONDS: "3" },
    detached: true,
    stdio: ["ignore", "pipe", "pipe"],
  });
  child.stdout!.pipe(log);
  child.stderr!.pipe(log);
  workers.push(child);
  return child;
}

function killGroup(child: ChildProcess, signal: NodeJS.Signals) {
  try {
    process.kill(-child.pid!, signal);
  } catch {
    /* already gone */
  }
}

const exited = (child: ChildProcess) =>
  child.exitCode !== null || child.signalCode !== null
    ? Promise.resolve()
    : new Promise<void>((resolve) => child.once("exit", () => resolve()));

beforeAll(async () => {
  const admin = new Pool({ connectionString: MAIN_URL, max: 1 });
  await admin.query(`create database ${dbName}`);
  await admin.end();
  await run("node_modules/.bin/tsx", ["scripts/migrate.ts"], { ...process.env, DATABASE_URL: url });
  pool = new Pool({ connectionString: url, max: 2 });
  db = createDb(pool);
}, 120_000);

afterAll(async () => {
  await slowDown(0, to);
  for (const child of workers) killGroup(child, "SIGKILL");
  await Promise.all(workers.map(exited));
  await pool?.end();
  const admin = new Pool({ connectionString: MAIN_URL, max: 1 });
  await admin.query(`drop database if exists ${dbName} with (force)`);
  await admin.end();
}, 60_000);

describe("a worker killed mid-batch", () => {
  it("sends every message exactly once across the kill and a restart", async () => {
    const [c] = await db
      .insert(company)
      .values({ name: "Kill test", slug: `kill-${dbName}` })
      .returning();
    for (let i = 0; i < COUNT; i++) await enqueueMail(db, testMail(c!.id, to, `kill-${i}-${to}`));
    await slowDown(150, to);

    const first = startWorker("worker-killed");
    await waitFor("the first few messages", async () => (await caughtFor(to)).length >= 5, 60_000);
    // Hold the next 250 for a minute; a message accepted just before has a second to be marked.
    await slowDown(60_000, to);
    await new Promise((resolve) => setTimeout(resolve, 1000));
    const seenAtKill = (await caughtFor(to)).length;
    killGroup(first, "SIGKILL");
    await exited(first);
    expect(first.signalCode).toBe("SIGKILL");

    // Mid-batch: some sent, the rest of the claimed batch left 'sending', the others pending.
    const rows = await db.select().from(mailOutbox).where(eq(mailOutbox.companyId, c!.id));
    const by = (status: string) => rows.filter((r) => r.status === status).length;
    expect(seenAtKill).toBeLessThan(COUNT);
    expect(by("sent")).toBeLessThan(COUNT);
    expect(by("sending")).toBeGreaterThan(0);
    expect(by("pending")).toBeGreaterThan(0);

    await slowDown(20, to);
    startWorker("worker-restarted");
    await waitFor(
      "every row sent",
      async () => {
        const left = await db.select({ id: mailOutbox.id }).from(mailOutbox).where(eq(mailOutbox.status, "sent"));
        return left.length === COUNT;
      },
      90_000,
    );

    const caught = await caughtFor(to);
    const sentRows = await db.select().from(mailOutbox).where(eq(mailOutbox.companyId, c!.id));
    const ids = caught.map((m) => m.messageId);
    expect(caught).toHaveLength(COUNT);
    expect(new Set(ids).size).toBe(COUNT);
    expect(new Set(ids)).toEqual(new Set(sentRows.map((r) => r.messageId)));
  }, 180_000);
});
