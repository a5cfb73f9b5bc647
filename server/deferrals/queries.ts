// Deferral requests as the pages read them: a work order's history, a vessel's requests, the
// fleet's pending ones, and the work order page's Deferral section. Scoped by company and vessel.
import "server-only";
import { aliasedTable, and, desc, eq, inArray, type SQL } from "drizzle-orm";
import { getDb } from "@/db/client";
import { company, deferral, routine, user, vessel as vesselTable, workOrder } from "@/db/schema";
import type { Access, VesselRef } from "@/server/auth/access";
import { can } from "@/server/auth/roles";
import { shipDay } from "@/server/format/hours";
import { isoInstant } from "@/server/format/iso";
import { AppError } from "@/server/http/problem";
import type { WorkOrderRow } from "@/server/work-orders/fields";
import { workOrderColumns, workOrderView } from "@/server/work-orders/view";
import { DEFERRAL_LIST_FIELDS, type DeferralEntry, type DeferralListItem, type WorkOrderDeferrals } from "./contract";
import { highestDeferralHours, latestDeferralDay } from "./rules";

const requester = aliasedTable(user, "requester");
const decider = aliasedTable(user, "decider");

const entryColumns = {
  d: deferral,
  requestedBy: requester.name,
  decidedBy: decider.name,
};

function toEntry(row: { d: typeof deferral.$inferSelect; requestedBy: string | null; decidedBy: string | null }) {
  const { d } = row;
  return {
    id: d.id,
    workOrderId: d.workOrderId,
    status: d.status,
    reason: d.reason,
    proposedDueDay: d.proposedDueDay,
    proposedDueHours: d.proposedDueHours,
    needsOffice: d.needsOffice,
    requestedBy: row.requestedBy,
    requestedAt: d.requestedAt.toISOString(),
    decidedBy: row.decidedBy,
    decidedAt: isoInstant(d.decidedAt),
    decisionNote: d.decisionNote,
  } satisfies DeferralEntry;
}

/** A work order's requests, newest first. */
export async function loadDeferralHistory(
  companyId: string,
  vesselId: string,
  workOrderId: string,
): Promise<DeferralEntry[]> {
  const rows = await getDb()
    .select(entryColumns)
    .from(deferral)
    .leftJoin(requester, eq(requester.id, deferral.requestedBy))
    .leftJoin(decider, eq(decider.id, deferral.decidedBy))
    .where(
      and(eq(deferral.companyId, companyId), eq(deferral.vesselId, vesselId), eq(deferral.workOrderId, workOrderId)),
    )
    .orderBy(desc(deferral.requestedAt));
  return rows.map(toEntry);
}

/** The same, for the route handler: a work order not on this vessel is not found. */
export async function loadWorkOrderDeferralHistory(
  access: Access,
  vessel: VesselRef,
  workOrderId: string,
): Promise<DeferralEntry[]> {
  const companyId = access.company.id;
  const [w] = await getDb()
    .select({ id: workOrder.id })
    .from(workOrder)
    .where(and(eq(workOrder.companyId, companyId), eq(workOrder.vesselId, vessel.id), eq(workOrder.id, workOrderId)));
  if (!w) throw new AppError("not-found", "There is no such work order on this vessel.");
  return loadDeferralHistory(companyId, vessel.id, w.id);
}

async function listDeferrals(companyId: string, where: SQL[]): Promise<DeferralListItem[]> {
  const rows = await getDb()
    .select({
      ...entryColumns,
      w: workOrderColumns(DEFERRAL_LIST_FIELDS),
      v: { id: vesselTable.id, name: vesselTable.name, code: vesselTable.code },
    })
    .from(deferral)
    .innerJoin(workOrder, eq(workOrder.id, deferral.workOrderId))
    .innerJoin(vesselTable, eq(vesselTable.id, deferral.vesselId))
    .leftJoin(requester, eq(requester.id, deferral.requestedBy))
    .leftJoin(decider, eq(decider.id, deferral.decidedBy))
    .where(and(eq(deferral.companyId, companyId), eq(workOrder.companyId, companyId), ...where))
    .orderBy(desc(deferral.requestedAt));
  return rows.map((row) => ({
    ...toEntry(row),
    workOrder: workOrderView(row.w, DEFERRAL_LIST_FIELDS),
    vessel: row.v,
  }));
}

/** A vessel's requests: the pending ones (oldest waiting longest at the end), or all of them. */
export function listVesselDeferrals(
  access: Access,
  vessel: VesselRef,
  status: "pending" | "all",
): Promise<DeferralListItem[]> {
  return listDeferrals(access.company.id, [
    eq(deferral.vesselId, vessel.id),
    ...(status === "pending" ? [eq(deferral.status, "pending")] : []),
  ]);
}

/** Pending requests across the vessels the user may open: the superintendent's list (Fleet board). */
export async function listFleetPendingDeferrals(access: Access): Promise<DeferralListItem[]> {
  const vessels = access.assignedVesselIds;
  if (vessels !== null && vessels.length === 0) return [];
  return listDeferrals(access.company.id, [
    eq(deferral.status, "pending"),
    ...(vessels === null ? [] : [inArray(deferral.vesselId, vessels)]),
  ]);
}

export async function chiefDecidesDeferrals(companyId: string): Promise<boolean> {
  const [row] = await getDb()
    .select({ chiefDecides: company.chiefDecidesDeferrals })
    .from(company)
    .where(eq(company.id, companyId));
  return row?.chiefDecides ?? false;
}

/** Whether only the superintendent may decide: critical or class work, or the company's rule. */
export function needsOfficeDecision(w: { critical: boolean; classRelated: boolean }, chiefDecides: boolean): boolean {
  return w.critical || w.classRelated || !chiefDecides;
}

/** Whether this user may decide a request on this work order. */
export function mayDecide(access: Access, officeOnly: boolean): boolean {
  if (!can(access.role, "deferral:decide")) return false;
  return access.role === "superintendent" || !officeOnly;
}

/**
 * The limit in force: an approved deferral's, else the computed due point. A deferral that moved
 * only the hours leaves the calendar limit (not the old projection of the hours) in force.
 */
export function limitInForce(w: WorkOrderRow) {
  const deferred = w.deferredDueDate !== null || w.deferredDueHours !== null;
  const dueDate = deferred ? (w.deferredDueDate ?? w.calendarDue) : w.dueDate;
  return {
    dueDate,
    dueHours: w.deferredDueHours ?? w.dueHours,
    deferred,
    /** The date is the hours limit projected at the running rate, not a calendar limit. */
    projected: !deferred && w.governing === "hours",
  };
}

/** The work order page's Deferral section: history, limits, and what this user may do. */
export async function loadWorkOrderDeferrals(
  access: Access,
  vessel: VesselRef,
  w: WorkOrderRow,
  now = new Date(),
): Promise<WorkOrderDeferrals> {
  const companyId = access.company.id;
  const [history, chiefDecides, intervalHours] = await Promise.all([
    loadDeferralHistory(companyId, vessel.id, w.id),
    chiefDecidesDeferrals(companyId),
    routineIntervalHours(companyId, w.routineId),
  ]);
  const pending = history.find((d) => d.status === "pending") ?? null;
  const officeOnly = (pending?.needsOffice ?? false) || needsOfficeDecision(w, chiefDecides);
  const current = limitInForce(w);
  const open = w.state !== "done";
  const today = shipDay(now, vessel.timeZone);
  const graceDays =
    w.dueDate && w.graceEndsAt ? Math.round((w.graceEndsAt.getTime() - w.dueDate.getTime()) / 86_400_000) : null;
  const graceHours =
    w.dueHours !== null && w.graceEndsHours !== null ? Math.round((w.graceEndsHours - w.dueHours) * 10) / 10 : null;
  return {
    history,
    today,
    current: { ...current, dueDate: isoInstant(current.dueDate) },
    hasHoursLimit: current.dueHours !== null,
    latestDay: latestDeferralDay(today),
    highestHours: highestDeferralHours({ currentDueHours: current.dueHours, intervalHours }),
    grace: { days: graceDays, hours: graceHours },
    needsOffice: officeOnly,
    may: {
      request: open && !pending && can(access.role, "work:plan"),
      decide: open && pending !== null && mayDecide(access, officeOnly),
      withdraw: pending !== null && can(access.role, "work:plan"),
    },
  };
}

export async function routineIntervalHours(companyId: string, routineId: string | null): Promise<number | null> {
  if (!routineId) return null;
  const [row] = await getDb()
    .select({ intervalHours: routine.intervalHours })
    .from(routine)
    .where(and(eq(routine.companyId, companyId), eq(routine.id, routineId)));
  return row?.intervalHours ?? null;
}
