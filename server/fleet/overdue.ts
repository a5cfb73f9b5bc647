// The office's overdue list across the fleet, read from the worker's rows: out of tolerance before
// late, critical and class-related work first within each, the longest overdue first.
import "server-only";
import { and, asc, desc, eq, inArray, isNull, or, sql, type SQL } from "drizzle-orm";
import { getReadDb } from "@/db/client";
import { component, overdueOrder, vessel, workOrder } from "@/db/schema";
import type { Access } from "@/server/auth/access";
import { type CsvColumn, csvResponse, toCsv } from "@/server/export/csv";
import { shipDateKey, shipDateOf } from "@/server/scheduling/ship-date";
import { AWAITING_APPROVAL, PENDING_DEFERRAL } from "@/server/work-orders/flags";
import { workOrderColumns, workOrderView } from "@/server/work-orders/view";
import {
  type FleetOverdue,
  type FleetOverdueFilter,
  type FleetOverdueItem,
  OVERDUE_FIELDS,
  OVERDUE_STATES,
} from "./overdue-contract";

/** Enough for any fleet's overdue list; more says the fleet has a bigger problem than a list. */
export const OVERDUE_LIMIT = 2000;

const DAY_MS = 86_400_000;

/** The columns the list shows, and those its limits and dates are computed from. */
const READ_FIELDS = [
  ...OVERDUE_FIELDS,
  "vesselId",
  "stateChangedAt",
  "dueHours",
  "deferredDueHours",
  "remainingHours",
] as const;

export async function loadFleetOverdue(access: Access, f: FleetOverdueFilter, now = new Date()): Promise<FleetOverdue> {
  // The worker's states: a replica a moment behind serves the list as well (KEELSON_READ_DATABASE_URL).
  const db = getReadDb();
  const companyId = access.company.id;
  const vesselScope: SQL[] = [eq(vessel.companyId, companyId), isNull(vessel.retiredAt)];
  // fleet:read roles see the whole fleet; should one ever be assigned vessels, only those.
  if (access.assignedVesselIds !== null) vesselScope.push(inArray(vessel.id, access.assignedVesselIds));
  const vessels = await db
    .select({ id: vessel.id, name: vessel.name, code: vessel.code })
    .from(vessel)
    .where(and(...vesselScope))
    .orderBy(asc(vessel.name));

  const where: SQL[] = [
    eq(workOrder.companyId, companyId),
    ...vesselScope,
    inArray(workOrder.state, f.state ? [f.state] : [...OVERDUE_STATES]),
  ];
  if (f.vesselId) where.push(eq(workOrder.vesselId, f.vesselId));
  if (f.flagged) where.push(or(eq(workOrder.critical, true), eq(workOrder.classRelated, true))!);

  const limit = sql`coalesce(${workOrder.deferredDueDate}, ${workOrder.dueDate})`;
  const rows = await db
    .select({
      // Only what the answer is made of: a whole row is 37 columns, 11 of them instants to parse.
      w: workOrderColumns(READ_FIELDS),
      limitAt: sql<Date | null>`${limit}`.mapWith((v) => (v ? new Date(v) : null)),
      vesselName: vessel.name,
      vesselCode: vessel.code,
      timeZone: vessel.timeZone,
      componentCode: component.code,
      componentName: component.name,
      pendingDeferral: PENDING_DEFERRAL,
      awaitingApproval: AWAITING_APPROVAL,
    })
    .from(workOrder)
    .innerJoin(vessel, eq(vessel.id, workOrder.vesselId))
    .innerJoin(component, eq(component.id, workOrder.componentId))
    .where(and(...where))
    .orderBy(
      overdueOrder(workOrder.state),
      desc(sql`(${workOrder.critical} or ${workOrder.classRelated})`),
      sql`${limit} asc nulls last`,
      asc(workOrder.stateChangedAt),
      asc(workOrder.number),
    )
    .limit(OVERDUE_LIMIT + 1);

  const items: FleetOverdueItem[] = rows.slice(0, OVERDUE_LIMIT).map((r) => {
    const { w } = r;
    const dueHours = w.deferredDueHours ?? w.dueHours;
    // Object.assign, not a spread: spreading the view into a literal cost ~18 µs a row in V8.
    return Object.assign(workOrderView(w, OVERDUE_FIELDS), {
      vessel: { id: w.vesselId, name: r.vesselName, code: r.vesselCode },
      component: { code: r.componentCode, name: r.componentName },
      state: w.state as FleetOverdueItem["state"],
      since: w.stateChangedAt.toISOString(),
      // Limits are the ends of ship's days, shared by many rows: shipDateOf asks Intl once for each.
      dueDay: r.limitAt ? shipDateKey(shipDateOf(r.limitAt, r.timeZone)) : null,
      dueHours,
      daysOverdue: r.limitAt ? Math.max(0, Math.floor((now.getTime() - r.limitAt.getTime()) / DAY_MS)) : null,
      hoursOverdue: w.remainingHours !== null && w.remainingHours < 0 ? Math.round(-w.remainingHours * 10) / 10 : null,
      pendingDeferral: r.pendingDeferral,
      awaitingApproval: r.awaitingApproval,
    });
  });
  return { generatedAt: now.toISOString(), vessels, items, truncated: rows.length > OVERDUE_LIMIT };
}

const COLUMNS: CsvColumn<FleetOverdueItem>[] = [
  { header: "Vessel", value: (i) => i.vessel.name },
  { header: "Work order", value: (i) => i.number },
  { header: "Title", value: (i) => i.title },
  { header: "Component", value: (i) => `${i.component.code} ${i.component.name}` },
  { header: "State", value: (i) => i.state.replaceAll("-", " ") },
  { header: "Since (UTC)", value: (i) => i.since.slice(0, 16).replace("T", " ") },
  { header: "Due day (ship's)", value: (i) => i.dueDay },
  { header: "Due hours", value: (i) => i.dueHours },
  { header: "Days overdue", value: (i) => i.daysOverdue },
  { header: "Hours overdue", value: (i) => i.hoursOverdue },
  { header: "Rank", value: (i) => i.rank.replaceAll("-", " ") },
  { header: "Critical", value: (i) => i.critical },
  { header: "Class item", value: (i) => i.classRelated },
  { header: "Planned day", value: (i) => i.plannedDate },
  { header: "Deferral asked", value: (i) => i.pendingDeferral },
  { header: "Awaiting approval", value: (i) => i.awaitingApproval },
];

export function fleetOverdueCsv(list: FleetOverdue): Response {
  return csvResponse(toCsv(COLUMNS, list.items), `overdue-${list.generatedAt.slice(0, 10)}.csv`);
}
