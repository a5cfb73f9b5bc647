// The daily snapshot of every active vessel's figures, for the Fleet board's 90-day trends. Every
// recompute also retakes its vessel's row of the day; this run makes sure each vessel has one,
// even a vessel that stopped reporting (its days since the last reading keep growing).
import { asc, isNull } from "drizzle-orm";
import type { Db } from "@/db/client";
import { vessel } from "@/db/schema";
import { takeVesselSnapshot } from "@/server/fleet/snapshot";
import type { ScheduledJob } from "./schedule";

export const fleetSnapshot: ScheduledJob = {
  name: "fleet-snapshot-daily",
  /** Cron in UTC: after the nightly recompute (00:15) has queued every vessel. */
  cron: process.env.KEELSON_SNAPSHOT_CRON ?? "30 0 * * *",
  async handle(db: Db) {
    const vessels = await db
      .select({ id: vessel.id, companyId: vessel.companyId })
      .from(vessel)
      .where(isNull(vessel.retiredAt))
      .orderBy(asc(vessel.id));
    const now = new Date();
    for (const v of vessels) await takeVesselSnapshot(db, v.companyId, v.id, now);
    return `${vessels.length} vessels`;
  },
};
