// A vessel's figures of the day, from the worker's rows: one aggregate query, then one upsert on
// (vessel, UTC day), so a rerun the same day replaces the row. Called at the end of every
// recompute (inside its transaction) and by the daily fleet-snapshot job. Shared with the worker
// process, which runs with the react-server condition so `server-only` resolves there.
import "server-only";
import { sql } from "drizzle-orm";
import type { Db, Tx } from "@/db/client";
import { vesselSnapshot } from "@/db/schema";
import { type CompletionLimits, ON_TIME_DAYS, onTimeRate, utcDay } from "./figures";

export type VesselSnapshotRow = typeof vesselSnapshot.$inferSelect;

type Figures = {
  scheduled: number;
  window_open: number;
  late: number;
  out_of_tolerance: number;
  deferred: number;
  critical_late: number;
  critical_out_of_tolerance: number;
  class_late: number;
  class_out_of_tolerance: number;
  pending_deferrals: number;
  last_reading_at: string | Date | null;
  /** [doneAt, counterHours, graceEndsAt, graceEndsHours, outOfToleranceAt, dueDate] per completion. */
  completions: [string, number | null, string | null, number | null, string | null, string | null][];
};

const asDate = (v: string | Date | null) => (v === null ? null : new Date(v));

/** Takes (or retakes) today's snapshot of one vessel; returns the row as written. */
export async function takeVesselSnapshot(
  db: Db | Tx,
  companyId: string,
  vesselId: string,
  now = new Date(),
): Promise<VesselSnapshotRow> {
  const since = new Date(now.getTime() - ON_TIME_DAYS * 86_400_000);
  // Open work orders by state and flag; the vessel's pending deferral requests; its latest
  // reading; and the completions approved and done in the last 90 days with the limits their
  // work order carried. Each part walks an index that starts with (company_id, vessel_id).
  const result = await db.execute<Figures>(sql`
    select
      count(*) filter (where w.state = 'scheduled')::int as scheduled,
      count(*) filter (where w.state = 'window-open')::int as window_open,
      count(*) filter (where w.state = 'late')::int as late,
      count(*) filter (where w.state = 'out-of-tolerance')::int as out_of_tolerance,
      count(*) filter (where w.state = 'deferred')::int as deferred,
      count(*) filter (where w.state = 'late' and w.critical)::int as critical_late,
      count(*) filter (where w.state = 'out-of-tolerance' and w.critical)::int as critical_out_of_tolerance,
      count(*) filter (where w.state = 'late' and w.class_related)::int as class_late,
      count(*) filter (where w.state = 'out-of-tolerance' and w.class_related)::int as class_out_of_tolerance,
      (select count(*)::int from deferral d
        where d.company_id = ${companyId} and d.vessel_id = ${vesselId} and d.status = 'pending') as pending_deferrals,
      (select max(r.read_at) from reading r
        where r.company_id = ${companyId} and r.vessel_id = ${vesselId}) as last_reading_at,
      (select coalesce(json_agg(json_build_array(c.done_at, c.counter_hours, dw.grace_ends_at, dw.grace_ends_hours,
                                                 dw.out_of_tolerance_at, dw.due_date)), '[]'::json)
        from completion c
        join work_order dw on dw.id = c.work_order_id and dw.company_id = ${companyId}
        where c.company_id = ${companyId} and c.vessel_id = ${vesselId} and c.status = 'approved'
          and c.done_at > ${since.toISOString()}::timestamptz
          and c.done_at <= ${now.toISOString()}::timestamptz) as completions
    from work_order w
    where w.company_id = ${companyId} and w.vessel_id = ${vesselId} and w.state <> 'done'`);
  const f = result.rows[0]!;
  const done: CompletionLimits[] = f.completions.map(
    ([doneAt, counterHours, graceEndsAt, graceEndsHours, ootAt, due]) => ({
      doneAt: new Date(doneAt),
      counterHours: counterHours === null ? null : Number(counterHours),
      graceEndsAt: asDate(graceEndsAt),
      graceEndsHours: graceEndsHours === null ? null : Number(graceEndsHours),
      outOfToleranceAt: asDate(ootAt),
      dueDate: asDate(due),
    }),
  );
  // Open work out of tolerance now counts against the rate (server/fleet/figures.ts).
  const rate = onTimeRate(done, f.out_of_tolerance);

  const figures = {
    scheduled: f.scheduled,
    windowOpen: f.window_open,
    late: f.late,
    outOfTolerance: f.out_of_tolerance,
    deferred: f.deferred,
    criticalLate: f.critical_late,
    criticalOutOfTolerance: f.critical_out_of_tolerance,
    classLate: f.class_late,
    classOutOfTolerance: f.class_out_of_tolerance,
    pendingDeferrals: f.pending_deferrals,
    lastReadingAt: asDate(f.last_reading_at),
    completed90: rate.completed,
    onTimeRate: rate.rate,
    takenAt: now,
  };
  const [row] = await db
    .insert(vesselSnapshot)
    .values({ companyId, vesselId, day: utcDay(now), ...figures })
    .onConflictDoUpdate({ target: [vesselSnapshot.vesselId, vesselSnapshot.day], set: figures })
    .returning();
  return row!;
}
