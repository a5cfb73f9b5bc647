// What the worker writes for one vessel. Data access shared with the worker process, which runs
// with the react-server condition so that `server-only` resolves there too.
import "server-only";
import { and, asc, eq, gte, inArray, isNull, lt, sql } from "drizzle-orm";
import type { Db } from "@/db/client";
import { counter, reading } from "@/db/schema";
import { DEFAULT_LOOKBACK_DAYS, type RateReading, runningRate } from "./running-rate";

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
    // Locked in id order, the same order as the readings route handler locks them: two
    // transactions that lock counters in one order cannot deadlock each other.
    const counters = await tx
      .select({ id: counter.id, planned: counter.plannedHoursPerDay })
      .from(counter)
      .where(and(eq(counter.companyId, companyId), eq(counter.vesselId, vesselId), isNull(counter.retiredAt)))
      .orderBy(asc(counter.id))
      .for("update");
    if (counters.length === 0) return 0;
    const ids = counters.map((c) => c.id);

    const inWindow = await tx
      .select({ counterId: reading.counterId, readAt: reading.readAt, totalHours: reading.totalHours })
      .from(reading)
      .where(and(eq(reading.companyId, companyId), inArray(reading.counterId, ids), gte(reading.readAt, since)));
    // The last reading before the window of each counter, so the whole look-back is covered.
    const before = await tx
      .selectDistinctOn([reading.counterId], { counterId: reading.counterId, readAt: reading.readAt, totalHours: reading.totalHours })
      .from(reading)
      .where(and(eq(reading.companyId, companyId), inArray(reading.counterId, ids), lt(reading.readAt, since)))
      .orderBy(reading.counterId, sql`${reading.readAt} desc`);

    const byCounter = new Map<string, RateReading[]>(ids.map((id) => [id, []]));
    for (const r of [...before, ...inWindow]) byCounter.get(r.counterId)?.push(r);

    for (const c of counters) {
      const rate = runningRate(byCounter.get(c.id) ?? [], now, c.planned, lookbackDays);
      await tx
        .update(counter)
        .set({ runningRate: rate.hoursPerDay, rateBasis: rate.basis, rateComputedAt: now })
        .where(and(eq(counter.companyId, companyId), eq(counter.id, c.id)));
    }
    return counters.length;
  });
}
