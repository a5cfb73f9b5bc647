import { runReminders } from "@/server/reminders/run";
import type { JobHandler } from "./definition";

const remindersHandler: JobHandler<object> = async (_payload, { db }) => {
  const c = await runReminders(db, new Date());
  const queued = c.dueDigests + c.missingReadings + c.escalations + c.fleetSummaries;
  if (queued === 0 && c.escalationsMarkedOnly === 0) return "";
  return (
    `${c.dueDigests} due digests, ${c.missingReadings} missing-readings reminders, ${c.escalations} escalations, ` +
    `${c.fleetSummaries} fleet summaries queued; ${c.escalationsMarkedOnly} old state changes marked without mail`
  );
};
export default remindersHandler;
