// Recompute one vessel's running rates and work orders: sent by every write that changes what is
// due (readings, routines, counters, tolerance rules, completions, deferral decisions), inside that
// write's transaction, and by the nightly fan-out, because calendar time passes without readings.
import { z } from "zod";
import { defineJob } from "./definition";
import { type JobConnection, sendJob } from "./send";

export const recomputeVesselJob = defineJob({
  name: "vessel-recompute",
  payload: z.object({ companyId: z.uuid(), vesselId: z.uuid() }),
  // "short": at most one queued job per vessel, so a burst of readings gives one run. Not "stately"
  // (one queued and one running per vessel): pg-boss 10 fetches the oldest queued job first, and
  // when its vessel's run is still active the fetch fails and the whole queue waits — behind a
  // killed worker's run, every vessel waited for that run to expire (tests/faults/worker.test.ts).
  // Two runs of one vessel queue on its work-order lock instead. A dead worker's run is retried
  // after 5 minutes (pg-boss's default is 15), far above a 3,000-routine vessel's 1.4 s (README).
  queue: { policy: "short", retryLimit: 3, expireInSeconds: 300 },
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
