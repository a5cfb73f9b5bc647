// What the worker writes for one vessel, in one transaction: each counter's running rate, then
// one open work order per routine with its due point, windows and state. Data access shared with
// the worker process, which runs with the react-server condition so `server-only` resolves there.
import "server-only";
import { and, asc, eq, gte, inArray, isNull, lt, notInArray, sql } from "drizzle-orm";
import type { Db, Tx } from "@/db/client";
import { counter, reading, routinePlanProblem, vessel } from "@/db/schema";
import { takeVesselSnapshot } from "@/server/fleet/snapshot";
import { DEFAULT_LOOKBACK_DAYS, type RateReading, runningRate } from "./running-rate";
import { lockVesselWorkOrders } from "@/server/work-orders/lock";
import { writeWorkOrders, type WorkOrderRunSummary } from "./work-order-writer";

export type CounterNow = {
  totalHours: number;
  readAt: Date;
  hoursPerDay: number;
  /** When the counter passed a value it has passed, from its readings (passed-at.ts); null if unknown. */
  passedAt?: (hours: number) => Date | null;
};

/** Recomputes one vessel. Rerunning it changes nothing; two workers at once queue on a lock. */
export async function recomputeVessel(
  db: Db,
  companyId: string,
  vesselId: string,
  now = new Date(),
): Promise<WorkOrderRunSummary & { counters: number }> {
  return db.transaction(async (tx) => {
    await lockVesselWorkOrders(tx, vesselId);
    const [v] = await tx
      .select({ code: vessel.code, timeZone: vessel.timeZone, workOrderSeq: vessel.workOrderSeq })
      .from(vessel)
      .where(and(eq(vessel.companyId, companyId), eq(vessel.id, vesselId)));
    if (!v) return { counters: 0, created: 0, updated: 0, stateChanges: 0, skipped: [] };
    const counters = await refreshRunningRatesIn(tx, companyId, vesselId, now);
    const summary = await writeWorkOrders(tx, { companyId, vesselId, vessel: v, counters, now });
    await notePlanProblems(tx, companyId, vesselId, summary.skipped);
    // Today's Fleet board figures, from the rows just written (server/fleet/snapshot.ts).
    await takeVesselSnapshot(tx, companyId, vesselId, now);
    return { counters: counters.size, ...summary };
  });
}

async function refreshRunningRatesIn(
  tx: Tx,
  companyId: string,
  vesselId: string,
  now: Date,
  lookbackDays = DEFAULT_LOOKBACK_DAYS,
): Promise<Map<string, CounterNow | null>> {
  const since = new Date(now.getTime() - lookbackDays * 86_400_000);
  // Locked in id order, the same order as the readings route handler locks them: two
  // transactions that lock counters in one order cannot deadlock each other.
  const counters = await tx
    .select({ id: counter.id, planned: counter.plannedHoursPerDay })
    .from(counter)
    .where(and(eq(counter.companyId, companyId), eq(counter.vesselId, vesselId), isNull(counter.retiredAt)))
    .orderBy(asc(counter.id))
    .for("update");
  const result = new Map<string, CounterNow | null>();
  if (counters.length === 0) return result;
  const ids = counters.map((c) => c.id);

  const inWindow = await tx
    .select({ counterId: reading.counterId, readAt: reading.readAt, totalHours: reading.totalHours })
    .from(reading)
    .where(and(eq(reading.companyId, companyId), inArray(reading.counterId, ids), gte(reading.readAt, since)));
  // The last reading before the window of each counter, so the whole look-back is covered; it is
  // also the latest reading of a counter that has none inside the window.
  const before = await tx
    .selectDistinctOn([reading.counterId], {
      counterId: reading.counterId,
      readAt: reading.readAt,
      totalHours: reading.totalHours,
    })
    .from(reading)
    .where(and(eq(reading.companyId, companyId), inArray(reading.counterId, ids), lt(reading.readAt, since)))
    .orderBy(reading.counterId, sql`${reading.readAt} desc`);

  const byCounter = new Map<string, RateReading[]>(ids.map((id) => [id, []]));
  for (const r of [...before, ...inWindow]) byCounter.get(r.counterId)?.push(r);

  for (const c of counters) {
    const history = byCounter.get(c.id) ?? [];
    const rate = runningRate(history, now, c.planned, lookbackDays);
    await tx
      .update(counter)
      .set({ runningRate: rate.hoursPerDay, rateBasis: rate.basis, rateComputedAt: now })
      .where(and(eq(counter.companyId, companyId), eq(counter.id, c.id)));
    const latest = history.reduce<RateReading | null>((a, b) => (!a || b.readAt > a.readAt ? b : a), null);
    result.set(
      c.id,
      latest ? { totalHours: latest.totalHours, readAt: latest.readAt, hoursPerDay: rate.hoursPerDay } : null,
    );
  }
  return result;
}

/**
 * Keeps `routine_plan_problem` to what this run could not plan: a routine planned again loses its
 * row, a new problem gets one, and a problem that stays keeps the time it was first seen.
 */
async function notePlanProblems(
  tx: Tx,
  companyId: string,
  vesselId: string,
  skipped: WorkOrderRunSummary["skipped"],
): Promise<void> {
  const ids = skipped.map((s) => s.routineId);
  await tx
    .delete(routinePlanProblem)
    .where(
      and(
        eq(routinePlanProblem.companyId, companyId),
        eq(routinePlanProblem.vesselId, vesselId),
        ...(ids.length ? [notInArray(routinePlanProblem.routineId, ids)] : []),
      ),
    );
  if (skipped.length === 0) return;
  await tx
    .insert(routinePlanProblem)
    .values(skipped.map((s) => ({ companyId, vesselId, routineId: s.routineId, reason: s.reason })))
    .onConflictDoUpdate({
      target: [routinePlanProblem.companyId, routinePlanProblem.routineId],
      set: {
        reason: sql`excluded.reason`,
        since: sql`case when ${routinePlanProblem.reason} = excluded.reason then ${routinePlanProblem.since} else now() end`,
      },
    });
}
