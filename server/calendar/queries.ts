import "server-only";
import { type AnyColumn, and, eq, gt, gte, isNotNull, isNull, lt, ne, or, sql } from "drizzle-orm";
import { getDb } from "@/db/client";
import { component, counter, portStay, workOrder } from "@/db/schema";
import { urgencyRank } from "@/db/schema/work-order-states";
import type { Access, VesselRef } from "@/server/auth/access";
import { shipDayKey } from "@/server/format/ship-day";
import { shipDateFromKey, startOfShipDate } from "@/server/scheduling/ship-date";
import {
  CALENDAR_FIELDS,
  type CalendarPortStay,
  type CalendarQuery,
  type CalendarRange,
  type CalendarWorkOrder,
} from "./contract";
import { PENDING_DEFERRAL } from "@/server/work-orders/flags";
import { workOrderView } from "@/server/work-orders/view";
import { projectionBasis } from "./projection-basis";

/**
 * The work orders and port stays of the ship's days [start, end). The range becomes two instants
 * in the vessel's zone, and every condition compares a stored column with them (no function
 * around a column), so the (company, vessel, …) indexes serve it. Reads the worker's rows only.
 */
export async function loadCalendar(access: Access, vessel: VesselRef, q: CalendarQuery): Promise<CalendarRange> {
  const db = getDb();
  const companyId = access.company.id;
  const timeZone = vessel.timeZone;
  const from = startOfShipDate(shipDateFromKey(q.start), timeZone);
  const until = startOfShipDate(shipDateFromKey(q.end), timeZone);
  const inRange = (column: AnyColumn) => and(gte(column, from), lt(column, until));

  const rows = await db
    .select({
      w: workOrder,
      componentCode: component.code,
      componentName: component.name,
      pendingDeferral: PENDING_DEFERRAL,
    })
    .from(workOrder)
    .innerJoin(component, eq(component.id, workOrder.componentId))
    .where(
      and(
        eq(workOrder.companyId, companyId),
        eq(workOrder.vesselId, vessel.id),
        or(
          // Open work on its planned day…
          and(ne(workOrder.state, "done"), gte(workOrder.plannedDate, q.start), lt(workOrder.plannedDate, q.end)),
          // …else on its due day: the approved deferral's limit when there is one.
          and(
            ne(workOrder.state, "done"),
            isNull(workOrder.plannedDate),
            or(
              and(isNull(workOrder.deferredDueDate), inRange(workOrder.dueDate)),
              and(isNotNull(workOrder.deferredDueDate), inRange(workOrder.deferredDueDate)),
            ),
          ),
          // Done work on the day it was done.
          and(eq(workOrder.state, "done"), inRange(workOrder.completedAt)),
        ),
      ),
    );

  // The last reading of each counter, one index probe per counter (a vessel has 5–30). Written
  // with the outer table named, so no column of the subquery can capture an outer one.
  const lastReading = (column: "read_at" | "total_hours") =>
    sql.raw(
      `(select r.${column} from reading r where r.company_id = counter.company_id and r.counter_id = counter.id order by r.read_at desc limit 1)`,
    );
  const counters = await db
    .select({
      id: counter.id,
      runningRate: counter.runningRate,
      rateBasis: counter.rateBasis,
      lastReadAt: sql<string | null>`${lastReading("read_at")}`,
      lastTotalHours: sql<string | null>`${lastReading("total_hours")}`,
    })
    .from(counter)
    .where(and(eq(counter.companyId, companyId), eq(counter.vesselId, vessel.id)));
  const counterById = new Map(counters.map((c) => [c.id, c]));

  const day = (d: Date | null) => (d ? shipDayKey(d.getTime(), timeZone) : null);
  const workOrders: CalendarWorkOrder[] = rows.map(({ w, componentCode, componentName, pendingDeferral }) => {
    const dueDay = day(w.deferredDueDate ?? w.dueDate);
    const doneDay = w.state === "done" ? day(w.completedAt) : null;
    const projected = w.governing === "hours" && w.deferredDueDate === null;
    const c = w.counterId ? counterById.get(w.counterId) : undefined;
    return {
      ...workOrderView(w, CALENDAR_FIELDS),
      component: { code: componentCode, name: componentName },
      day: doneDay ?? w.plannedDate ?? dueDay ?? q.start,
      dueDay,
      doneDay,
      projected,
      basis: projected
        ? projectionBasis(
            {
              hoursPerDay: c?.runningRate ?? null,
              rateBasis: c?.rateBasis ?? null,
              lastReadAt: c?.lastReadAt ? new Date(c.lastReadAt) : null,
              lastTotalHours: c?.lastTotalHours != null ? Number(c.lastTotalHours) : null,
              dueHours: w.deferredDueHours ?? w.dueHours,
            },
            timeZone,
          )
        : null,
      dueHours: w.deferredDueHours ?? w.dueHours,
      pendingDeferral,
    };
  });
  workOrders.sort(
    (a, b) =>
      a.day.localeCompare(b.day) || urgencyRank(a.state) - urgencyRank(b.state) || a.number.localeCompare(b.number),
  );

  const stays = await db
    .select()
    .from(portStay)
    .where(
      and(
        eq(portStay.companyId, companyId),
        eq(portStay.vesselId, vessel.id),
        lt(portStay.arrivesAt, until),
        gt(portStay.departsAt, from),
      ),
    )
    .orderBy(portStay.arrivesAt, portStay.id);
  const portStays: CalendarPortStay[] = stays.map((s) => ({
    id: s.id,
    port: s.port,
    arrivesAt: s.arrivesAt.toISOString(),
    departsAt: s.departsAt.toISOString(),
    firstDay: shipDayKey(s.arrivesAt.getTime(), timeZone),
    lastDay: shipDayKey(s.departsAt.getTime(), timeZone),
    engineStopHours:
      s.engineStopFrom && s.engineStopTo ? (s.engineStopTo.getTime() - s.engineStopFrom.getTime()) / 3_600_000 : null,
    packageAccepted: s.packageAcceptedAt !== null,
  }));

  return { start: q.start, end: q.end, timeZone, workOrders, portStays };
}
