// The nightly run: one recompute job per active vessel of every company.
import { z } from "zod";
import { defineJob } from "./definition";

export const recomputeFleetJob = defineJob({
  name: "fleet-recompute-nightly",
  payload: z.object({}),
  queue: { policy: "singleton" },
  /** Cron in UTC; KEELSON_NIGHTLY_CRON overrides it. */
  cron: process.env.KEELSON_NIGHTLY_CRON ?? "15 0 * * *",
  handler: () => import("./recompute-fleet.handler"),
});
