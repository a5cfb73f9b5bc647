// Jobs the worker runs on a cron (UTC). Each gets a queue with the "singleton" policy (one run at
// a time across all workers), a `work` handler and its schedule in workers/index.ts; `handle`
// returns the line the worker logs ("" when there is nothing to say, e.g. a minute with no mail). Add a job by adding it to `scheduledJobs`.
import type PgBoss from "pg-boss";
import type { Db } from "@/db/client";
import { fleetSnapshot } from "./fleet-snapshot";
import { mailSend } from "./mail-send";
import { reminders } from "./reminders";

export type ScheduledJob = {
  name: string;
  cron: string;
  handle(db: Db, boss: PgBoss): Promise<string>;
};

export const scheduledJobs: ScheduledJob[] = [mailSend, fleetSnapshot, reminders];
