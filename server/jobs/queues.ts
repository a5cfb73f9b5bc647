import type PgBoss from "pg-boss";
import { jobRegistry } from "./registry";

/**
 * Creates each registered job's queue with its policy. pg-boss keeps an existing queue as it is,
 * so its options are written again: a definition's new retry or expiry reaches a database made
 * before it (jobs already queued keep theirs).
 */
export async function createJobQueues(boss: PgBoss): Promise<void> {
  for (const job of jobRegistry) {
    await boss.createQueue(job.name, { name: job.name, ...job.queue });
    await boss.updateQueue(job.name, { name: job.name, ...job.queue });
  }
}
