// Every job the worker runs. `workers/index.ts` creates a queue for each, works it and schedules
// its cron; `scripts/migrate.ts` creates the queues too, so the web can send before a worker ran.
// Add a job: a definition file beside this one (`defineJob`), its `.handler.ts`, and a line here.
import type { WorkableJob } from "./definition";
import { fleetSnapshotJob } from "./fleet-snapshot";
import { mailSendJob } from "./mail-send";
import { recomputeFleetJob } from "./recompute-fleet";
import { recomputeVesselJob } from "./recompute-vessel";
import { remindersJob } from "./reminders";
import { shipClocksJob } from "./ship-clocks";

export const jobRegistry: readonly WorkableJob[] = [
  recomputeVesselJob,
  recomputeFleetJob,
  mailSendJob,
  fleetSnapshotJob,
  remindersJob,
  shipClocksJob,
];
