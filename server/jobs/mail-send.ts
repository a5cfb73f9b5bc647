// Sends what is due in the outbox: every minute by cron, within a second of a message being
// queued (`enqueueMail` sends this job in the same transaction), once when the worker starts, and
// again when a retry or an ended lease falls due in the next minute (the handler's own timer).
import { z } from "zod";
import type { JobConnection } from "./send";
import { sendJob } from "./send";
import { defineJob } from "./definition";

export const mailSendJob = defineJob({
  name: "mail-send",
  payload: z.object({}),
  // "singleton": one run at a time across all workers; queued requests wait their turn.
  queue: { policy: "singleton", expireInSeconds: 300 },
  work: { pollingIntervalSeconds: 1 },
  cron: "* * * * *",
  handler: () => import("./mail-send.handler"),
});

/** Asks the worker to send what is due now; on a transaction, it asks only if that commits. */
export function requestMailSend(connection: JobConnection): Promise<void> {
  return sendJob(connection, mailSendJob, {});
}
