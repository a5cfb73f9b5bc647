// What the worker writes for one vessel. Data access shared with the worker process, which runs
// with the react-server condition so that `server-only` resolves there too.
import "server-only";
import { and, eq, gte, isNull, sql } from "drizzle-orm";
import type { Db } from "@/db/client";
import { counter, reading } from "@/db/schema";
import { DEFAULT_LOOKBACK_DAYS, runningRate } from "./running-rate";

/** Recomputes every counter's running rate of a vessel in one transaction. */
export async function refreshRunningRates(
  db: Db,
  companyId: string,
  vesselId: string,
  now = new Date(),
  lookbackDays = DEFAULT_LOOKBACK_DAYS,
): Promise<number> {
  const since = new Date(now.getTime() - lookbackDays * 86_400_000);
  return db.transaction(async (tx) => {
    const counters = await tx
      .select({ id: counter.id, planned: counter.plannedHoursPerDay })
      .from(counter)
      .where(and(eq(counter.companyId, companyId), eq(counter.vesselId, vesselId), isNull(counter.retiredAt)));
    for (const c of counters) {
      const window = await tx
        .select({ readAt: reading.readAt, totalHours: reading.totalHours })
        .from(reading)
        .where(and(eq(reading.companyId, companyId), eq(reading.counterId, c.id), gte(reading.readAt, since)));
      const [before] = await tx
        .select({ readAt: reading.readAt, totalHours: reading.totalHours })
        .from(reading)
        .where(and(eq(reading.companyId, companyId), eq(reading.counterId, c.id), sql`${reading.readAt} < ${since}`))
        .orderBy(sql`${reading.readAt} desc`)
        .limit(1);
      const rate = runningRate(before ? [before, ...window] : window, now, c.planned, lookbackDays);
      await tx
        .update(counter)
        .set({ runningRate: rate.hoursPerDay, rateBasis: rate.basis, rateComputedAt: now })
        .where(and(eq(counter.companyId, companyId), eq(counter.id, c.id)));
    }
    return counters.length;
  });
}
