// Defect reports: reported by anyone on board with write access, planned by the chief engineer
// (target day, rank, man-hours, parts), done through its work order's completion, and closed by
// the chief with the cause and the action against a repeat when the completion is approved.
import "server-only";
import { and, asc, desc, eq, inArray, isNull, sql, type SQL } from "drizzle-orm";
import { getDb, type Db, type Tx } from "@/db/client";
import { completion, component, defect, part, user, workOrder, workOrderStateChange } from "@/db/schema";
import type { DefectPart } from "@/db/schema/defects";
import type { Access, VesselRef } from "@/server/auth/access";
import { can } from "@/server/auth/roles";
import { instantOfShipTime, shipDay } from "@/server/format/hours";
import { AppError, type FieldError, invalidInput } from "@/server/http/problem";
import { requestRecompute } from "@/server/jobs/recompute-vessel";
import { unitProblem } from "@/server/parts/stock";
import { isInFuture } from "@/server/readings/rules";
import { lockVesselWorkOrders } from "@/server/work-orders/lock";
import { nextWorkOrderNumber } from "@/server/work-orders/number";
import type { DefectList, DefectPlanValues, DefectValues, DefectView } from "./contract";
import { defectState } from "./rules";

/** A vessel's list shows this many defects; the open ones always come first. */
export const DEFECT_LIST_LIMIT = 500;
const DAY = 86_400_000;

function noSuchDefect() {
  return new AppError("not-found", "There is no such defect report on this vessel.");
}

type NewDefect = {
  companyId: string;
  vesselId: string;
  vesselCode: string;
  componentId: string;
  workOrderId: string;
  title: string;
  description: string;
  foundAt: Date;
  reportedBy: string | null;
  source: "report" | "measurement";
  affectsCritical: boolean;
  affectsSafety: boolean;
  affectsClass: boolean;
  needsEngineStop: boolean;
  plannedAt: Date | null;
};

/** Writes the defect's row with the vessel's next number ("DR-AG-0007"). Call it under lockVesselWorkOrders. */
export async function insertDefect(tx: Tx, d: NewDefect): Promise<{ id: string; number: string }> {
  const [{ n } = { n: 0 }] = await tx
    .select({ n: sql<number>`count(*)::int` })
    .from(defect)
    .where(and(eq(defect.companyId, d.companyId), eq(defect.vesselId, d.vesselId)));
  const number = `DR-${d.vesselCode}-${String(n + 1).padStart(4, "0")}`;
  const { vesselCode: _code, ...row } = d;
  const [saved] = await tx.insert(defect).values({ ...row, number }).returning({ id: defect.id });
  return { id: saved!.id, number };
}

export async function reportDefect(access: Access, vessel: VesselRef, input: DefectValues, now = new Date()): Promise<DefectView> {
  const companyId = access.company.id;
  const foundAt = instantOfShipTime(input.foundOn, input.time, vessel.timeZone);
  if (isInFuture(foundAt, now)) {
    throw invalidInput([{ field: "foundOn", message: `${input.foundOn} ${input.time} ship’s time is in the future: the ship’s day is ${shipDay(now, vessel.timeZone)}.` }]);
  }
  const id = await getDb().transaction(async (tx) => {
    const [c] = await tx
      .select({ id: component.id, code: component.code })
      .from(component)
      .where(and(eq(component.companyId, companyId), eq(component.vesselId, vessel.id), eq(component.id, input.componentId)));
    if (!c) throw invalidInput([{ field: "componentId", message: `There is no such component on ${vessel.name}.` }]);
    // Numbers of work orders and of defects are the vessel's: one writer at a time.
    await lockVesselWorkOrders(tx, vessel.id);
    const { number } = await nextWorkOrderNumber(tx, companyId, vessel.id);
    const [w] = await tx
      .insert(workOrder)
      .values({
        companyId,
        vesselId: vessel.id,
        routineId: null,
        componentId: c.id,
        number,
        occurrence: 1,
        kind: "corrective",
        title: input.title,
        state: "scheduled",
        stateChangedAt: now,
        governing: "calendar",
        rank: "second-engineer",
        critical: input.affectsCritical,
        classRelated: input.affectsClass,
        needsEngineStop: input.needsEngineStop,
        computedAt: now,
      })
      .returning({ id: workOrder.id });
    await tx.insert(workOrderStateChange).values({ companyId, workOrderId: w!.id, fromState: null, toState: "scheduled", changedAt: now });
    const saved = await insertDefect(tx, {
      companyId,
      vesselId: vessel.id,
      vesselCode: vessel.code,
      componentId: c.id,
      workOrderId: w!.id,
      title: input.title,
      description: input.description,
      foundAt,
      reportedBy: access.user.id,
      source: "report",
      affectsCritical: input.affectsCritical,
      affectsSafety: input.affectsSafety,
      affectsClass: input.affectsClass,
      needsEngineStop: input.needsEngineStop,
      plannedAt: null,
    });
    // The work order carries the defect's number in its title, so the Backlog and Calendar say it.
    await tx.update(workOrder).set({ title: `${saved.number}: ${input.title}` }).where(eq(workOrder.id, w!.id));
    return saved.id;
  });
  return oneDefect(getDb(), access, vessel, id, now);
}

/** The chief engineer plans the repair: a target day, who does it, how long, the parts it needs. */
export async function planDefect(access: Access, vessel: VesselRef, defectId: string, input: DefectPlanValues, now = new Date()): Promise<DefectView> {
  const companyId = access.company.id;
  await getDb().transaction(async (tx) => {
    await lockVesselWorkOrders(tx, vessel.id);
    const [d] = await tx
      .select()
      .from(defect)
      .where(and(eq(defect.companyId, companyId), eq(defect.vesselId, vessel.id), eq(defect.id, defectId)))
      .for("update");
    if (!d) throw noSuchDefect();
    if (d.closedAt) throw new AppError("conflict", `${d.number} is closed.`);
    const [done] = await tx
      .select({ status: completion.status })
      .from(completion)
      .where(and(eq(completion.companyId, companyId), eq(completion.workOrderId, d.workOrderId)));
    if (done && done.status !== "returned") throw new AppError("conflict", `${d.number}: the repair is recorded; it is no longer planned.`);
    const errors: FieldError[] = [];
    const ids = input.parts.map((p) => p.partId);
    if (new Set(ids).size !== ids.length) errors.push({ field: "parts", message: "Each part once: add up the quantities of a part listed twice." });
    const known = ids.length ? await tx.select().from(part).where(and(eq(part.companyId, companyId), inArray(part.id, ids))) : [];
    input.parts.forEach((p, i) => {
      const found = known.find((k) => k.id === p.partId);
      if (!found) errors.push({ field: `parts.${i}.partId`, message: "There is no such part in the catalogue." });
      else {
        const problem = unitProblem(found.unit, p.quantity, `parts.${i}.quantity`);
        if (problem) errors.push(problem);
      }
    });
    if (errors.length) throw invalidInput(errors);
    // Noon of the target day on board: the day is what counts (the worker gives it its window).
    const due = instantOfShipTime(input.targetDay, "12:00", vessel.timeZone);
    await tx
      .update(workOrder)
      .set({ dueDate: due, calendarDue: due, plannedDate: input.targetDay, rank: input.rank, estimatedManHours: input.manHours })
      .where(eq(workOrder.id, d.workOrderId));
    await tx.update(defect).set({ plannedAt: d.plannedAt ?? now, parts: input.parts satisfies DefectPart[] }).where(eq(defect.id, d.id));
    // The worker gives the planned repair its window and state, like a follow-up's.
    await requestRecompute(tx, companyId, vessel.id);
  });
  return oneDefect(getDb(), access, vessel, defectId, now);
}

async function loadDefects(db: Db | Tx, access: Access, vessel: VesselRef, where: SQL | undefined, now: Date, limit = DEFECT_LIST_LIMIT): Promise<DefectView[]> {
  const closer = sql`closer`;
  const rows = await db
    .select({
      d: defect,
      componentCode: component.code,
      componentName: component.name,
      w: { id: workOrder.id, number: workOrder.number, state: workOrder.state, dueDate: workOrder.dueDate, rank: workOrder.rank, manHours: workOrder.estimatedManHours, plannedDate: workOrder.plannedDate },
      completion: completion.status,
      reportedBy: user.name,
      closedBy: sql<string | null>`(select name from ${user} ${closer} where ${closer}.id = ${defect.closedBy})`,
    })
    .from(defect)
    .innerJoin(component, eq(component.id, defect.componentId))
    .innerJoin(workOrder, eq(workOrder.id, defect.workOrderId))
    .leftJoin(completion, eq(completion.workOrderId, defect.workOrderId))
    .leftJoin(user, eq(user.id, defect.reportedBy))
    .where(and(eq(defect.companyId, access.company.id), eq(defect.vesselId, vessel.id), where))
    // Open first, those on critical equipment first among them, then the oldest.
    .orderBy(sql`${defect.closedAt} is not null`, desc(defect.affectsCritical), asc(defect.foundAt))
    .limit(limit);
  const partIds = [...new Set(rows.flatMap((r) => r.d.parts.map((p) => p.partId)))];
  const parts = partIds.length ? await db.select().from(part).where(and(eq(part.companyId, access.company.id), inArray(part.id, partIds))) : [];
  const partOf = new Map(parts.map((p) => [p.id, p]));
  return rows.map(({ d, w, ...r }) => ({
    id: d.id,
    number: d.number,
    title: d.title,
    description: d.description,
    component: { id: d.componentId, code: r.componentCode, name: r.componentName },
    foundAt: d.foundAt.toISOString(),
    reportedBy: r.reportedBy,
    source: d.source,
    affectsCritical: d.affectsCritical,
    affectsSafety: d.affectsSafety,
    affectsClass: d.affectsClass,
    needsEngineStop: d.needsEngineStop,
    state: defectState({ closedAt: d.closedAt, dueDate: w.dueDate, completion: r.completion }),
    targetDay: w.dueDate ? (w.plannedDate ?? shipDay(w.dueDate, vessel.timeZone)) : null,
    rank: w.rank,
    manHours: w.manHours,
    workOrder: { id: w.id, number: w.number, state: w.state },
    parts: d.parts.flatMap((p) => {
      const found = partOf.get(p.partId);
      return found ? [{ partId: p.partId, number: found.number, description: found.description, unit: found.unit, quantity: p.quantity }] : [];
    }),
    cause: d.cause,
    action: d.action,
    closedAt: d.closedAt?.toISOString() ?? null,
    closedBy: r.closedBy,
    ageDays: Math.max(0, Math.floor(((d.closedAt ?? now).getTime() - d.foundAt.getTime()) / DAY)),
  }));
}

async function oneDefect(db: Db | Tx, access: Access, vessel: VesselRef, id: string, now: Date): Promise<DefectView> {
  const [view] = await loadDefects(db, access, vessel, eq(defect.id, id), now, 1);
  if (!view) throw noSuchDefect();
  return view;
}

/** The defect a work order repairs, if it is one. */
export async function defectOfWorkOrder(access: Access, vessel: VesselRef, workOrderId: string, now = new Date()): Promise<DefectView | null> {
  const [view] = await loadDefects(getDb(), access, vessel, eq(defect.workOrderId, workOrderId), now, 1);
  return view ?? null;
}

export async function listDefects(access: Access, vessel: VesselRef, state: "open" | "all", now = new Date()): Promise<DefectList> {
  const db = getDb();
  const [defects, components] = await Promise.all([
    loadDefects(db, access, vessel, state === "open" ? isNull(defect.closedAt) : undefined, now),
    db
      .select({ id: component.id, code: component.code, name: component.name })
      .from(component)
      .where(and(eq(component.companyId, access.company.id), eq(component.vesselId, vessel.id)))
      .orderBy(asc(component.code)),
  ]);
  return {
    vessel: { id: vessel.id, name: vessel.name, code: vessel.code, timeZone: vessel.timeZone },
    defects,
    components,
    canReport: can(access.role, "readings:write") && !vessel.retiredAt,
    canPlan: can(access.role, "work:plan") && !vessel.retiredAt,
  };
}

