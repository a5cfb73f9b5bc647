// The nightly run: one recompute job per vessel of every company.
import { isNull } from "drizzle-orm";
import type PgBoss from "pg-boss";
import type { Db } from "@/db/client";
import { vessel } from "@/db/schema";
import { recomputeVessel } from "./recompute-vessel";

export const recomputeFleet = {
  name: "fleet-recompute-nightly",
  /** Cron in UTC; KEELSON_NIGHTLY_CRON overrides it. */
  cron: process.env.KEELSON_NIGHTLY_CRON ?? "15 0 * * *",
  async handle(db: Db, boss: PgBoss) {
    const vessels = await db
      .select({ id: vessel.id, companyId: vessel.companyId })
      .from(vessel)
      .where(isNull(vessel.retiredAt));
    for (const v of vessels) {
      await boss.send(recomputeVessel.name, { companyId: v.companyId, vesselId: v.id }, { singletonKey: v.id });
    }
    return { vessels: vessels.length };
  },
} as const;
