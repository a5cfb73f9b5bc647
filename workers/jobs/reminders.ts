// Queues the reminder e-mail that is due (server/reminders/run.ts) every 15 minutes: a digest
// goes out within 15 minutes of the vessel's digest hour, an escalation within 15 minutes of the
// recompute that noticed the change. The outbox's keys make every rerun harmless.
import { runReminders } from "@/server/reminders/run";
import { mailSend } from "./mail-send";
import type { ScheduledJob } from "./schedule";

export const reminders: ScheduledJob = {
  name: "reminders",
  cron: "*/15 * * * *",
  async handle(db, boss) {
    const c = await runReminders(db, new Date(), {
      // The worker's own pg-boss: the queued messages leave now instead of at the next minute.
      afterQueued: async () => {
        await boss.send(mailSend.name, {});
      },
    });
    const queued = c.dueDigests + c.missingReadings + c.escalations + c.fleetSummaries;
    if (queued === 0 && c.escalationsMarkedOnly === 0) return "";
    return (
      `${c.dueDigests} due digests, ${c.missingReadings} missing-readings reminders, ${c.escalations} escalations, ` +
      `${c.fleetSummaries} fleet summaries queued; ${c.escalationsMarkedOnly} old state changes marked without mail`
    );
  },
};
