// The survey and audit report's data for a vessel and a period of ship's days, scoped by the access
// door's company and vessel. The critical and class-related routines are read by a query of the
// report's own: the class items (server/class-items) hold class-related routines only, the report
// critical equipment too. Deferrals and defects come from their areas' own lists.
import "server-only";
import { and, asc, desc, eq, gte, inArray, isNull, lt, ne, or, sql } from "drizzle-orm";
import { getDb } from "@/db/client";
import { completion, component, counter, reading, routine, workOrder, workOrderStateChange } from "@/db/schema";
import type { Access, VesselRef } from "@/server/auth/access";
import { listDefects } from "@/server/defects/queries";
import type { DefectView } from "@/server/defects/contract";
import type { DeferralListItem } from "@/server/deferrals/contract";
import { listVesselDeferrals } from "@/server/deferrals/queries";
import { instantOfShipTime, shipDay } from "@/server/format/hours";
import { addShipDays, shipDateFromKey, shipDateKey } from "@/server/scheduling/ship-date";
import { type Coverage, daysOf, doneLate, readingCoverage } from "./survey-rules";

export type SurveyRoutine = {
  id: string;
  title: string;
  classItemRef: string | null;
  critical: boolean;
  classRelated: boolean;
  component: { code: string; name: string; classItemRef: string | null };
  open: {
    number: string;
    state: string;
    dueDate: Date | null;
    dueHours: number | null;
    deferredDueDate: Date | null;
    deferredDueHours: number | null;
    windowOpensAt: Date | null;
    graceEndsAt: Date | null;
    windowOpensHours: number | null;
    graceEndsHours: number | null;
  } | null;
  lastDone: { doneAt: Date; counterHours: number | null } | null;
};

export type SurveyCounter = { name: string; coverage: Coverage; lastReading: { readAt: Date; totalHours: number } | null };

export type LateWork = {
  number: string;
  title: string;
  component: { code: string; name: string };
  critical: boolean;
  classRelated: boolean;
  doneAt: Date;
  counterHours: number | null;
  dueAt: Date | null;
  dueHours: number | null;
  judged: "late" | "out-of-tolerance";
};

export type SurveyData = {
  from: string;
  to: string;
  routines: SurveyRoutine[];
  deferrals: DeferralListItem[];
  defects: DefectView[];
  counters: SurveyCounter[];
  lateWork: LateWork[];
};

export async function loadSurveyData(access: Access, vessel: VesselRef, from: string, to: string, now = new Date()): Promise<SurveyData> {
  const [routines, deferrals, defects, counters, lateWork] = await Promise.all([
    flaggedRoutines(access.company.id, vessel.id),
    listVesselDeferrals(access, vessel, "all"),
    listDefects(access, vessel, "open", now),
    readingsCoverage(access.company.id, vessel, from, to, now),
    lateWorkDone(access.company.id, vessel, from, to),
  ]);
  return {
    from,
    to,
    routines,
    // Open: waiting for a decision, or approved and still in force on work not yet done.
    deferrals: deferrals.filter((d) => d.status === "pending" || (d.status === "approved" && d.workOrder.state !== "done")),
    defects: defects.defects,
    counters,
    lateWork,
  };
}

async function flaggedRoutines(companyId: string, vesselId: string): Promise<SurveyRoutine[]> {
  const db = getDb();
  const rows = await db
    .select({
      id: routine.id,
      title: routine.title,
      classItemRef: routine.classItemRef,
      critical: routine.critical,
      classRelated: routine.classRelated,
      component: { code: component.code, name: component.name, classItemRef: component.classItemRef },
    })
    .from(routine)
    .innerJoin(component, eq(component.id, routine.componentId))
    .where(
      and(
        eq(routine.companyId, companyId),
        eq(routine.vesselId, vesselId),
        isNull(routine.retiredAt),
        or(eq(routine.critical, true), eq(routine.classRelated, true)),
      ),
    )
    .orderBy(desc(routine.classRelated), asc(component.code), asc(routine.title));
  if (!rows.length) return [];
  const ids = rows.map((r) => r.id);
  const open = await db
    .select({
      routineId: workOrder.routineId,
      number: workOrder.number,
      state: workOrder.state,
      dueDate: workOrder.dueDate,
      dueHours: workOrder.dueHours,
      deferredDueDate: workOrder.deferredDueDate,
      deferredDueHours: workOrder.deferredDueHours,
      windowOpensAt: workOrder.windowOpensAt,
      graceEndsAt: workOrder.graceEndsAt,
      windowOpensHours: workOrder.windowOpensHours,
      graceEndsHours: workOrder.graceEndsHours,
    })
    .from(workOrder)
    .where(and(eq(workOrder.companyId, companyId), eq(workOrder.vesselId, vesselId), inArray(workOrder.routineId, ids), ne(workOrder.state, "done")))
    .orderBy(asc(workOrder.occurrence));
  const last = await db
    .selectDistinctOn([workOrder.routineId], { routineId: workOrder.routineId, doneAt: completion.doneAt, counterHours: completion.counterHours })
    .from(completion)
    .innerJoin(workOrder, eq(workOrder.id, completion.workOrderId))
    .where(
      and(
        eq(completion.companyId, companyId),
        eq(completion.vesselId, vesselId),
        eq(completion.status, "approved"),
        inArray(workOrder.routineId, ids),
      ),
    )
    .orderBy(workOrder.routineId, desc(completion.doneAt));
  const openOf = new Map<string, SurveyRoutine["open"]>();
  for (const { routineId, ...o } of open) if (routineId && !openOf.has(routineId)) openOf.set(routineId, o);
  const lastOf = new Map(last.map((l) => [l.routineId, { doneAt: l.doneAt, counterHours: l.counterHours }]));
  return rows.map((r) => ({ ...r, open: openOf.get(r.id) ?? null, lastDone: lastOf.get(r.id) ?? null }));
}

/** The period's end: the last day's end on the ship's clock, never past now. */
function periodInstants(vessel: VesselRef, from: string, to: string) {
  const start = instantOfShipTime(from, "00:00", vessel.timeZone);
  const end = instantOfShipTime(shipDateKey(addShipDays(shipDateFromKey(to), 1)), "00:00", vessel.timeZone);
  return { start, end };
}

async function readingsCoverage(companyId: string, vessel: VesselRef, from: string, to: string, now: Date): Promise<SurveyCounter[]> {
  const db = getDb();
  const { start, end } = periodInstants(vessel, from, to);
  const counters = await db
    .select({ id: counter.id, name: counter.name, createdAt: counter.createdAt, retiredAt: counter.retiredAt })
    .from(counter)
    .where(and(eq(counter.companyId, companyId), eq(counter.vesselId, vessel.id)))
    .orderBy(asc(counter.sortOrder), asc(counter.name));
  // Counters retired before the period began are not part of it.
  const inPeriod = counters.filter((c) => !c.retiredAt || c.retiredAt >= start);
  if (!inPeriod.length) return [];
  const ids = inPeriod.map((c) => c.id);
  const day = sql<string>`to_char(${reading.readAt} at time zone ${vessel.timeZone}, 'YYYY-MM-DD')`;
  const [readDays, firsts, lasts] = await Promise.all([
    db
      .selectDistinct({ counterId: reading.counterId, day })
      .from(reading)
      .where(and(eq(reading.companyId, companyId), eq(reading.vesselId, vessel.id), inArray(reading.counterId, ids), gte(reading.readAt, start), lt(reading.readAt, end))),
    db
      .select({ counterId: reading.counterId, first: sql<Date>`min(${reading.readAt})`.mapWith((v) => new Date(v)) })
      .from(reading)
      .where(and(eq(reading.companyId, companyId), eq(reading.vesselId, vessel.id), inArray(reading.counterId, ids)))
      .groupBy(reading.counterId),
    db
      .selectDistinctOn([reading.counterId], { counterId: reading.counterId, readAt: reading.readAt, totalHours: reading.totalHours })
      .from(reading)
      .where(and(eq(reading.companyId, companyId), eq(reading.vesselId, vessel.id), inArray(reading.counterId, ids), lt(reading.readAt, end)))
      .orderBy(reading.counterId, desc(reading.readAt)),
  ]);
  // Only whole days are expected: today's reading may still come, and days to come are not yet.
  const yesterday = shipDateKey(addShipDays(shipDateFromKey(shipDay(now, vessel.timeZone)), -1));
  const period = daysOf(from, to < yesterday ? to : yesterday);
  const firstOf = new Map(firsts.map((f) => [f.counterId, f.first]));
  const lastOf = new Map(lasts.map((l) => [l.counterId, l]));
  return inPeriod.map((c) => {
    const days = new Set(readDays.filter((r) => r.counterId === c.id).map((r) => r.day));
    const first = firstOf.get(c.id);
    // From its first reading, or from its making when it was never read.
    const countFrom = first ? shipDay(first, vessel.timeZone) : shipDay(c.createdAt, vessel.timeZone);
    const last = lastOf.get(c.id);
    return {
      name: c.name,
      coverage: readingCoverage(period, days, countFrom),
      lastReading: last && last.readAt >= start ? { readAt: last.readAt, totalHours: last.totalHours } : null,
    };
  });
}

async function lateWorkDone(companyId: string, vessel: VesselRef, from: string, to: string): Promise<LateWork[]> {
  const { start, end } = periodInstants(vessel, from, to);
  // The state the work order was in when the job was done: its last change before that instant.
  const stateWhenDone = sql<string | null>`(
    select ${workOrderStateChange.toState} from ${workOrderStateChange}
    where ${workOrderStateChange.companyId} = ${companyId}
      and ${workOrderStateChange.workOrderId} = ${workOrder.id}
      and ${workOrderStateChange.changedAt} <= ${completion.doneAt}
      and ${workOrderStateChange.toState} <> 'done'
    order by ${workOrderStateChange.changedAt} desc limit 1)`;
  const rows = await getDb()
    .select({
      number: workOrder.number,
      title: workOrder.title,
      component: { code: component.code, name: component.name },
      critical: workOrder.critical,
      classRelated: workOrder.classRelated,
      doneAt: completion.doneAt,
      counterHours: completion.counterHours,
      dueDate: workOrder.dueDate,
      deferredDueDate: workOrder.deferredDueDate,
      dueHours: workOrder.dueHours,
      deferredDueHours: workOrder.deferredDueHours,
      graceEndsAt: workOrder.graceEndsAt,
      graceEndsHours: workOrder.graceEndsHours,
      stateWhenDone,
    })
    .from(completion)
    .innerJoin(workOrder, eq(workOrder.id, completion.workOrderId))
    .innerJoin(component, eq(component.id, workOrder.componentId))
    .where(
      and(
        eq(completion.companyId, companyId),
        eq(completion.vesselId, vessel.id),
        eq(completion.status, "approved"),
        gte(completion.doneAt, start),
        lt(completion.doneAt, end),
        eq(workOrder.companyId, companyId),
      ),
    )
    .orderBy(asc(completion.doneAt), asc(workOrder.number));
  return rows.flatMap((r) => {
    const dueAt = r.deferredDueDate ?? r.dueDate;
    const dueHours = r.deferredDueHours ?? r.dueHours;
    const judged = doneLate({
      doneAt: r.doneAt,
      counterHours: r.counterHours,
      stateWhenDone: r.stateWhenDone,
      dueAt,
      graceEndsAt: r.graceEndsAt,
      dueHours,
      graceEndsHours: r.graceEndsHours,
    });
    if (!judged) return [];
    return [{ number: r.number, title: r.title, component: r.component, critical: r.critical, classRelated: r.classRelated, doneAt: r.doneAt, counterHours: r.counterHours, dueAt, dueHours, judged }];
  });
}
