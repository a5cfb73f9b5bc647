// Port stays of a vessel: list, one with its accepted package, create, change, delete. Every query
// is scoped by the company and the vessel of the access door.
import "server-only";
import { and, asc, desc, eq, gte, inArray, lt, ne, sql } from "drizzle-orm";
import { type Db, getDb, type Tx } from "@/db/client";
import { component, portStay, user, workOrder, workPackageItem } from "@/db/schema";
import type { Access, VesselRef } from "@/server/auth/access";
import { can } from "@/server/auth/roles";
import { requestRecompute } from "@/server/jobs/recompute-vessel";
import { lockVesselWorkOrders } from "@/server/work-orders/lock";
import { AppError, fieldErrorsFromZod, invalidInput } from "@/server/http/problem";
import { groupOf } from "@/server/planning/job-classes";
import { checkPackage } from "@/server/planning/package-check";
import {
  clockMinutes,
  type PackageJob,
  type PlacedView,
  type PortStayDetail,
  PortStayInput,
  type PortStayList,
  type PortStayPatch,
  type PortStayValues,
  type PortStayView,
} from "./contract";
import { planJobOf, planStayOf } from "./plan-input";
import { clockWords, instantOfShipDateTime, shipDateTimeOf, stayDays } from "./stay-days";
import { loadRankNames } from "@/server/admin/rank-names";

const PAST_LIMIT = 20;

export type StayRow = typeof portStay.$inferSelect;

const noSuchStay = () => new AppError("not-found", "There is no such port stay on this vessel.");

/** The stay row of this vessel, or 404 (another vessel's or company's stay looks the same). */
export async function findStay(db: Db | Tx, access: Access, vessel: VesselRef, stayId: string): Promise<StayRow> {
  const [row] = await db
    .select()
    .from(portStay)
    .where(and(eq(portStay.companyId, access.company.id), eq(portStay.vesselId, vessel.id), eq(portStay.id, stayId)));
  if (!row) throw noSuchStay();
  return row;
}

function stayView(row: StayRow, timeZone: string, itemCount: number, acceptedBy: string | null): PortStayView {
  const local = (instant: Date) => shipDateTimeOf(instant, timeZone);
  return {
    id: row.id,
    port: row.port,
    arrivesAt: row.arrivesAt.toISOString(),
    departsAt: row.departsAt.toISOString(),
    arrivesLocal: local(row.arrivesAt),
    departsLocal: local(row.departsAt),
    days: stayDays(row.arrivesAt, row.departsAt, timeZone),
    workdayFrom: clockWords(row.workdayFrom),
    workdayTo: clockWords(row.workdayTo),
    engineStop:
      row.engineStopFrom && row.engineStopTo
        ? {
            from: row.engineStopFrom.toISOString(),
            to: row.engineStopTo.toISOString(),
            fromLocal: local(row.engineStopFrom),
            toLocal: local(row.engineStopTo),
          }
        : null,
    crew: row.crew,
    watches: row.watches.map((w) => ({ ...w, fromLocal: local(new Date(w.from)), toLocal: local(new Date(w.to)) })),
    remarks: row.remarks,
    packageAcceptedAt: row.packageAcceptedAt?.toISOString() ?? null,
    packageAcceptedBy: acceptedBy,
    itemCount,
  };
}

export async function listPortStays(access: Access, vessel: VesselRef, now = new Date()): Promise<PortStayList> {
  const db = getDb();
  const scope = and(eq(portStay.companyId, access.company.id), eq(portStay.vesselId, vessel.id));
  const itemCount = sql<number>`(select count(*)::int from ${workPackageItem} where ${workPackageItem.companyId} = ${portStay.companyId} and ${workPackageItem.portStayId} = ${portStay.id})`;
  const columns = { s: portStay, itemCount, acceptedBy: user.name };
  const [upcoming, past] = await Promise.all([
    db
      .select(columns)
      .from(portStay)
      .leftJoin(user, eq(user.id, portStay.packageAcceptedBy))
      .where(and(scope, gte(portStay.departsAt, now)))
      .orderBy(asc(portStay.arrivesAt)),
    db
      .select(columns)
      .from(portStay)
      .leftJoin(user, eq(user.id, portStay.packageAcceptedBy))
      .where(and(scope, lt(portStay.departsAt, now)))
      .orderBy(desc(portStay.arrivesAt))
      .limit(PAST_LIMIT),
  ]);
  const view = (r: (typeof upcoming)[number]) => stayView(r.s, vessel.timeZone, r.itemCount, r.acceptedBy);
  // The crew and working day of the stay entered last are the best guess for the next one.
  const [latest] = await db
    .select({ crew: portStay.crew, from: portStay.workdayFrom, to: portStay.workdayTo })
    .from(portStay)
    .where(scope)
    .orderBy(desc(portStay.createdAt))
    .limit(1);
  return {
    timeZone: vessel.timeZone,
    upcoming: upcoming.map(view),
    past: past.map(view),
    latest: latest ? { crew: latest.crew, workdayFrom: clockWords(latest.from), workdayTo: clockWords(latest.to) } : null,
    may: { plan: can(access.role, "work:plan") },
  };
}

/** The columns of a work order the package shows; join `component` on the work order's component. */
export const jobColumns = {
  workOrderId: workOrder.id,
  number: workOrder.number,
  title: workOrder.title,
  componentCode: component.code,
  componentName: component.name,
  state: workOrder.state,
  rank: workOrder.rank,
  team: workOrder.team,
  elapsedHours: workOrder.elapsedHours,
  manHours: workOrder.estimatedManHours,
  needsEngineStop: workOrder.needsEngineStop,
  needsPort: workOrder.needsPort,
  portEvent: workOrder.portEvent,
  portEventHours: workOrder.portEventHours,
  critical: workOrder.critical,
  classRelated: workOrder.classRelated,
  dueDate: workOrder.dueDate,
  deferredDueDate: workOrder.deferredDueDate,
  outOfToleranceAt: workOrder.outOfToleranceAt,
  planFrom: workOrder.planFrom,
  planUntil: workOrder.planUntil,
};

export type JobRow = {
  workOrderId: string;
  number: string;
  title: string;
  componentCode: string;
  componentName: string;
  state: PackageJob["state"];
  rank: string;
  team: { rank: string; count: number }[];
  elapsedHours: number;
  manHours: number;
  needsEngineStop: boolean;
  needsPort: boolean;
  portEvent: "departure" | "arrival" | null;
  portEventHours: number | null;
  critical: boolean;
  classRelated: boolean;
  dueDate: Date | null;
  deferredDueDate: Date | null;
  outOfToleranceAt: Date | null;
  planFrom: string | null;
  planUntil: string | null;
};

export function toJob(r: JobRow): PackageJob {
  const dueAt = r.deferredDueDate ?? r.dueDate;
  return {
    workOrderId: r.workOrderId,
    number: r.number,
    title: r.title,
    componentCode: r.componentCode,
    componentName: r.componentName,
    state: r.state,
    // A work order written before teams holds one person of its rank for its man-hours.
    team: r.team.length ? r.team : [{ rank: r.rank, count: 1 }],
    elapsedHours: r.team.length ? r.elapsedHours : r.manHours,
    manHours: r.manHours,
    needsEngineStop: r.needsEngineStop,
    needsPort: r.needsPort,
    tiedTo: r.portEvent && r.portEventHours ? { event: r.portEvent, withinHours: r.portEventHours } : null,
    critical: r.critical,
    classRelated: r.classRelated,
    dueAt: dueAt?.toISOString() ?? null,
    planFrom: r.planFrom,
    planUntil: r.planUntil,
  };
}

/** A job of the package on the stay's clock, for the page. */
export function placedView(
  job: PackageJob,
  placed: { segments: { from: Date; to: Date }[]; people: string[] },
  timeZone: string,
  extra: Pick<PlacedView, "reason" | "urgency">,
): PlacedView {
  const start = placed.segments[0]!.from;
  return {
    ...job,
    start: start.toISOString(),
    end: placed.segments[placed.segments.length - 1]!.to.toISOString(),
    startLocal: shipDateTimeOf(start, timeZone),
    segments: placed.segments.map((s) => ({ from: s.from.toISOString(), to: s.to.toISOString() })),
    people: placed.people,
    group: groupOf(job),
    ...extra,
  };
}

export async function loadPackageItems(
  db: Db | Tx,
  companyId: string,
  stayId: string,
  timeZone: string,
): Promise<PlacedView[]> {
  const rows = await db
    .select({
      ...jobColumns,
      date: workPackageItem.plannedDate,
      reason: workPackageItem.reason,
      segments: workPackageItem.segments,
      people: workPackageItem.people,
    })
    .from(workPackageItem)
    .innerJoin(workOrder, and(eq(workOrder.id, workPackageItem.workOrderId), eq(workOrder.companyId, companyId)))
    .innerJoin(component, eq(component.id, workOrder.componentId))
    .where(and(eq(workPackageItem.companyId, companyId), eq(workPackageItem.portStayId, stayId)))
    .orderBy(asc(workPackageItem.startsAt), asc(workPackageItem.position));
  return rows.map((r) => {
    const segments = r.segments.map((s) => ({ from: new Date(s.from), to: new Date(s.to) }));
    return placedView(toJob(r), { segments, people: r.people }, timeZone, { reason: r.reason, urgency: null });
  });
}

export async function loadPortStay(
  access: Access,
  vessel: VesselRef,
  stayId: string,
  now = new Date(),
): Promise<PortStayDetail> {
  const db = getDb();
  const row = await findStay(db, access, vessel, stayId);
  const items = await loadPackageItems(db, access.company.id, row.id, vessel.timeZone);
  const [accepter] = row.packageAcceptedBy
    ? await db.select({ name: user.name }).from(user).where(eq(user.id, row.packageAcceptedBy))
    : [];
  return {
    vessel: { id: vessel.id, name: vessel.name, code: vessel.code, timeZone: vessel.timeZone },
    stay: stayView(row, vessel.timeZone, items.length, accepter?.name ?? null),
    items,
    now: now.toISOString(),
    may: { plan: can(access.role, "work:plan") },
  };
}

/** The stay's columns from the form's ship's-clock values; refuses a clock change that undoes the order. */
function stayColumns(values: PortStayValues, timeZone: string) {
  const at = (value: string) => instantOfShipDateTime(value, timeZone);
  const arrivesAt = at(values.arrivesAt);
  const departsAt = at(values.departsAt);
  if (departsAt <= arrivesAt) {
    throw invalidInput([
      { field: "departsAt", message: "The departure must be after the arrival (mind the clock change that night)." },
    ]);
  }
  return {
    port: values.port,
    arrivesAt,
    departsAt,
    workdayFrom: clockMinutes(values.workdayFrom),
    workdayTo: clockMinutes(values.workdayTo),
    engineStopFrom: values.engineStop ? at(values.engineStop.from) : null,
    engineStopTo: values.engineStop ? at(values.engineStop.to) : null,
    // Only people on board keep a stay's hours: a rank of 0 is the same as no row.
    crew: values.crew.filter((row) => row.count > 0),
    watches: values.watches.map((w) => ({
      rank: w.rank,
      person: w.person,
      from: at(w.from).toISOString(),
      to: at(w.to).toISOString(),
      label: w.label,
    })),
    remarks: values.remarks,
  };
}

/** The form's values of a stored stay: what a change is merged into. */
function stayValues(row: StayRow, timeZone: string): PortStayInput {
  const local = (instant: Date) => shipDateTimeOf(instant, timeZone);
  return {
    port: row.port,
    arrivesAt: local(row.arrivesAt),
    departsAt: local(row.departsAt),
    workdayFrom: clockWords(row.workdayFrom),
    workdayTo: clockWords(row.workdayTo),
    engineStop:
      row.engineStopFrom && row.engineStopTo ? { from: local(row.engineStopFrom), to: local(row.engineStopTo) } : null,
    crew: row.crew as PortStayInput["crew"],
    watches: row.watches.map((w) => ({ ...w, rank: w.rank as PortStayInput["crew"][number]["rank"], from: local(new Date(w.from)), to: local(new Date(w.to)) })),
    remarks: row.remarks,
  };
}

/**
 * Creates a stay. Routines tied to a stay's departure or arrival fall due at it, so the worker
 * recomputes the vessel (the job is sent in the same transaction: no stay without its recompute).
 */
export async function createPortStay(access: Access, vessel: VesselRef, values: PortStayValues): Promise<PortStayView> {
  return getDb().transaction(async (tx) => {
    const [row] = await tx
      .insert(portStay)
      .values({ companyId: access.company.id, vesselId: vessel.id, ...stayColumns(values, vessel.timeZone) })
      .returning();
    await requestRecompute(tx, access.company.id, vessel.id);
    return stayView(row!, vessel.timeZone, 0, null);
  });
}

/**
 * Merges the change into the stay and checks the whole again. With an accepted package, new dates
 * must still hold every planned day: the chief moves or removes those jobs first.
 */
export async function updatePortStay(
  access: Access,
  vessel: VesselRef,
  stayId: string,
  patch: PortStayPatch,
): Promise<PortStayView> {
  return getDb().transaction(async (tx) => {
    await lockVesselWorkOrders(tx, vessel.id);
    const row = await findStay(tx, access, vessel, stayId);
    const merged = PortStayInput.safeParse({
      ...stayValues(row, vessel.timeZone),
      ...Object.fromEntries(Object.entries(patch).filter(([, v]) => v !== undefined)),
    });
    if (!merged.success) throw invalidInput(fieldErrorsFromZod(merged.error));
    const columns = stayColumns(merged.data, vessel.timeZone);

    // The accepted package must still hold on the changed stay: same times, same people.
    const items = await tx
      .select({
        ...jobColumns,
        startsAt: workPackageItem.startsAt,
        people: workPackageItem.people,
      })
      .from(workPackageItem)
      .innerJoin(workOrder, eq(workOrder.id, workPackageItem.workOrderId))
      .innerJoin(component, eq(component.id, workOrder.componentId))
      .where(and(eq(workPackageItem.companyId, access.company.id), eq(workPackageItem.portStayId, row.id)))
      .orderBy(asc(workPackageItem.position));
    if (items.length) {
      const { problems } = checkPackage(
        planStayOf({ ...row, ...columns }, vessel.timeZone),
        items.map((i) => ({ job: planJobOf(toJob(i), i.outOfToleranceAt), start: i.startsAt ?? columns.arrivesAt, people: i.people })),
        undefined,
        await loadRankNames(access.company.id),
      );
      if (problems.length) {
        throw invalidInput([
          {
            field: changedField(patch),
            message: `The accepted package would no longer fit: ${problems.map((p) => p.message).join(" ")} Move or remove those jobs first.`,
          },
        ]);
      }
    }
    const [updated] = await tx
      .update(portStay)
      .set({ ...columns, updatedAt: new Date() })
      .where(and(eq(portStay.companyId, access.company.id), eq(portStay.id, row.id)))
      .returning();
    // New times move the work tied to the stay's departure or arrival.
    await requestRecompute(tx, access.company.id, vessel.id);
    return stayView(updated!, vessel.timeZone, items.length, null);
  });
}

/** The field a refused change is reported on: the first one the patch changed that shapes the plan. */
function changedField(patch: PortStayPatch): string {
  const order = ["arrivesAt", "departsAt", "engineStop", "workdayFrom", "workdayTo", "crew", "watches"] as const;
  return order.find((f) => patch[f] !== undefined) ?? "departsAt";
}

/**
 * Deletes a stay. A stay with an accepted package keeps planned dates on work orders, so deleting it
 * is refused (409) unless `releasePackage` says to clear them as well: then, in the same transaction,
 * each open work order still planned on its package day loses that planned date (one re-planned since,
 * e.g. on the Calendar, keeps its new date; done work keeps its record).
 */
export async function deletePortStay(
  access: Access,
  vessel: VesselRef,
  stayId: string,
  releasePackage: boolean,
): Promise<{ deleted: string; released: number }> {
  return getDb().transaction(async (tx) => {
    await lockVesselWorkOrders(tx, vessel.id);
    const row = await findStay(tx, access, vessel, stayId);
    const items = await tx
      .select({ workOrderId: workPackageItem.workOrderId, date: workPackageItem.plannedDate })
      .from(workPackageItem)
      .where(and(eq(workPackageItem.companyId, access.company.id), eq(workPackageItem.portStayId, row.id)));
    if (items.length && !releasePackage) {
      throw new AppError(
        "conflict",
        `${row.port} has an accepted work package of ${items.length} job${items.length === 1 ? "" : "s"}. Delete it with its package to clear their planned dates, or keep the stay.`,
      );
    }
    const released = await clearPlannedDates(tx, access.company.id, items);
    await dropTiedWorkOrders(tx, access.company.id, vessel.id, row);
    await tx.delete(portStay).where(and(eq(portStay.companyId, access.company.id), eq(portStay.id, row.id)));
    await requestRecompute(tx, access.company.id, vessel.id);
    return { deleted: row.id, released };
  });
}

/**
 * The open work orders of routines tied to this stay's departure or arrival, not yet due and with
 * nothing recorded on them (no completion, no deferral): their occurrence leaves with the stay, and
 * the recompute gives the next stay its own. One already past its due point stays: a ship that
 * sailed untested has a statutory miss to show, whatever becomes of the stay's record.
 */
async function dropTiedWorkOrders(
  tx: Tx,
  companyId: string,
  vesselId: string,
  stay: { arrivesAt: Date; departsAt: Date },
): Promise<void> {
  await tx.execute(sql`
    delete from work_order w
    using routine r
    where w.company_id = ${companyId} and w.vessel_id = ${vesselId} and w.state <> 'done'
      and r.id = w.routine_id and r.company_id = ${companyId} and r.port_event is not null
      and w.due_date > now()
      and w.due_date = case r.port_event
        when 'departure' then ${stay.departsAt.toISOString()}::timestamptz
        else least(${stay.arrivesAt.toISOString()}::timestamptz + r.port_event_hours * interval '1 hour', ${stay.departsAt.toISOString()}::timestamptz)
      end
      and not exists (select 1 from completion c where c.work_order_id = w.id)
      and not exists (select 1 from deferral d where d.work_order_id = w.id)`);
}

/** Clears the planned date of open work orders still planned on the given day; returns how many. */
export async function clearPlannedDates(
  tx: Tx,
  companyId: string,
  items: readonly { workOrderId: string; date: string }[],
): Promise<number> {
  let cleared = 0;
  for (const item of items) {
    const done = await tx
      .update(workOrder)
      .set({ plannedDate: null })
      .where(
        and(
          eq(workOrder.companyId, companyId),
          eq(workOrder.id, item.workOrderId),
          eq(workOrder.plannedDate, item.date),
          ne(workOrder.state, "done"),
        ),
      )
      .returning({ id: workOrder.id });
    cleared += done.length;
  }
  return cleared;
}

/**
 * Work orders already in the accepted package of another stay of the vessel that has not sailed yet,
 * with where they are. (A job left undone in a past stay may go into the next one.)
 */
export async function packagedElsewhere(
  db: Db | Tx,
  companyId: string,
  vesselId: string,
  stayId: string,
  now: Date,
  workOrderIds?: readonly string[],
): Promise<Map<string, { port: string; date: string }>> {
  if (workOrderIds && workOrderIds.length === 0) return new Map();
  const rows = await db
    .select({ workOrderId: workPackageItem.workOrderId, date: workPackageItem.plannedDate, port: portStay.port })
    .from(workPackageItem)
    .innerJoin(portStay, eq(portStay.id, workPackageItem.portStayId))
    .where(
      and(
        eq(workPackageItem.companyId, companyId),
        eq(workPackageItem.vesselId, vesselId),
        ne(workPackageItem.portStayId, stayId),
        gte(portStay.departsAt, now),
        ...(workOrderIds ? [inArray(workPackageItem.workOrderId, [...workOrderIds])] : []),
      ),
    );
  return new Map(rows.map((r) => [r.workOrderId, { port: r.port, date: r.date }]));
}
