import "server-only";
import PgBoss from "pg-boss";
import { databaseUrl } from "@/db/client";
import { mailSend } from "@/workers/jobs/mail-send";
import { recomputeVessel } from "@/workers/jobs/recompute-vessel";

// The web app only sends jobs: no maintenance, no cron, no schema migration from this process.
const globalForBoss = globalThis as unknown as { keelsonBoss?: Promise<PgBoss> };

function sender(): Promise<PgBoss> {
  globalForBoss.keelsonBoss ??= (async () => {
    const boss = new PgBoss({ connectionString: databaseUrl(), max: 2, supervise: false, schedule: false, migrate: false });
    boss.on("error", (error) => console.error("[jobs] pg-boss error", error));
    await boss.start();
    return boss;
  })();
  return globalForBoss.keelsonBoss;
}

/** Asks the worker to recompute a vessel; coalesced per vessel by the queue's policy. */
export async function requestRecompute(companyId: string, vesselId: string): Promise<void> {
  try {
    const boss = await sender();
    await boss.send(recomputeVessel.name, { companyId, vesselId }, { singletonKey: vesselId });
  } catch (error) {
    // The nightly run recomputes every vessel anyway; a lost request delays, never loses, work.
    console.error("[jobs] could not queue a recompute", error);
  }
}

/**
 * Asks the worker to send what is due in the outbox now; call it after the transaction that
 * enqueued mail commits. Without it the message still leaves within a minute (the cron).
 */
export async function requestMailSend(): Promise<void> {
  try {
    const boss = await sender();
    await boss.send(mailSend.name, {});
  } catch (error) {
    console.error("[jobs] could not ask for a mail send", error);
  }
}
