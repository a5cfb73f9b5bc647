// The Fleet board: every active vessel of the company from its latest snapshot, 90 days of
// snapshots for the trends, and the requests awaiting a decision. Two snapshot queries for the
// whole fleet (no query per vessel) and the deferral list; it never reads work orders one by one.
import "server-only";
import { and, asc, eq, gte, inArray, isNull, min, sql } from "drizzle-orm";
import { getReadDb } from "@/db/client";
import { counter, defect, requisition, vesselSnapshot, workOrder } from "@/db/schema";
import type { Access } from "@/server/auth/access";
import { listFleetPendingDeferrals, mayDecide } from "@/server/deferrals/queries";
import type { FleetBoard, FleetBoardPending, FleetBoardVessel } from "./contract";
import { boardTier, compareForBoard, daysSinceReading, stoppedReporting, trendDays } from "./figures";

type LatestRow = {
  id: string;
  name: string;
  code: string;
  missing_readings_hours: number;
  day: string | null;
  scheduled: number | null;
  window_open: number | null;
  late: number | null;
  out_of_tolerance: number | null;
  deferred: number | null;
  critical_late: number | null;
  critical_out_of_tolerance: number | null;
  class_late: number | null;
  class_out_of_tolerance: number | null;
  last_reading_at: string | Date | null;
  completed90: number | null;
  on_time_rate: string | number | null;
};

/** Each active vessel with its latest snapshot (today's once the worker has run), by index. */
export function latestSnapshotsQuery(companyId: string) {
  return sql`
    select v.id, v.name, v.code, co.missing_readings_hours, s.day, s.scheduled, s.window_open, s.late,
           s.out_of_tolerance, s.deferred, s.critical_late, s.critical_out_of_tolerance, s.class_late,
           s.class_out_of_tolerance, s.last_reading_at, s.completed90, s.on_time_rate
    from vessel v
    join company co on co.id = v.company_id
    left join lateral (
      select * from vessel_snapshot vs
      where vs.company_id = v.company_id and vs.vessel_id = v.id
      order by vs.day desc limit 1
    ) s on true
    where v.company_id = ${companyId} and v.retired_at is null`;
}

export async function loadFleetBoard(access: Access, now = new Date()): Promise<FleetBoard> {
  // The worker's snapshots: a replica a moment behind shows the same board (KEELSON_READ_DATABASE_URL).
  const db = getReadDb();
  const companyId = access.company.id;
  const days = trendDays(now);
  const [latest, history, pending, requisitions, defects] = await Promise.all([
    db.execute<LatestRow>(latestSnapshotsQuery(companyId)),
    db
      .select({
        vesselId: vesselSnapshot.vesselId,
        day: vesselSnapshot.day,
        late: vesselSnapshot.late,
        outOfTolerance: vesselSnapshot.outOfTolerance,
        completed90: vesselSnapshot.completed90,
        onTimeRate: vesselSnapshot.onTimeRate,
      })
      .from(vesselSnapshot)
      .where(and(eq(vesselSnapshot.companyId, companyId), gte(vesselSnapshot.day, days[0]!)))
      .orderBy(asc(vesselSnapshot.day)),
    listFleetPendingDeferrals(access),
    db
      .select({ vesselId: requisition.vesselId, n: sql<number>`count(*)::int` })
      .from(requisition)
      .where(and(eq(requisition.companyId, companyId), inArray(requisition.state, ["sent", "ordered"])))
      .groupBy(requisition.vesselId),
    db
      .select({
        vesselId: defect.vesselId,
        open: sql<number>`count(*)::int`,
        critical: sql<number>`(count(*) filter (where ${defect.affectsCritical}))::int`,
        oldest: min(defect.foundAt),
      })
      .from(defect)
      .where(and(eq(defect.companyId, companyId), isNull(defect.closedAt)))
      .groupBy(defect.vesselId),
  ]);
  const defectsByVessel = new Map(defects.map((d) => [d.vesselId, d]));
  const requisitionsByVessel = new Map(requisitions.map((r) => [r.vesselId, r.n]));

  // Office roles see the whole fleet; anyone else given fleet:read would see their own vessels.
  const mayOpen = (id: string) => access.assignedVesselIds === null || access.assignedVesselIds.includes(id);
  const rows = latest.rows.filter((r) => mayOpen(r.id));
  const missingReadingsHours = rows[0]?.missing_readings_hours ?? 36;
  const dayIndex = new Map(days.map((d, i) => [d, i]));
  const pendingByVessel = new Map<string, number>();
  for (const p of pending) pendingByVessel.set(p.vessel.id, (pendingByVessel.get(p.vessel.id) ?? 0) + 1);

  const trends = new Map<string, (number | null)[]>(rows.map((r) => [r.id, days.map(() => null)]));
  const fleetOut: (number | null)[] = days.map(() => null);
  const fleetLate: (number | null)[] = days.map(() => null);
  const fleetDone = days.map(() => ({ completed: 0, onTime: 0 }));
  for (const h of history) {
    const i = dayIndex.get(h.day);
    const trend = trends.get(h.vesselId);
    if (i === undefined || !trend) continue;
    trend[i] = h.late + h.outOfTolerance;
    fleetOut[i] = (fleetOut[i] ?? 0) + h.outOfTolerance;
    fleetLate[i] = (fleetLate[i] ?? 0) + h.late;
    if (h.onTimeRate !== null) {
      // Judged: the completions and the open work out of tolerance that day (server/fleet/figures.ts).
      const judged = h.completed90 + h.outOfTolerance;
      fleetDone[i]!.completed += judged;
      fleetDone[i]!.onTime += Math.round(h.onTimeRate * judged);
    }
  }

  const vessels: FleetBoardVessel[] = rows.map((r) => {
    const lastReadingAt = r.last_reading_at === null ? null : new Date(r.last_reading_at);
    const figures = {
      name: r.name,
      late: r.late ?? 0,
      outOfTolerance: r.out_of_tolerance ?? 0,
      criticalLate: r.critical_late ?? 0,
      criticalOutOfTolerance: r.critical_out_of_tolerance ?? 0,
      classLate: r.class_late ?? 0,
      classOutOfTolerance: r.class_out_of_tolerance ?? 0,
    };
    return {
      id: r.id,
      code: r.code,
      ...figures,
      day: r.day,
      scheduled: r.scheduled ?? 0,
      windowOpen: r.window_open ?? 0,
      deferred: r.deferred ?? 0,
      lastReadingAt: lastReadingAt?.toISOString() ?? null,
      daysSinceReading: daysSinceReading(lastReadingAt, now),
      stoppedReporting: stoppedReporting(lastReadingAt, now, r.missing_readings_hours),
      completed90: r.completed90 ?? 0,
      onTimeRate: r.on_time_rate === null ? null : Number(r.on_time_rate),
      pendingDeferrals: pendingByVessel.get(r.id) ?? 0,
      openRequisitions: requisitionsByVessel.get(r.id) ?? 0,
      openDefects: defectsByVessel.get(r.id)?.open ?? 0,
      criticalDefects: defectsByVessel.get(r.id)?.critical ?? 0,
      oldestDefectDays: (() => {
        const oldest = defectsByVessel.get(r.id)?.oldest;
        return oldest ? Math.max(0, Math.floor((now.getTime() - new Date(oldest).getTime()) / 86_400_000)) : null;
      })(),
      tier: boardTier(figures),
      trend: trends.get(r.id)!,
    };
  });
  vessels.sort(compareForBoard);

  // The counters the pending requests' work orders run on, with their rates and last readings.
  const pendingIds = pending.map((p) => p.workOrder.id);
  const counterRows = pendingIds.length
    ? await db
        .select({
          workOrderId: workOrder.id,
          name: counter.name,
          rate: counter.runningRate,
          basis: counter.rateBasis,
          lastReadAt: sql<Date | null>`(select max(r.read_at) from reading r where r.company_id = ${counter.companyId} and r.counter_id = ${counter.id})`,
        })
        .from(workOrder)
        .innerJoin(counter, eq(counter.id, workOrder.counterId))
        .where(and(eq(workOrder.companyId, companyId), inArray(workOrder.id, pendingIds)))
    : [];
  const countersOf = new Map(counterRows.map((c) => [c.workOrderId, { ...c, lastReadAt: c.lastReadAt ? new Date(c.lastReadAt) : null }]));
  const pendingDeferrals: FleetBoardPending[] = pending
    .filter((p) => mayOpen(p.vessel.id))
    .map((p) => {
      const c = countersOf.get(p.workOrder.id);
      return {
        id: p.id,
        vessel: p.vessel,
        workOrder: p.workOrder,
        proposedDueDay: p.proposedDueDay,
        proposedDueHours: p.proposedDueHours,
        needsOffice: p.needsOffice,
        requestedBy: p.requestedBy,
        requestedAt: p.requestedAt,
        reason: p.reason,
        counter: c ? { name: c.name, hoursPerDay: c.rate, basis: c.basis, lastReadAt: c.lastReadAt?.toISOString() ?? null } : null,
        mayDecide: mayDecide(access, p.needsOffice),
      };
    });

  return {
    generatedAt: now.toISOString(),
    missingReadingsHours,
    days,
    vessels,
    fleet: {
      outOfTolerance: fleetOut,
      late: fleetLate,
      onTimeRate: fleetDone.map((d) => (d.completed ? Math.round((d.onTime / d.completed) * 1000) / 1000 : null)),
    },
    pendingDeferrals,
  };
}
