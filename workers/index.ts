// The worker process: pg-boss on the application's PostgreSQL, working every job of the registry
// (server/jobs/registry.ts). Several workers may run at once; pg-boss hands each job to one of them.
import PgBoss from "pg-boss";
import { actingAs, systemActor } from "@/db/actor";
import { closeDb, getDb } from "@/db/client";
import { envOrExit } from "@/server/env";
import { databaseUnavailableProblem } from "@/server/http/problem";
import { closeMailTransport } from "@/server/mail/transport";
import { mailSendJob } from "@/server/jobs/mail-send";
import { createJobQueues } from "@/server/jobs/queues";
import { jobRegistry } from "@/server/jobs/registry";
import { remindersJob } from "@/server/jobs/reminders";
import { sendJob } from "@/server/jobs/send";

// A bad variable stops the worker here, with a message naming it.
const env = envOrExit();
const boss = new PgBoss({
  connectionString: env.DATABASE_URL,
  cronMonitorIntervalSeconds: env.KEELSON_CRON_MONITOR_SECONDS,
});
boss.on("error", (error) => console.error("[worker] pg-boss error", error));
// pg-boss marks a job failed after its handler threw; when the database went away meanwhile, that
// write fails too and its promise is left unhandled inside pg-boss (found by the outage test: the
// worker died with 57P01 while PostgreSQL restarted). Such a rejection is the outage, which pg-boss
// rides out by retrying; anything else is a bug and still ends the process.
process.on("unhandledRejection", (reason) => {
  if (databaseUnavailableProblem(reason)) {
    console.error("[worker] the database went away under a job; carrying on:", reason instanceof Error ? reason.message : reason);
    return;
  }
  console.error("[worker] unhandled rejection", reason);
  process.exit(1);
});

await boss.start();
await createJobQueues(boss);

const db = getDb();
for (const job of jobRegistry) {
  await boss.work(job.name, job.work ?? {}, async (jobs) => {
    for (const { data } of jobs) {
      const line = await actingAs(systemActor(`worker ${job.name}`), () => job.run(data, { db }));
      if (line) console.log(`[worker] ${job.name}: ${line}`);
    }
  });
  if (job.cron) await boss.schedule(job.name, job.cron, {}, { tz: "UTC" });
}

// Reminders due while no worker ran (a morning digest, an escalation) are queued now rather than
// at the next quarter hour; the job's singleton queue keeps two workers from running it together.
// Mail queued while no worker ran goes out now, not at the next minute.
await sendJob(db, remindersJob, {});
mailSendJob
  .run({}, { db })
  .then((line) => line && console.log(`[worker] ${mailSendJob.name} on start: ${line}`))
  .catch((error) => console.error("[worker] mail-send on start failed", error));
console.log("[worker] ready");

async function shutdown() {
  for (const job of jobRegistry) await job.stop();
  await boss.stop({ graceful: true, wait: true, timeout: 10_000 });
  closeMailTransport();
  await closeDb();
  process.exit(0);
}
process.once("SIGTERM", shutdown);
process.once("SIGINT", shutdown);
