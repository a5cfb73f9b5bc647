// Moves each vessel to the zone of its latest clock change in force (server/vessels/clock.ts): a
// change entered ahead ("clocks back 1 h at midnight") takes effect within five minutes of its time.
import { z } from "zod";
import { defineJob } from "./definition";

export const shipClocksJob = defineJob({
  name: "ship-clocks",
  payload: z.object({}),
  queue: { policy: "singleton", expireInSeconds: 120 },
  work: { pollingIntervalSeconds: 2 },
  cron: "*/5 * * * *",
  handler: () => import("./ship-clocks.handler"),
});
