import "server-only";
import { type AnyColumn, and, eq, gt, gte, isNotNull, isNull, lt, ne, or, sql } from "drizzle-orm";
import { getDb } from "@/db/client";
import { component, counter, portStay, workOrder } from "@/db/schema";
import { urgencyRank } from "@/db/schema/work-order-states";
import type { Access, VesselRef } from "@/server/auth/access";
import { shipDayKey } from "@/server/format/ship-day";
import { shipDateFromKey, shipDateKey, shipDateOf, startOfShipDate } from "@/server/scheduling/ship-date";
import {
  CALENDAR_FIELDS,
  type CalendarPortStay,
  type CalendarQuery,
  type CalendarRange,
  type CalendarWorkOrder,
} from "./contract";
import { PENDING_DEFERRAL } from "@/server/work-orders/flags";
import { workOrderColumns, workOrderView } from "@/server/work-orders/view";
import { projectionWords } from "./projection-basis";

/** The columns the answer shows, and those its days, projection and limits are computed from. */
const READ_FIELDS = [
  ...CALENDAR_FIELDS,
  "counterId",
  "governing",
  "dueDate",
  "dueHours",
  "deferredDueDate",
  "deferredDueHours",
  "completedAt",
] as const;

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
      // Only what the answer is made of: a whole row is 37 columns, 11 of them instants to parse.
      w: workOrderColumns(READ_FIELDS),
      componentCode: component.code,
      componentName: component.name,
      pendingDeferral: PENDING_DEFERRAL,
    })
    .from(workOrder)
    // Scoped to the vessel: joined on the id alone, PostgreSQL hashed the company's every component
    // (31,000 in the bench's fleet: 30 of the query's 45 ms) to find the vessel's few hundred.
    .innerJoin(
      component,
      and(eq(component.id, workOrder.componentId), eq(component.companyId, companyId), eq(component.vesselId, vessel.id)),
    )
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
  const basisOf = new Map(
    counters.map((c) => [
      c.id,
      projectionWords(
        {
          hoursPerDay: c.runningRate,
          rateBasis: c.rateBasis,
          lastReadAt: c.lastReadAt ? new Date(c.lastReadAt) : null,
          lastTotalHours: c.lastTotalHours != null ? Number(c.lastTotalHours) : null,
        },
        timeZone,
      ),
    ]),
  );
  const noCounter = projectionWords({ hoursPerDay: null, rateBasis: null, lastReadAt: null, lastTotalHours: null }, timeZone);

  // Due instants are the ends of ship's days, shared by many rows: each distinct one asks Intl once
  // (shipDateOf remembers them) instead of once per row.
  const day = (d: Date | null) => (d ? shipDateKey(shipDateOf(d, timeZone)) : null);
  const workOrders: CalendarWorkOrder[] = rows.map(({ w, componentCode, componentName, pendingDeferral }) => {
    const dueDay = day(w.deferredDueDate ?? w.dueDate);
    const doneDay = w.state === "done" ? day(w.completedAt) : null;
    const projected = w.governing === "hours" && w.deferredDueDate === null;
    const dueHours = w.deferredDueHours ?? w.dueHours;
    // Object.assign, not a spread: spreading the view into a literal cost ~18 µs a row in V8, the
    // largest part of the handler's own time (the same JSON either way).
    return Object.assign(workOrderView(w, CALENDAR_FIELDS), {
      component: { code: componentCode, name: componentName },
      day: doneDay ?? w.plannedDate ?? dueDay ?? q.start,
      dueDay,
      doneDay,
      projected,
      basis: projected ? ((w.counterId && basisOf.get(w.counterId)) || noCounter)(dueHours) : null,
      dueHours,
      pendingDeferral,
    });
  });
  // Code-unit order, not localeCompare (an ICU collation per comparison): days are YYYY-MM-DD and a
  // vessel's numbers share their prefix before zero-padded digits, so both orders agree.
  const byCodeUnit = (a: string, b: string) => (a < b ? -1 : a > b ? 1 : 0);
  workOrders.sort(
    (a, b) => byCodeUnit(a.day, b.day) || urgencyRank(a.state) - urgencyRank(b.state) || byCodeUnit(a.number, b.number),
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
