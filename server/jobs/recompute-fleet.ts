// The nightly run: one recompute job per active vessel of every company.
import { z } from "zod";
import { envOf } from "@/server/env";
import { defineJob } from "./definition";

export const recomputeFleetJob = defineJob({
  name: "fleet-recompute-nightly",
  payload: z.object({}),
  queue: { policy: "singleton" },
  /** Cron in UTC (KEELSON_NIGHTLY_CRON). */
  cron: envOf("KEELSON_NIGHTLY_CRON").KEELSON_NIGHTLY_CRON,
  handler: () => import("./recompute-fleet.handler"),
});
