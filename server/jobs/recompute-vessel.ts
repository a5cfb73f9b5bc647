// Recompute one vessel's running rates and work orders: sent by every write that changes what is
// due (readings, routines, counters, tolerance rules, completions, deferral decisions), inside that
// write's transaction, and by the nightly fan-out, because calendar time passes without readings.
import { z } from "zod";
import { defineJob } from "./definition";
import { type JobConnection, sendJob } from "./send";

export const recomputeVesselJob = defineJob({
  name: "vessel-recompute",
  payload: z.object({ companyId: z.uuid(), vesselId: z.uuid() }),
  // "stately": at most one queued and one running job per vessel, so a burst of readings gives one run.
  queue: { policy: "stately", retryLimit: 3 },
  work: { pollingIntervalSeconds: 1, batchSize: 1 },
  singletonKey: (p) => p.vesselId,
  handler: () => import("./recompute-vessel.handler"),
});

/**
 * Asks the worker to recompute a vessel, in the transaction of the write that changed what is due
 * (its last statement: see `sendJob`). Coalesced per vessel by the queue's policy.
 */
export function requestRecompute(tx: JobConnection, companyId: string, vesselId: string): Promise<void> {
  return sendJob(tx, recomputeVesselJob, { companyId, vesselId });
}
