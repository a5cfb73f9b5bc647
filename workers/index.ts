// The worker process: pg-boss on the application's PostgreSQL. Several workers may run at once;
// pg-boss hands each job to one of them.
import PgBoss from "pg-boss";
import { closeDb, databaseUrl, getDb } from "@/db/client";
import { closeMailTransport } from "@/server/mail/transport";
import { mailSend, stopMailFollowUp } from "./jobs/mail-send";
import { recomputeFleet } from "./jobs/recompute-fleet";
import { recomputeVessel } from "./jobs/recompute-vessel";
import { reminders } from "./jobs/reminders";
import { scheduledJobs } from "./jobs/schedule";

const boss = new PgBoss({
  connectionString: databaseUrl(),
  cronMonitorIntervalSeconds: Number(process.env.KEELSON_CRON_MONITOR_SECONDS ?? 30),
});
boss.on("error", (error) => console.error("[worker] pg-boss error", error));

await boss.start();
// "stately": at most one queued and one running job per vessel, so a burst of readings gives one run.
await boss.createQueue(recomputeVessel.name, { name: recomputeVessel.name, policy: "stately", retryLimit: 3 });
await boss.createQueue(recomputeFleet.name, { name: recomputeFleet.name, policy: "singleton" });

const db = getDb();
await boss.work(recomputeVessel.name, { pollingIntervalSeconds: 1, batchSize: 1 }, async (jobs) => {
  for (const job of jobs) {
    const payload = recomputeVessel.payload.parse(job.data);
    const result = await recomputeVessel.handle(db, payload);
    console.log(
      `[worker] ${recomputeVessel.name} ${payload.vesselId}: ${result.counters} counters, ${result.created} work orders created, ${result.updated} updated, ${result.stateChanges} state changes` +
        (result.skipped.length ? `, ${result.skipped.length} routines skipped` : ""),
    );
  }
});
await boss.work(recomputeFleet.name, async () => {
  const result = await recomputeFleet.handle(db, boss);
  console.log(`[worker] ${recomputeFleet.name}: ${result.vessels} vessels queued`);
});
await boss.schedule(recomputeFleet.name, recomputeFleet.cron, {}, { tz: "UTC" });

// Cron jobs (workers/jobs/schedule.ts): "singleton", one run at a time across all workers. A run
// that outlives its worker (kill -9) holds the queue until pg-boss expires it, hence the short
// expiry; the mail sender also runs on start and on its own timer, so mail never waits for that.
for (const job of scheduledJobs) {
  await boss.createQueue(job.name, { name: job.name, policy: "singleton", expireInSeconds: 300 });
  await boss.work(job.name, { pollingIntervalSeconds: 1 }, async () => {
    const line = await job.handle(db, boss);
    if (line) console.log(`[worker] ${job.name}: ${line}`);
  });
  await boss.schedule(job.name, job.cron, {}, { tz: "UTC" });
}

// Reminders due while no worker ran (a morning digest, an escalation) are queued now rather than
// at the next quarter hour; the job's singleton queue keeps two workers from running it together.
await boss.send(reminders.name, {});

// Mail queued while no worker ran goes out now, not at the next minute.
mailSend
  .handle(db, boss)
  .then((line) => line && console.log(`[worker] ${mailSend.name} on start: ${line}`))
  .catch((error) => console.error("[worker] mail-send on start failed", error));
console.log("[worker] ready");

async function shutdown() {
  stopMailFollowUp();
  await boss.stop({ graceful: true, wait: true, timeout: 10_000 });
  closeMailTransport();
  await closeDb();
  process.exit(0);
}
process.once("SIGTERM", shutdown);
process.once("SIGINT", shutdown);
