// PostgreSQL stopped and started again while requests arrive. The test has a stack of its own, so
// the shared one is never stopped: a cluster made with scripts/lib.sh's own `pg_up` (its own port,
// under .data/faults-outage-<pid>), migrated, a company of the fixtures, `next start` from the
// build the test run already made (KEELSON_DIST_DIR) on its own port, and the real worker.
//
// Two loops of requests (health, a signed-in GET, a reading written) run throughout. While the
// database is down each answer must be a 503 problem with Retry-After within a few seconds (not a
// hang, not a 500); once it is up again the web and the worker must recover by themselves within
// RECOVERY_MS, and every reading acknowledged with a 201 must be stored.
import { type ChildProcess, spawn } from "node:child_process";
import { createWriteStream } from "node:fs";
import path from "node:path";
import { and, eq, gte, sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as s from "@/db/schema";
import { shipClock, shipDay } from "@/server/format/hours";
import { recomputeVesselJob } from "@/server/jobs/recompute-vessel";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { databaseNow, exited, killGroup, run, startWorker, waitUntil, type Worker } from "./worker-harness";
import { outageCluster, request, type Sent } from "./outage-harness";

const OUTPUT = process.env.TEST_OUTPUT ?? path.resolve("test-output");
/** How long an answer may take while the database is down: a refused connection is immediate. */
const ANSWER_MS = 5_000;
/** How long after PostgreSQL is back the web and the worker may take to serve again. */
const RECOVERY_MS = 20_000;

const cluster = outageCluster(`faults-outage-${process.pid}`);
let f: Fixture;
let web: ChildProcess;
let worker: Worker;
let appUrl: string;

function startWeb(port: number): ChildProcess {
  const log = createWriteStream(path.join(OUTPUT, "faults-outage-app.log"));
  const child = spawn(
    "node_modules/.bin/next",
    ["start", "-H", "127.0.0.1", "-p", String(port), "--keepAliveTimeout", "65000"],
    {
      env: { ...process.env, DATABASE_URL: cluster.url, BETTER_AUTH_URL: appUrl, KEELSON_STATEMENT_TIMEOUT_MS: "30000" },
      detached: true,
      stdio: ["ignore", "pipe", "pipe"],
    },
  );
  child.stdout!.pipe(log);
  child.stderr!.pipe(log);
  return child;
}

beforeAll(async () => {
  await cluster.up();
  await run("node_modules/.bin/tsx", ["scripts/migrate.ts"], { ...process.env, DATABASE_URL: cluster.url });
  // The fixtures' pool reads DATABASE_URL on first use: this file's process talks to its own cluster.
  process.env.DATABASE_URL = cluster.url;
  f = await createCompany("faults-outage");
  const port = await cluster.freePort();
  appUrl = `http://127.0.0.1:${port}`;
  web = startWeb(port);
  worker = startWorker("outage-worker", { ...process.env, DATABASE_URL: cluster.url });
  await worker.ready;
  await waitUntil("the web answering", async () => (await request(appUrl, null, "GET", "/api/health")).status === 200, 60_000);
}, 180_000);

afterAll(async () => {
  for (const child of [web, worker?.child]) if (child) killGroup(child, "SIGKILL");
  await Promise.all([web, worker?.child].filter(Boolean).map((c) => exited(c!)));
  await closeTestDb();
  await cluster.destroy();
}, 60_000);

describe("PostgreSQL stopped and started while requests arrive", () => {
  it("answers 503 with Retry-After meanwhile, recovers by itself, and keeps every acknowledged write", async () => {
    // tests/support/http.ts reads the app's address when it loads: loaded now, it talks to this one.
    process.env.KEELSON_TEST_URL = appUrl;
    const { signIn } = await import("../support/http");
    const session = await signIn(f.users.engineer.email, PASSWORD);
    const vessel = f.vesselA;
    const readings = `/api/vessels/${vessel.id}/readings`;
    let minute = 0;
    const acknowledged: Date[] = [];
    const sent: (Sent & { kind: string })[] = [];

    // One reading a minute after the fixture's of 24 h ago, 0.1 h every 10 minutes: always valid.
    const requests = [
      { kind: "health", go: () => request(appUrl, null, "GET", "/api/health") },
      { kind: "history", go: () => request(appUrl, session, "GET", `${readings}?counterId=${f.counters.main.id}&days=2`) },
      {
        kind: "reading",
        go: async () => {
          minute += 1;
          const readAt = new Date(f.lastReadAt.getTime() + minute * 60_000);
          const value = 1000 + Math.floor(minute / 10) / 10;
          const body = { shipDay: shipDay(readAt, vessel.timeZone), time: shipClock(readAt, vessel.timeZone), entries: [{ counterId: f.counters.main.id, value }] };
          const answer = await request(appUrl, session, "POST", readings, body);
          if (answer.status === 201) acknowledged.push(readAt);
          return answer;
        },
      },
    ];
    let running = true;
    const loop = async () => {
      for (let i = 0; running; i++) {
        const r = requests[i % requests.length]!;
        sent.push({ kind: r.kind, ...(await r.go()) });
      }
    };
    const loops = [loop(), loop()];
    const pause = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

    await pause(2_000);
    // This process's own pool would hear its idle connections end, unheard: closed, it opens anew.
    await closeTestDb();
    await cluster.stop();
    const stoppedAt = Date.now();
    await pause(5_000);
    const startingAt = Date.now();
    await cluster.start();
    const startedAt = Date.now();
    const since = await databaseNow(testDb());
    const webBack = await waitUntil(
      "health, a signed-in GET and a reading all answered again",
      async () => {
        const after = sent.filter((r) => r.startedAt >= startedAt);
        const ok = (kind: string, status: number) => after.find((r) => r.kind === kind && r.status === status);
        const all = [ok("health", 200), ok("history", 200), ok("reading", 201)];
        return all.every(Boolean) && Math.max(...all.map((r) => r!.endedAt)) - startedAt;
      },
      RECOVERY_MS,
    );
    await pause(1_000);
    running = false;
    await Promise.all(loops);

    const during = sent.filter((r) => r.startedAt >= stoppedAt && r.endedAt <= startingAt);
    // Nothing hung, nothing failed without an answer, and no 5xx but the 503.
    const bad = sent.filter((r) => r.status === 0 || (r.status >= 500 && r.status !== 503));
    expect(bad, `no answer or a 5xx other than 503: ${JSON.stringify(bad)}`).toEqual([]);
    expect(during.length).toBeGreaterThan(10);
    for (const r of during) {
      expect(r, `${r.kind} during the outage`).toMatchObject({ status: 503, contentType: "application/problem+json", retryAfter: "5" });
      expect(r.endedAt - r.startedAt, `${r.kind} answered within ${ANSWER_MS} ms`).toBeLessThan(ANSWER_MS);
    }
    expect(during.map((r) => r.kind)).toEqual(expect.arrayContaining(["health", "history", "reading"]));

    // Every acknowledged reading is stored, once.
    const stored = await testDb()
      .select({ readAt: s.reading.readAt })
      .from(s.reading)
      .where(and(eq(s.reading.counterId, f.counters.main.id), gte(s.reading.readAt, new Date(f.lastReadAt.getTime() + 1))));
    const times = new Set(stored.map((r) => r.readAt.getTime()));
    expect(times.size).toBe(stored.length);
    expect(acknowledged.filter((t) => !times.has(t.getTime())), "acknowledged readings missing").toEqual([]);

    // The worker recovered too: a recompute asked for after the restart is done, and it still runs.
    await waitUntil(
      "a recompute queued after the restart completed",
      async () => {
        if (worker.child.exitCode !== null) throw new Error(`the worker ended:\n${worker.output().slice(-1500)}`);
        const done = await testDb().execute<{ n: number }>(
          sql`select count(*)::int as n from pgboss.job where name = ${recomputeVesselJob.name} and created_on >= ${since} and state = 'completed'`,
        );
        return done.rows[0]!.n > 0;
      },
      RECOVERY_MS,
    );
    const workerBack = Date.now() - startedAt;
    console.log(
      `[faults] ${sent.length} requests, ${during.length} during the 5 s outage (slowest ${Math.max(...during.map((r) => r.endedAt - r.startedAt))} ms); ` +
        `web serving again ${webBack} ms after PostgreSQL started, worker's recompute done within ${workerBack} ms; ${acknowledged.length} readings acknowledged`,
    );
    expect(worker.child.exitCode, worker.output().slice(-2000)).toBeNull();
    expect(web.exitCode).toBeNull();
  }, 120_000);
});
