// Queues the reminder e-mail that is due (server/reminders/run.ts) every 15 minutes: a digest
// goes out within 15 minutes of the vessel's digest hour, an escalation within 15 minutes of the
// recompute that noticed the change. The outbox's keys make every rerun harmless.
import { z } from "zod";
import { defineJob } from "./definition";

export const remindersJob = defineJob({
  name: "reminders",
  payload: z.object({}),
  queue: { policy: "singleton", expireInSeconds: 300 },
  work: { pollingIntervalSeconds: 1 },
  cron: "*/15 * * * *",
  handler: () => import("./reminders.handler"),
});
