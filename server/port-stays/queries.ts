// Port stays of a vessel: list, one with its accepted package, create, change, delete. Every query
// is scoped by the company and the vessel of the access door.
import "server-only";
import { and, asc, desc, eq, gte, inArray, lt, ne, sql } from "drizzle-orm";
import { type Db, getDb, type Tx } from "@/db/client";
import { component, portStay, user, workOrder, workPackageItem } from "@/db/schema";
import type { Access, VesselRef } from "@/server/auth/access";
import { can } from "@/server/auth/roles";
import { lockVesselWorkOrders } from "@/server/work-orders/lock";
import { AppError, fieldErrorsFromZod, invalidInput } from "@/server/http/problem";
import {
  type PackageItemView,
  type PackageJob,
  type PortStayDetail,
  PortStayInput,
  type PortStayList,
  type PortStayPatch,
  type PortStayValues,
  type PortStayView,
} from "./contract";
import { capacityProblems } from "./capacity";
import { instantOfShipDateTime, shipDateTimeOf, stayDays } from "./stay-days";

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
  return {
    id: row.id,
    port: row.port,
    arrivesAt: row.arrivesAt.toISOString(),
    departsAt: row.departsAt.toISOString(),
    arrivesLocal: shipDateTimeOf(row.arrivesAt, timeZone),
    departsLocal: shipDateTimeOf(row.departsAt, timeZone),
    days: stayDays(row.arrivesAt, row.departsAt, timeZone),
    engineMayStop: row.engineMayStop,
    immobilisationHours: row.immobilisationHours,
    crew: row.crew,
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
  // The crew of the stay entered last is the best guess for the next one.
  const [latest] = await db.select({ crew: portStay.crew }).from(portStay).where(scope).orderBy(desc(portStay.createdAt)).limit(1);
  return {
    timeZone: vessel.timeZone,
    upcoming: upcoming.map(view),
    past: past.map(view),
    latestCrew: latest?.crew ?? [],
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
  manHours: workOrder.estimatedManHours,
  needsEngineStop: workOrder.needsEngineStop,
  critical: workOrder.critical,
  classRelated: workOrder.classRelated,
  dueDate: workOrder.dueDate,
  deferredDueDate: workOrder.deferredDueDate,
  planFrom: workOrder.planFrom,
  planUntil: workOrder.planUntil,
};

type JobRow = Omit<PackageJob, "dueAt"> & { dueDate: Date | null; deferredDueDate: Date | null };

export function toJob(r: JobRow): PackageJob {
  const dueAt = r.deferredDueDate ?? r.dueDate;
  return {
    workOrderId: r.workOrderId,
    number: r.number,
    title: r.title,
    componentCode: r.componentCode,
    componentName: r.componentName,
    state: r.state,
    rank: r.rank,
    manHours: r.manHours,
    needsEngineStop: r.needsEngineStop,
    critical: r.critical,
    classRelated: r.classRelated,
    dueAt: dueAt?.toISOString() ?? null,
    planFrom: r.planFrom,
    planUntil: r.planUntil,
  };
}

export async function loadPackageItems(db: Db | Tx, companyId: string, stayId: string): Promise<PackageItemView[]> {
  const rows = await db
    .select({ ...jobColumns, date: workPackageItem.plannedDate, reason: workPackageItem.reason })
    .from(workPackageItem)
    .innerJoin(workOrder, and(eq(workOrder.id, workPackageItem.workOrderId), eq(workOrder.companyId, companyId)))
    .innerJoin(component, eq(component.id, workOrder.componentId))
    .where(and(eq(workPackageItem.companyId, companyId), eq(workPackageItem.portStayId, stayId)))
    .orderBy(asc(workPackageItem.plannedDate), asc(workPackageItem.position));
  return rows.map((r) => ({ ...toJob(r), date: r.date, reason: r.reason, tier: null }));
}

export async function loadPortStay(
  access: Access,
  vessel: VesselRef,
  stayId: string,
  now = new Date(),
): Promise<PortStayDetail> {
  const db = getDb();
  const row = await findStay(db, access, vessel, stayId);
  const items = await loadPackageItems(db, access.company.id, row.id);
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
  const arrivesAt = instantOfShipDateTime(values.arrivesAt, timeZone);
  const departsAt = instantOfShipDateTime(values.departsAt, timeZone);
  if (departsAt <= arrivesAt) {
    throw invalidInput([
      { field: "departsAt", message: "The departure must be after the arrival (mind the clock change that night)." },
    ]);
  }
  return {
    port: values.port,
    arrivesAt,
    departsAt,
    engineMayStop: values.engineMayStop,
    immobilisationHours: values.engineMayStop ? values.immobilisationHours : 0,
    crew: values.crew,
    remarks: values.remarks,
  };
}

export async function createPortStay(access: Access, vessel: VesselRef, values: PortStayValues): Promise<PortStayView> {
  const [row] = await getDb()
    .insert(portStay)
    .values({ companyId: access.company.id, vesselId: vessel.id, ...stayColumns(values, vessel.timeZone) })
    .returning();
  return stayView(row!, vessel.timeZone, 0, null);
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
      port: row.port,
      arrivesAt: shipDateTimeOf(row.arrivesAt, vessel.timeZone),
      departsAt: shipDateTimeOf(row.departsAt, vessel.timeZone),
      engineMayStop: row.engineMayStop,
      immobilisationHours: row.immobilisationHours,
      crew: row.crew,
      remarks: row.remarks,
      ...Object.fromEntries(Object.entries(patch).filter(([, v]) => v !== undefined)),
    });
    if (!merged.success) throw invalidInput(fieldErrorsFromZod(merged.error));
    const columns = stayColumns(merged.data, vessel.timeZone);

    const items = await tx
      .select({
        date: workPackageItem.plannedDate,
        number: workOrder.number,
        rank: workOrder.rank,
        manHours: workOrder.estimatedManHours,
        needsEngineStop: workOrder.needsEngineStop,
      })
      .from(workPackageItem)
      .innerJoin(workOrder, eq(workOrder.id, workPackageItem.workOrderId))
      .where(and(eq(workPackageItem.companyId, access.company.id), eq(workPackageItem.portStayId, row.id)))
      .orderBy(asc(workPackageItem.position));
    const days = new Set(stayDays(columns.arrivesAt, columns.departsAt, vessel.timeZone));
    const outside = items.filter((i) => !days.has(i.date));
    if (outside.length) {
      const field = "arrivesAt" in patch && patch.arrivesAt !== undefined ? "arrivesAt" : "departsAt";
      throw invalidInput([
        {
          field,
          message: `The accepted package has work on days outside these dates (${outside
            .map((i) => `${i.number} on ${i.date}`)
            .join(", ")}): move or remove those jobs first.`,
        },
      ]);
    }
    // Fewer hours for a rank, or less (or no) immobilisation: the accepted package must still fit.
    const overrun = capacityProblems(columns, items);
    if (overrun.length) {
      const field = overrun.some((p) => p.kind === "crew") ? "crew" : columns.engineMayStop ? "immobilisationHours" : "engineMayStop";
      throw invalidInput([
        {
          field,
          message: `The accepted package would no longer fit: ${overrun.map((p) => p.message).join(" ")} Move or remove those jobs first.`,
        },
      ]);
    }
    const [updated] = await tx
      .update(portStay)
      .set({ ...columns, updatedAt: new Date() })
      .where(and(eq(portStay.companyId, access.company.id), eq(portStay.id, row.id)))
      .returning();
    return stayView(updated!, vessel.timeZone, items.length, null);
  });
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
    await tx.delete(portStay).where(and(eq(portStay.companyId, access.company.id), eq(portStay.id, row.id)));
    return { deleted: row.id, released };
  });
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
