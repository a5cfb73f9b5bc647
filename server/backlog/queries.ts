import "server-only";
import { and, asc, eq, ilike, inArray, lte, or, type SQL, sql } from "drizzle-orm";
import { getDb } from "@/db/client";
import { component, deferral, urgencyOrder, workOrder } from "@/db/schema";
import type { Access, VesselRef } from "@/server/auth/access";
import { instantOfShipTime } from "@/server/format/hours";
import { AWAITING_APPROVAL, PENDING_DEFERRAL } from "@/server/work-orders/flags";
import { workOrderView } from "@/server/work-orders/view";
import { ALL_STATES, BACKLOG_FIELDS, type BacklogFilter, type BacklogPage, type BacklogState } from "./contract";

function filters(access: Access, vessel: VesselRef, f: BacklogFilter): SQL[] {
  const where: SQL[] = [eq(workOrder.companyId, access.company.id), eq(workOrder.vesselId, vessel.id)];
  if (f.component) {
    where.push(sql`${workOrder.componentId} in (
      with recursive sub as (
        select id from ${component} where company_id = ${access.company.id} and vessel_id = ${vessel.id} and id = ${f.component}
        union all
        select c.id from ${component} c join sub on c.parent_id = sub.id where c.company_id = ${access.company.id}
      ) select id from sub)`);
  }
  if (f.rank) where.push(eq(workOrder.rank, f.rank));
  if (f.engineStop !== undefined) where.push(eq(workOrder.needsEngineStop, f.engineStop));
  if (f.critical !== undefined) where.push(eq(workOrder.critical, f.critical));
  if (f.classRelated !== undefined) where.push(eq(workOrder.classRelated, f.classRelated));
  if (f.defects !== undefined) where.push(eq(workOrder.kind, f.defects ? "corrective" : "planned"));
  if (f.dueBefore) where.push(lte(workOrder.dueDate, instantOfShipTime(f.dueBefore, "23:59", vessel.timeZone)));
  if (f.deferral === "pending") where.push(PENDING_DEFERRAL);
  if (f.q) {
    const like = `%${f.q.replace(/[%_\\]/g, (c) => `\\${c}`)}%`;
    where.push(or(ilike(workOrder.title, like), ilike(workOrder.number, like), ilike(component.code, like))!);
  }
  return where;
}

const ORDER: Record<BacklogFilter["sort"], SQL[]> = {
  urgency: [urgencyOrder(workOrder.state), sql`${workOrder.dueDate} asc nulls last`, asc(workOrder.number)],
  due: [sql`${workOrder.dueDate} asc nulls last`, asc(workOrder.number)],
  "-due": [sql`${workOrder.dueDate} desc nulls last`, asc(workOrder.number)],
  number: [asc(workOrder.number)],
  component: [asc(component.code), sql`${workOrder.dueDate} asc nulls last`],
  "remaining-hours": [sql`${workOrder.remainingHours} asc nulls last`, asc(workOrder.number)],
};

/** The Backlog reads the worker's rows only: no due-point computation per request. */
export async function loadBacklog(access: Access, vessel: VesselRef, f: BacklogFilter): Promise<BacklogPage> {
  const db = getDb();
  const base = filters(access, vessel, f);
  const rows = await db
    .select({
      w: workOrder,
      componentCode: component.code,
      componentName: component.name,
      awaitingApproval: AWAITING_APPROVAL,
      pendingDeferral: PENDING_DEFERRAL,
    })
    .from(workOrder)
    .innerJoin(component, eq(component.id, workOrder.componentId))
    .where(and(...base, inArray(workOrder.state, f.state)))
    .orderBy(...ORDER[f.sort])
    .limit(f.pageSize)
    .offset((f.page - 1) * f.pageSize);
  const countRows = await db
    .select({
      state: workOrder.state,
      n: sql<number>`count(*)::int`,
      computedAt: sql<string | null>`max(${workOrder.computedAt})`,
    })
    .from(workOrder)
    .innerJoin(component, eq(component.id, workOrder.componentId))
    .where(and(...base))
    .groupBy(workOrder.state);
  const [pending] = await db
    .select({ n: sql<number>`count(*)::int` })
    .from(deferral)
    .where(
      and(eq(deferral.companyId, access.company.id), eq(deferral.vesselId, vessel.id), eq(deferral.status, "pending")),
    );
  const counts = Object.fromEntries(ALL_STATES.map((s) => [s, 0])) as Record<BacklogState, number>;
  let computedAt: string | null = null;
  for (const c of countRows) {
    counts[c.state] = c.n;
    if (c.computedAt && (!computedAt || c.computedAt > computedAt)) computedAt = c.computedAt;
  }
  return {
    items: rows.map(({ w, componentCode, componentName, awaitingApproval, pendingDeferral }) => ({
      ...workOrderView(w, BACKLOG_FIELDS),
      component: { id: w.componentId, code: componentCode, name: componentName },
      awaitingApproval,
      pendingDeferral,
    })),
    counts,
    total: f.state.reduce((sum, s) => sum + counts[s], 0),
    page: f.page,
    pageSize: f.pageSize,
    pendingDeferrals: pending?.n ?? 0,
    computedAt: computedAt ? new Date(computedAt).toISOString() : null,
  };
}
