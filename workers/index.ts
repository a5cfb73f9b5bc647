// The worker process: pg-boss on the application's PostgreSQL. Several workers may run at once;
// pg-boss hands each job to one of them.
import PgBoss from "pg-boss";
import { closeDb, databaseUrl, getDb } from "@/db/client";
import { recomputeFleet } from "./jobs/recompute-fleet";
import { recomputeVessel } from "./jobs/recompute-vessel";

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
console.log("[worker] ready");

async function shutdown() {
  await boss.stop({ graceful: true, wait: true, timeout: 10_000 });
  await closeDb();
  process.exit(0);
}
process.once("SIGTERM", shutdown);
process.once("SIGINT", shutdown);
