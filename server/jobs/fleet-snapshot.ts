// The daily snapshot of every active vessel's figures, for the Fleet board's 90-day trends. Every
// recompute also retakes its vessel's row of the day; this run makes sure each vessel has one,
// even a vessel that stopped reporting (its days since the last reading keep growing).
import { z } from "zod";
import { envOf } from "@/server/env";
import { defineJob } from "./definition";

export const fleetSnapshotJob = defineJob({
  name: "fleet-snapshot-daily",
  payload: z.object({}),
  // A run that outlives its worker (kill -9) holds a singleton queue until pg-boss expires it.
  queue: { policy: "singleton", expireInSeconds: 300 },
  work: { pollingIntervalSeconds: 1 },
  /** Cron in UTC (KEELSON_SNAPSHOT_CRON): after the nightly recompute has queued every vessel. */
  cron: envOf("KEELSON_SNAPSHOT_CRON").KEELSON_SNAPSHOT_CRON,
  handler: () => import("./fleet-snapshot.handler"),
});
