// What the reminder run reads. Every query is scoped by company_id.
import "server-only";
import { and, asc, desc, eq, gt, gte, inArray, isNull, lte, ne, or, sql } from "drizzle-orm";
import type { Db, Tx } from "@/db/client";
import {
  company,
  counter,
  deferral,
  membership,
  reading,
  user,
  vessel,
  vesselAssignment,
  workOrder,
  workOrderStateChange,
} from "@/db/schema";
import { ATTENTION_STATES } from "@/db/schema/work-order-states";
import { endOfShipDate, shipDateFromKey, startOfShipDate } from "@/server/scheduling/ship-date";
import type { CounterReading, FleetVesselFigures } from "./content";
import type { DigestOccasion } from "./schedule";
import type { DigestWorkOrder, EscalationCandidate, Member, StateChangeRow } from "./selection";

type Conn = Db | Tx;

export type ReminderCompany = {
  id: string;
  name: string;
  digestHour: number;
  missingReadingsHours: number;
  missingReadingsStepHours: number;
};

export type ReminderVessel = { id: string; name: string; timeZone: string };

export async function loadCompanies(db: Conn, companyIds?: string[]): Promise<ReminderCompany[]> {
  return db
    .select({
      id: company.id,
      name: company.name,
      digestHour: company.digestHour,
      missingReadingsHours: company.missingReadingsHours,
      missingReadingsStepHours: company.missingReadingsStepHours,
    })
    .from(company)
    .where(companyIds ? inArray(company.id, companyIds.length ? companyIds : [NO_ID]) : undefined)
    .orderBy(asc(company.id));
}

const NO_ID = "00000000-0000-0000-0000-000000000000";

export async function loadActiveVessels(db: Conn, companyId: string): Promise<ReminderVessel[]> {
  return db
    .select({ id: vessel.id, name: vessel.name, timeZone: vessel.timeZone })
    .from(vessel)
    .where(and(eq(vessel.companyId, companyId), isNull(vessel.retiredAt)))
    .orderBy(asc(vessel.name));
}

/** The company's people with their role, whether they are disabled, and their vessel assignments. */
export async function loadMembers(db: Conn, companyId: string): Promise<Member[]> {
  const rows = await db
    .select({
      userId: user.id,
      email: user.email,
      name: user.name,
      role: membership.role,
      banned: user.banned,
      vesselIds: sql<
        string[]
      >`coalesce(array_agg(${vesselAssignment.vesselId}::text) filter (where ${vesselAssignment.vesselId} is not null), '{}')`,
    })
    .from(membership)
    .innerJoin(user, eq(user.id, membership.userId))
    .leftJoin(
      vesselAssignment,
      and(eq(vesselAssignment.companyId, membership.companyId), eq(vesselAssignment.userId, membership.userId)),
    )
    .where(eq(membership.companyId, companyId))
    .groupBy(user.id, user.email, user.name, membership.role, user.banned)
    .orderBy(asc(user.email));
  return rows.map((r) => ({ ...r, banned: r.banned ?? false }));
}

const DIGEST_COLUMNS = {
  id: workOrder.id,
  number: workOrder.number,
  title: workOrder.title,
  state: workOrder.state,
  dueDate: workOrder.dueDate,
  deferredDueDate: workOrder.deferredDueDate,
  deferredDueHours: workOrder.deferredDueHours,
  critical: workOrder.critical,
  classRelated: workOrder.classRelated,
};

/** The state changes of the digest's window and the work orders it may list. */
export async function loadDigestInputs(
  db: Conn,
  companyId: string,
  v: ReminderVessel,
  occasion: DigestOccasion,
): Promise<{ changes: StateChangeRow[]; workOrders: DigestWorkOrder[] }> {
  const changes = await db
    .select({
      workOrderId: workOrderStateChange.workOrderId,
      toState: workOrderStateChange.toState,
      changedAt: workOrderStateChange.changedAt,
    })
    .from(workOrderStateChange)
    .innerJoin(workOrder, eq(workOrder.id, workOrderStateChange.workOrderId))
    .where(
      and(
        eq(workOrderStateChange.companyId, companyId),
        eq(workOrder.companyId, companyId),
        eq(workOrder.vesselId, v.id),
        inArray(workOrderStateChange.toState, [...ATTENTION_STATES]),
        gt(workOrderStateChange.changedAt, occasion.previousCutOff),
        lte(workOrderStateChange.changedAt, occasion.cutOff),
      ),
    );
  const from = startOfShipDate(shipDateFromKey(occasion.dueFrom), v.timeZone);
  const until = endOfShipDate(shipDateFromKey(occasion.dueUntil), v.timeZone);
  const due = sql`coalesce(${workOrder.deferredDueDate}, ${workOrder.dueDate})`;
  const changedIds = [...new Set(changes.map((c) => c.workOrderId))];
  const workOrders = await db
    .select(DIGEST_COLUMNS)
    .from(workOrder)
    .where(
      and(
        eq(workOrder.companyId, companyId),
        eq(workOrder.vesselId, v.id),
        or(
          changedIds.length ? inArray(workOrder.id, changedIds) : undefined,
          and(ne(workOrder.state, "done"), gte(due, from), lte(due, until)),
        ),
      ),
    );
  return { changes, workOrders };
}

/** Open work late and out of tolerance on the vessel now. */
export async function loadStandingTotals(db: Conn, companyId: string, vesselId: string) {
  const [row] = await db
    .select({
      late: sql<number>`count(*) filter (where ${workOrder.state} = 'late')::int`,
      outOfTolerance: sql<number>`count(*) filter (where ${workOrder.state} = 'out-of-tolerance')::int`,
    })
    .from(workOrder)
    .where(
      and(
        eq(workOrder.companyId, companyId),
        eq(workOrder.vesselId, vesselId),
        inArray(workOrder.state, ["late", "out-of-tolerance"]),
      ),
    );
  return { late: row?.late ?? 0, outOfTolerance: row?.outOfTolerance ?? 0 };
}

/** The latest reading of each counter in use, up to `now`. */
export async function loadCounterReadings(
  db: Conn,
  companyId: string,
  vesselId: string,
  now: Date,
): Promise<CounterReading[]> {
  const counters = await db
    .select({ id: counter.id, name: counter.name })
    .from(counter)
    .where(and(eq(counter.companyId, companyId), eq(counter.vesselId, vesselId), isNull(counter.retiredAt)))
    .orderBy(asc(counter.sortOrder), asc(counter.name));
  if (counters.length === 0) return [];
  const latest = await db
    .selectDistinctOn([reading.counterId], {
      counterId: reading.counterId,
      readAt: reading.readAt,
      totalHours: reading.totalHours,
    })
    .from(reading)
    .where(
      and(
        eq(reading.companyId, companyId),
        inArray(
          reading.counterId,
          counters.map((c) => c.id),
        ),
        lte(reading.readAt, now),
      ),
    )
    .orderBy(reading.counterId, desc(reading.readAt));
  const byCounter = new Map(latest.map((r) => [r.counterId, r]));
  return counters.map((c) => ({
    name: c.name,
    readAt: byCounter.get(c.id)?.readAt ?? null,
    totalHours: byCounter.get(c.id)?.totalHours ?? null,
  }));
}

export type EscalationRow = EscalationCandidate & { workOrder: DigestWorkOrder };

/**
 * Changes into out-of-tolerance on the vessel not yet handled, locked for this run: a second run
 * at the same time skips them (SKIP LOCKED) and after the commit finds them marked.
 */
export async function lockUnhandledEscalations(
  tx: Tx,
  companyId: string,
  vesselId: string,
  now: Date,
): Promise<EscalationRow[]> {
  const rows = await tx
    .select({ id: workOrderStateChange.id, changedAt: workOrderStateChange.changedAt, workOrder: DIGEST_COLUMNS })
    .from(workOrderStateChange)
    .innerJoin(workOrder, eq(workOrder.id, workOrderStateChange.workOrderId))
    .where(
      and(
        eq(workOrderStateChange.companyId, companyId),
        eq(workOrder.companyId, companyId),
        eq(workOrder.vesselId, vesselId),
        eq(workOrderStateChange.toState, "out-of-tolerance"),
        isNull(workOrderStateChange.escalatedAt),
        lte(workOrderStateChange.changedAt, now),
      ),
    )
    .orderBy(asc(workOrderStateChange.changedAt), asc(workOrderStateChange.id))
    .for("update", { of: workOrderStateChange, skipLocked: true });
  return rows.map((r) => ({ ...r, workOrderState: r.workOrder.state }));
}

export async function markEscalated(tx: Tx, companyId: string, ids: string[], now: Date): Promise<void> {
  if (ids.length === 0) return;
  await tx
    .update(workOrderStateChange)
    .set({ escalatedAt: now })
    .where(and(eq(workOrderStateChange.companyId, companyId), inArray(workOrderStateChange.id, ids)));
}

/** Each active vessel's figures for the weekly summary, as of `now`. */
export async function loadFleetFigures(db: Conn, companyId: string, now: Date): Promise<FleetVesselFigures[]> {
  const weekAhead = new Date(now.getTime() + 7 * 86_400_000);
  const rows = await db
    .select({
      id: vessel.id,
      name: vessel.name,
      outOfTolerance: sql<number>`(select count(*)::int from ${workOrder} w where w.company_id = ${vessel.companyId} and w.vessel_id = ${vessel.id} and w.state = 'out-of-tolerance')`,
      criticalOrClassOutOfTolerance: sql<number>`(select count(*)::int from ${workOrder} w where w.company_id = ${vessel.companyId} and w.vessel_id = ${vessel.id} and w.state = 'out-of-tolerance' and (w.critical or w.class_related))`,
      late: sql<number>`(select count(*)::int from ${workOrder} w where w.company_id = ${vessel.companyId} and w.vessel_id = ${vessel.id} and w.state = 'late')`,
      dueSoon: sql<number>`(select count(*)::int from ${workOrder} w where w.company_id = ${vessel.companyId} and w.vessel_id = ${vessel.id} and w.state <> 'done' and coalesce(w.deferred_due_date, w.due_date) between ${now.toISOString()}::timestamptz and ${weekAhead.toISOString()}::timestamptz)`,
      lastReadingAt: sql<
        string | null
      >`(select max(r.read_at) from ${reading} r where r.company_id = ${vessel.companyId} and r.vessel_id = ${vessel.id} and r.read_at <= ${now.toISOString()}::timestamptz)`,
      pendingDeferrals: sql<number>`(select count(*)::int from ${deferral} d where d.company_id = ${vessel.companyId} and d.vessel_id = ${vessel.id} and d.status = 'pending')`,
    })
    .from(vessel)
    .where(and(eq(vessel.companyId, companyId), isNull(vessel.retiredAt)))
    .orderBy(asc(vessel.name));
  return rows.map((r) => ({ ...r, lastReadingAt: r.lastReadingAt ? new Date(r.lastReadingAt) : null }));
}
