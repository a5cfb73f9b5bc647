// The worker under faults: killed with SIGKILL in the middle of a fleet recompute and replaced, two
// workers at once, and job handlers that throw — each time every vessel's work orders end computed,
// one open work order per routine, pg-boss's rows end "completed", and no mail goes out twice.
//
// The workers are the real `workers/index.ts`, started here on a database of their own (same
// cluster as the stack), so the stack's worker cannot take the jobs. Two things are shortened for
// the test, as tests/mail/worker-kill.test.ts shortens the mail lease: the recompute jobs' expiry
// (the product's 5 minutes, checked below, set to 25 s on this database's queue before the fleet
// run) and pg-boss's housekeeping, which expires a dead worker's jobs (every 2 minutes in a
// worker, pg-boss's default; every second here, by a pg-boss instance of the test's own that runs
// no job). A handler is made to throw by a database condition, never by a change to the product:
// a statement trigger that fails the first insert into work_order, or the first update of
// mail_outbox (the sender's claim), once (`failOnce`).
import { eq } from "drizzle-orm";
import PgBoss from "pg-boss";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { mailOutbox, workOrder } from "@/db/schema";
import { recomputeFleetJob } from "@/server/jobs/recompute-fleet";
import { recomputeVesselJob } from "@/server/jobs/recompute-vessel";
import { mailSendJob, requestMailSend } from "@/server/jobs/mail-send";
import { sendJob } from "@/server/jobs/send";
import { enqueueMail } from "@/server/mail/outbox";
import { lockVesselWorkOrders } from "@/server/work-orders/lock";
import { caughtFor, freshAddress, testMail } from "../mail/mail-fake";
import {
  databaseNow,
  exited,
  failOnce,
  jobsOf,
  killGroup,
  ownDatabase,
  seedFleet,
  startWorker,
  tripped,
  waitUntil,
  type Worker,
  workOrderTally,
} from "./worker-harness";

const VESSELS = 10;
const ROUTINES = 200;
const TEST_EXPIRY_SECONDS = 25;

let own: Awaited<ReturnType<typeof ownDatabase>>;
let fleet: Awaited<ReturnType<typeof seedFleet>>;
let housekeeper: PgBoss;
const workers: Worker[] = [];

function worker(label: string): Worker {
  const w = startWorker(label, { ...process.env, DATABASE_URL: own.url });
  workers.push(w);
  return w;
}

/** Sends the nightly fan-out and waits until a vessel job per vessel exists and all are completed. */
async function recomputeFleet(timeoutMs: number) {
  const since = await databaseNow(own.db);
  await sendJob(own.db, recomputeFleetJob, {});
  return waitUntil(
    "every vessel's recompute completed",
    async () => {
      const jobs = await jobsOf(own.db, recomputeVesselJob.name, since);
      const done = jobs.filter((j) => j.state === "completed").length;
      return jobs.length === VESSELS && done === VESSELS && jobs;
    },
    timeoutMs,
  );
}

async function expectEveryVesselComputed() {
  const tally = await workOrderTally(own.db, fleet.companyId);
  expect(tally).toHaveLength(VESSELS);
  for (const v of tally) expect(v, `vessel ${v.vesselId}`).toMatchObject({ routines: ROUTINES, open: ROUTINES, extra: 0 });
}

beforeAll(async () => {
  own = await ownDatabase("faults_worker");
  fleet = await seedFleet(own.db, VESSELS, ROUTINES);
  housekeeper = new PgBoss({ connectionString: own.url, maintenanceIntervalSeconds: 1, schedule: false });
  housekeeper.on("error", (error) => console.error("[faults housekeeper]", error));
  await housekeeper.start();
}, 120_000);

afterAll(async () => {
  for (const w of workers) killGroup(w.child, "SIGKILL");
  await Promise.all(workers.map((w) => exited(w.child)));
  await housekeeper?.stop({ graceful: false, wait: true });
  await own?.drop();
}, 60_000);

// First, on a worker that is then stopped as an operator would (SIGTERM), so no run of a killed
// worker (a mail-send or reminders run holds its "singleton" queue until it expires) is in the way.
describe("a handler that throws", () => {
  let steady: Worker;
  beforeAll(async () => {
    steady = worker("steady");
    await steady.ready;
  }, 60_000);
  afterAll(async () => {
    killGroup(steady.child, "SIGTERM");
    await exited(steady.child);
  }, 30_000);

  it("the recompute is retried by pg-boss and completes, with no duplicate work order", async () => {
    const vesselId = fleet.vesselIds[0]!;
    await own.db.delete(workOrder).where(eq(workOrder.vesselId, vesselId));
    await failOnce(own.db, "faults_work_order_insert", "work_order", "insert");
    const since = await databaseNow(own.db);
    await sendJob(own.db, recomputeVesselJob, { companyId: fleet.companyId, vesselId });
    const [job] = await waitUntil(
      "the failed recompute retried and completed",
      async () => {
        const rows = await jobsOf(own.db, recomputeVesselJob.name, since);
        return rows.length === 1 && rows[0]!.state === "completed" && rows;
      },
      30_000,
    );
    expect(await tripped(own.db, "faults_work_order_insert")).toBeGreaterThanOrEqual(2);
    expect(job!.retryCount).toBe(1);
    const [tally] = (await workOrderTally(own.db, fleet.companyId)).filter((v) => v.vesselId === vesselId);
    expect(tally).toMatchObject({ routines: ROUTINES, open: ROUTINES, extra: 0 });
  }, 60_000);

  it("the mail-send job is retried by pg-boss and every message arrives exactly once", async () => {
    const to = freshAddress("faults-throwing-sender");
    const COUNT = 12;
    await failOnce(own.db, "faults_mail_claim", "mail_outbox", "update");
    const since = await databaseNow(own.db);
    await own.db.transaction(async (tx) => {
      for (let i = 0; i < COUNT; i++) await enqueueMail(tx, testMail(fleet.companyId, to, `faults-${i}-${to}`));
      await requestMailSend(tx);
    });

    await waitUntil("every message caught", async () => (await caughtFor(to)).length >= COUNT, 60_000);
    // Room for a duplicate to arrive, had the failed run sent anything.
    await new Promise((resolve) => setTimeout(resolve, 2000));
    const caught = await caughtFor(to);
    const rows = await own.db.select().from(mailOutbox).where(eq(mailOutbox.companyId, fleet.companyId));
    expect(caught).toHaveLength(COUNT);
    expect(new Set(caught.map((m) => m.messageId))).toEqual(new Set(rows.map((r) => r.messageId)));
    expect(caught.every((m) => m.company === fleet.companyId)).toBe(true);
    // The failed claim rolled back: each row was claimed once, by the run that sent it.
    expect(rows.map((r) => [r.status, r.attempts])).toEqual(rows.map(() => ["sent", 1]));

    const runs = await jobsOf(own.db, mailSendJob.name, since);
    const retried = runs.filter((j) => j.retryCount > 0);
    expect(retried.length, JSON.stringify(runs)).toBeGreaterThanOrEqual(1);
    expect(retried.every((j) => j.state === "completed")).toBe(true);
  }, 90_000);
});

describe("the worker killed in the middle of a fleet recompute", () => {
  it("a second worker finishes it: every vessel computed once, every job completed", async () => {
    // The product's expiry, as the migration wrote it, before the test shortens it.
    const queue = await housekeeper.getQueue(recomputeVesselJob.name);
    expect(queue?.expireInSeconds).toBe(300);
    // One vessel's work-order lock held by the test (as a completion being saved would hold it),
    // so the worker is surely in the middle of that vessel's job when it is killed.
    const held = fleet.vesselIds[2]!;
    let release!: () => void;
    const released = new Promise<void>((resolve) => (release = resolve));
    const holding = new Promise<void>((taken, failed) => {
      own.db
        .transaction(async (tx) => {
          await lockVesselWorkOrders(tx, held);
          taken();
          await released;
        })
        .catch(failed);
    });
    await holding;

    const since = await databaseNow(own.db);
    const first = worker("killed");
    await first.ready;
    // After the worker's start, which writes the queue's options again; its jobs keep this expiry.
    await housekeeper.updateQueue(recomputeVesselJob.name, {
      name: recomputeVesselJob.name,
      ...recomputeVesselJob.queue,
      expireInSeconds: TEST_EXPIRY_SECONDS,
    });
    await sendJob(own.db, recomputeFleetJob, {});
    await waitUntil(
      "the held vessel's job running",
      async () => (await jobsOf(own.db, recomputeVesselJob.name, since)).some((j) => j.key === held && j.state === "active"),
      60_000,
    );
    killGroup(first.child, "SIGKILL");
    await exited(first.child);
    expect(first.child.signalCode).toBe("SIGKILL");
    // Read after the kill: nothing changes these rows until the next worker starts.
    const atKill = await jobsOf(own.db, recomputeVesselJob.name, since);
    release();
    const done = atKill.filter((j) => j.state === "completed").length;
    console.log(`[faults] killed after ${done} of ${VESSELS} vessels, in the middle of ${held}`);
    expect(atKill).toHaveLength(VESSELS);
    expect(done).toBeLessThan(VESSELS);
    expect(atKill.filter((j) => j.state === "active").map((j) => j.key)).toEqual([held]);

    // A reading on the held vessel now queues its next run: it must not hold up the other vessels
    // while the dead worker's run waits to expire (with the "stately" policy it held them all).
    await sendJob(own.db, recomputeVesselJob, { companyId: fleet.companyId, vesselId: held });
    worker("after-kill");
    const dead = atKill.find((j) => j.key === held)!;
    const others = await waitUntil(
      "the other vessels' recomputes completed",
      async () => {
        const rows = await jobsOf(own.db, recomputeVesselJob.name, since);
        return rows.filter((j) => j.id !== dead.id).every((j) => j.state === "completed") && rows;
      },
      60_000,
    );
    expect(others.find((j) => j.id === dead.id)?.state, "the dead worker's run, still waiting to expire").toBe("active");
    // The dead worker's run stays "active" until it expires; pg-boss then retries it.
    const jobs = await waitUntil(
      "every vessel's recompute completed",
      async () => {
        const rows = await jobsOf(own.db, recomputeVesselJob.name, since);
        return rows.every((j) => j.state === "completed") && rows;
      },
      90_000,
    );
    expect(jobs.filter((j) => j.retryCount > 0).map((j) => j.id)).toEqual([dead.id]);
    const fan = await jobsOf(own.db, recomputeFleetJob.name, since);
    expect(fan.map((j) => j.state)).toEqual(["completed"]);
    await expectEveryVesselComputed();
  }, 150_000);
});

describe("two workers at once", () => {
  it("recompute the fleet from nothing to the same work orders as one worker did", async () => {
    const before = await own.db
      .select({ routineId: workOrder.routineId, dueDate: workOrder.dueDate, state: workOrder.state })
      .from(workOrder)
      .where(eq(workOrder.companyId, fleet.companyId));
    await own.db.delete(workOrder).where(eq(workOrder.companyId, fleet.companyId));

    const extra = worker("second-at-once");
    await extra.ready;
    const pair = workers.slice(-2);
    const mark = pair.map((w) => w.output().length);
    const jobs = await recomputeFleet(90_000);
    expect(jobs.every((j) => j.retryCount === 0)).toBe(true);
    await expectEveryVesselComputed();
    const after = await own.db
      .select({ routineId: workOrder.routineId, dueDate: workOrder.dueDate, state: workOrder.state })
      .from(workOrder)
      .where(eq(workOrder.companyId, fleet.companyId));
    const byRoutine = (rows: typeof before) => new Map(rows.map((r) => [r.routineId, `${r.dueDate?.toISOString()} ${r.state}`]));
    expect(byRoutine(after)).toEqual(byRoutine(before));
    // Both took part (each logs a line per vessel it recomputed).
    const share = pair.map((w, i) => (w.output().slice(mark[i]).match(/\[worker\] vessel-recompute:/g) ?? []).length);
    console.log(`[faults] vessels recomputed per worker: ${share.join(" + ")}`);
    expect(share.reduce((a, b) => a + b, 0)).toBeGreaterThanOrEqual(VESSELS);
  }, 120_000);
});

