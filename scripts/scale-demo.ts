// The driver of `npm run scale-demo` (scripts/scale-demo.sh starts the processes and hands over
// their ids): load through nginx, a fleet recompute sent mid-way, one web process and one worker
// killed (SIGKILL) while both workers are recomputing, then the checks and a short report.
// Exit 0 when every check holds.
import { performance } from "node:perf_hooks";
import { eq, sql } from "drizzle-orm";
import PgBoss from "pg-boss";
import { Pool } from "pg";
import { z } from "zod";
import { createDb } from "@/db/client";
import { company, vessel } from "@/db/schema";
import { demoCompany } from "@/db/seed/scenario";
import { env } from "@/server/env";
import { recomputeFleetJob } from "@/server/jobs/recompute-fleet";
import { sendJob } from "@/server/jobs/send";
import { activeRecomputes, duplicateWorkOrders, recomputeState, replicaState, snapshotScans, storedBatches } from "./scale-demo/checks";
import { failures, LoadClient, readingLoop, readLoop, tally } from "./scale-demo/load";

// The demo's own hand-over from scale-demo.sh, like a test harness's: not Keelson's configuration.
const pids = z.string().transform((s) => s.trim().split(/\s+/).map(Number));
const demo = z
  .object({
    SCALE_PROXY_URL: z.url(),
    SCALE_WEB_PIDS: pids,
    SCALE_WORKER_PIDS: pids,
    // At most 10 minutes: the Hour log batches go a minute apart from yesterday's 09:00 reading, never past now.
    SCALE_DEMO_SECONDS: z.coerce.number().int().min(20).max(600).default(45),
    SCALE_READERS: z.coerce.number().int().min(1).default(8),
  })
  .parse(process.env);

const config = env();
if (!config.KEELSON_READ_DATABASE_URL) throw new Error("KEELSON_READ_DATABASE_URL is not set: start the demo with npm run scale-demo");
const primaryPool = new Pool({ connectionString: config.DATABASE_URL, max: 3 });
const replicaPool = new Pool({ connectionString: config.KEELSON_READ_DATABASE_URL, max: 2 });
const primary = createDb(primaryPool);
const replica = createDb(replicaPool);
const seconds = (ms: number) => (ms / 1000).toFixed(1);
const dbNow = async () => new Date((await primary.execute<{ t: string }>(sql`select now()::text as t`)).rows[0]!.t);
const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

// A job held by a killed worker comes back when pg-boss expires it: after the queue's expiry
// (server/jobs/recompute-vessel.ts), at a maintenance run (every 2 minutes by default). The demo
// shortens both on its own throwaway database (20 s, every 5 s), so it ends within minutes.
const EXPIRE_SECONDS = 20;
await primary.execute(sql`update pgboss.queue set expire_seconds = ${EXPIRE_SECONDS} where name = 'vessel-recompute'`);
const supervisor = new PgBoss({ connectionString: config.DATABASE_URL, schedule: false, migrate: false, maintenanceIntervalSeconds: 5 });
supervisor.on("error", (error) => console.error("[scale-demo] pg-boss maintenance", error));
await supervisor.start();

const [co] = await primary.select().from(company).where(eq(company.slug, demoCompany.slug));
const [ag] = await primary.select().from(vessel).where(eq(vessel.code, "AG"));
if (!co || !ag) throw new Error("the demo company is not seeded");
const workOrdersBefore = (await duplicateWorkOrders(primary)).total;
const scansBefore = await snapshotScans(replica);

const client = new LoadClient(demo.SCALE_PROXY_URL);
const password = config.KEELSON_DEMO_PASSWORD ?? "";
const office = await client.signIn("super@brightwater.example", password);
const chief = await client.signIn("chief@brightwater.example", password);
const engineer = await client.signIn("second@brightwater.example", password);
const reads = [
  { route: "fleet board", session: office, path: "/api/fleet/board" },
  { route: "overdue list", session: office, path: "/api/fleet/overdue" },
  { route: "backlog", session: chief, path: `/api/vessels/${ag.id}/backlog` },
  { route: "health", session: null, path: "/api/health" },
];

const t0 = performance.now();
const loadEnds = t0 + demo.SCALE_DEMO_SECONDS * 1000;
const loadOver = () => performance.now() >= loadEnds;
const at = () => `t+${seconds(performance.now() - t0)} s`;
const events: string[] = [];
console.log(`[scale-demo] load for ${demo.SCALE_DEMO_SECONDS} s: ${demo.SCALE_READERS} readers and one engineer through ${demo.SCALE_PROXY_URL}`);
const load = Promise.all([
  readingLoop(client, loadOver, engineer, ag.id),
  Promise.all(Array.from({ length: demo.SCALE_READERS }, (_, i) => readLoop(client, loadOver, reads, i))),
]);

// A fifth of the way in: the nightly fleet recompute, sent as its cron would.
await sleep(demo.SCALE_DEMO_SECONDS * 200);
const triggeredAt = await dbNow();
await sendJob(primary, recomputeFleetJob, {});
events.push(`${at()} fleet recompute sent`);

// Kill when both workers hold a vessel's recompute (two active jobs: batch size 1 each), so the
// killed worker dies in the middle of one; after 10 s of waiting, when at least one is active.
const waitFrom = performance.now();
let active = 0;
while (performance.now() - waitFrom < 15_000) {
  active = await activeRecomputes(primary);
  if (active >= 2 || (active >= 1 && performance.now() - waitFrom > 10_000)) break;
  await sleep(10);
}
process.kill(demo.SCALE_WORKER_PIDS[0]!, "SIGKILL");
process.kill(demo.SCALE_WEB_PIDS[0]!, "SIGKILL");
events.push(`${at()} SIGKILL to worker 1 (pid ${demo.SCALE_WORKER_PIDS[0]}) and web 1 (pid ${demo.SCALE_WEB_PIDS[0]}) with ${active} recomputes running`);

const [hourLog] = await load;
events.push(`${at()} load over`);

// The surviving worker finishes the fleet; the dead worker's job comes back after its expiry.
const recomputeLimit = performance.now() + 180_000;
let recompute = await recomputeState(primary, triggeredAt);
while ((recompute.recomputed < recompute.vessels || recompute.waiting > 0) && performance.now() < recomputeLimit) {
  await sleep(500);
  recompute = await recomputeState(primary, triggeredAt);
}
events.push(`${at()} recompute: ${recompute.recomputed} of ${recompute.vessels} vessels, ${recompute.waiting} jobs waiting`);

const duplicates = await duplicateWorkOrders(primary);
const stored = await storedBatches(primary, ag.id, hourLog.acknowledged);
// A batch answered 502 was in flight on the killed web process: written or not, as it happened.
const storedUnanswered = await storedBatches(primary, ag.id, hourLog.unacknowledged);
const standby = await replicaState(primary, replica, co.id, triggeredAt);
const scansAfter = await snapshotScans(replica);
const boardNow = await client.call("fleet board", office, "GET", "/api/fleet/board");

const routes = tally(client.outcomes);
const failed = routes.reduce((n, r) => n + r.failed, 0);
const retryable = routes.reduce((n, r) => n + r.retryable, 0);
const retried = routes.reduce((n, r) => n + r.retried, 0);
const checks: [string, boolean][] = [
  [`every request answered (${client.outcomes.length} requests: ${retried} GETs answered on their one retry, ${retryable} ended in a retryable 502/503/504, ${failed} failed or hung)`, failed === 0],
  [`every acknowledged Hour log batch is stored (${stored} of ${hourLog.acknowledged.length})`, stored === hourLog.acknowledged.length],
  [`fleet recompute completed on every vessel after the kill (${recompute.recomputed}/${recompute.vessels}, ${recompute.retried} jobs taken back from the dead worker)`, recompute.recomputed === recompute.vessels && recompute.waiting === 0],
  [`no duplicate work order (${duplicates.sameOccurrence} doubled occurrences, ${duplicates.twoOpen} routines with two open; ${workOrdersBefore} → ${duplicates.total} work orders)`, duplicates.sameOccurrence === 0 && duplicates.twoOpen === 0],
  [`replica is a hot standby, streaming: ${standby.streaming}`, standby.inRecovery && standby.streaming.startsWith("streaming")],
  [`replica caught up with the primary's WAL (${standby.caughtUpMs === null ? "not within 30 s" : `${standby.caughtUpMs} ms after the load`})`, standby.caughtUpMs !== null],
  [`replica serves the recomputed board: same snapshot rows as the primary, ${standby.freshVessels}/${recompute.vessels} vessels retaken after the recompute was sent`, standby.sameBoard && standby.freshVessels === recompute.vessels],
  [`the board was read from the replica (${scansAfter - scansBefore} scans of vessel_snapshot there) and answers through nginx after the kill`, scansAfter > scansBefore && boardNow !== undefined],
];

console.log("\n[scale-demo] what happened");
for (const e of events) console.log(`  ${e}`);
console.log(
  `  ${hourLog.posted} Hour log batches posted, ${hourLog.acknowledged.length} acknowledged (201); ` +
    `of the ${hourLog.unacknowledged.length} others, ${storedUnanswered} stored before the web process died`,
);
console.log("\n  route            requests   2xx  retried  502/503/504  failed   p50 ms   p95 ms   max ms");
const cell = (v: number, width: number) => String(v).padStart(width);
for (const r of routes)
  console.log(`  ${r.route.padEnd(16)} ${cell(r.requests, 8)} ${cell(r.ok, 5)} ${cell(r.retried, 8)} ${cell(r.retryable, 12)} ${cell(r.failed, 7)} ${cell(r.p50, 8)} ${cell(r.p95, 8)} ${cell(r.max, 8)}`);
for (const f of failures(client.outcomes)) console.log(`  ${f}`);
console.log("\n[scale-demo] checks");
for (const [what, ok] of checks) console.log(`  ${ok ? "✓" : "✗"} ${what}`);
const green = checks.every(([, ok]) => ok);
console.log(green ? "\n[scale-demo] all checks hold" : "\n[scale-demo] a check failed");

await supervisor.stop({ graceful: false, wait: true, timeout: 2_000 });
await Promise.all([primaryPool.end(), replicaPool.end()]);
process.exit(green ? 0 : 1);
