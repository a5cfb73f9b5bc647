// A work order as the completion page needs it: the job, its routine, the counter's latest
// reading, its completion, and the component's earlier work. Scoped by company and vessel.
import "server-only";
import { aliasedTable, and, asc, desc, eq, inArray, ne, sql } from "drizzle-orm";
import { z } from "zod";
import { type Db, getDb, type Tx } from "@/db/client";
import {
  completion,
  component,
  counter,
  membership,
  reading,
  routine,
  user,
  vesselAssignment,
  workOrder,
} from "@/db/schema";
import type { Access, VesselRef } from "@/server/auth/access";
import { can } from "@/server/auth/roles";
import type { WorkOrderWithDeferrals } from "@/server/deferrals/contract";
import { loadWorkOrderDeferrals } from "@/server/deferrals/queries";
import { isoInstant } from "@/server/format/iso";
import { AppError } from "@/server/http/problem";
import { workOrderView } from "@/server/work-orders/view";
import {
  ChecklistTick,
  type CompletionRecord,
  type ComponentHistoryEntry,
  DETAIL_FIELDS,
  type WorkOrderDetail,
} from "./contract";
import { partsForComponent } from "@/server/parts/queries";
import { defectOfWorkOrder } from "@/server/defects/queries";

const HISTORY_LIMIT = 25;

/** The checklist column holds `{ step, done }` and, for an unticked step, its remark. */
const StoredChecklist = z.array(ChecklistTick);

export async function loadWorkOrderDetail(
  access: Access,
  vessel: VesselRef,
  workOrderId: string,
  now = new Date(),
): Promise<WorkOrderWithDeferrals> {
  const db = getDb();
  const companyId = access.company.id;
  const [row] = await db
    .select({ w: workOrder, r: routine, c: { id: component.id, code: component.code, name: component.name } })
    .from(workOrder)
    .innerJoin(component, eq(component.id, workOrder.componentId))
    .leftJoin(routine, and(eq(routine.id, workOrder.routineId), eq(routine.companyId, companyId)))
    .where(and(eq(workOrder.companyId, companyId), eq(workOrder.vesselId, vessel.id), eq(workOrder.id, workOrderId)));
  if (!row) throw new AppError("not-found", "There is no such work order on this vessel.");
  const { w, r } = row;

  let counterView: WorkOrderDetail["counter"] = null;
  if (w.counterId) {
    const [c] = await db
      .select({ id: counter.id, name: counter.name })
      .from(counter)
      .where(and(eq(counter.companyId, companyId), eq(counter.id, w.counterId)));
    const [latest] = await db
      .select({ readAt: reading.readAt, totalHours: reading.totalHours })
      .from(reading)
      .where(and(eq(reading.companyId, companyId), eq(reading.counterId, w.counterId)))
      .orderBy(desc(reading.readAt))
      .limit(1);
    if (c) {
      counterView = {
        ...c,
        latest: latest ? { readAt: latest.readAt.toISOString(), totalHours: latest.totalHours } : null,
      };
    }
  }
  // A corrective work order may be a defect's repair: its report, and the parts its plan names.
  const repair = w.kind === "corrective" ? await defectOfWorkOrder(access, vessel, w.id, now) : null;

  return {
    vessel: { id: vessel.id, name: vessel.name, code: vessel.code, timeZone: vessel.timeZone },
    now: now.toISOString(),
    workOrder: workOrderView(w, DETAIL_FIELDS),
    component: row.c,
    routine: r
      ? {
          id: r.id,
          description: r.description,
          checklist: r.checklist,
          intervalHours: r.intervalHours,
          calendarRule: r.calendarRule,
          measurements: r.measurements,
          cautions: r.cautions,
          spareParts: r.spareParts,
        }
      : null,
    counter: counterView,
    counterRequired: r?.intervalHours != null,
    completion: await loadCompletionRecord(companyId, w.id),
    history: await loadComponentHistory(companyId, vessel.id, w.componentId, w.id),
    may: {
      record: can(access.role, "readings:write") && w.state !== "done",
      approve: can(access.role, "work:approve"),
    },
    responsibleChoices: await responsibleChoices(db, companyId, vessel.id),
    partsOnBoard: await partsForComponent(companyId, vessel.id, w.componentId, w.routineId, repair?.parts ?? []),
    defect: repair,
    deferrals: await loadWorkOrderDeferrals(access, vessel, w, now),
  };
}

const decider = aliasedTable(user, "decider");
const responsible = aliasedTable(user, "responsible");

/** Chief engineers and engineers of the company assigned to the vessel: who may answer for a job. */
export async function responsibleChoices(db: Db | Tx, companyId: string, vesselId: string): Promise<WorkOrderDetail["responsibleChoices"]> {
  const rows = await db
    .select({ id: user.id, name: user.name, role: membership.role, rank: membership.rank })
    .from(membership)
    .innerJoin(user, eq(user.id, membership.userId))
    .innerJoin(
      vesselAssignment,
      and(
        eq(vesselAssignment.companyId, membership.companyId),
        eq(vesselAssignment.userId, membership.userId),
        eq(vesselAssignment.vesselId, vesselId),
      ),
    )
    .where(and(eq(membership.companyId, companyId), inArray(membership.role, ["chief-engineer", "engineer"])))
    .orderBy(asc(membership.role), asc(user.name));
  return rows;
}

async function loadCompletionRecord(companyId: string, workOrderId: string): Promise<CompletionRecord | null> {
  const [row] = await getDb()
    .select({ c: completion, doneBy: user.name, decidedBy: decider.name, responsible: responsible.name })
    .from(completion)
    .leftJoin(user, eq(user.id, completion.doneBy))
    .leftJoin(decider, eq(decider.id, completion.decidedBy))
    .leftJoin(responsible, eq(responsible.id, completion.responsibleId))
    .where(and(eq(completion.companyId, companyId), eq(completion.workOrderId, workOrderId)));
  if (!row) return null;
  const { c } = row;
  return {
    id: c.id,
    status: c.status,
    doneAt: c.doneAt.toISOString(),
    counterHours: c.counterHours,
    manHours: c.manHours,
    checklist: StoredChecklist.parse(c.checklist),
    measurements: c.measurements,
    remarks: c.remarks,
    doneBy: row.doneBy,
    responsibleId: c.responsibleId,
    responsible: row.responsible,
    workedBy: c.workedBy,
    partsUsed: c.partsUsed,
    decidedBy: row.decidedBy,
    decidedAt: isoInstant(c.decidedAt),
    decisionNote: c.decisionNote,
  };
}

/** Done work on the component, newest first: what an engineer looks up before opening it again. */
async function loadComponentHistory(
  companyId: string,
  vesselId: string,
  componentId: string,
  exceptWorkOrderId: string,
): Promise<ComponentHistoryEntry[]> {
  const rows = await getDb()
    .select({
      id: workOrder.id,
      number: workOrder.number,
      title: workOrder.title,
      kind: workOrder.kind,
      c: completion,
      doneBy: user.name,
    })
    .from(workOrder)
    .innerJoin(completion, and(eq(completion.workOrderId, workOrder.id), eq(completion.status, "approved")))
    .leftJoin(user, eq(user.id, completion.doneBy))
    .where(
      and(
        eq(workOrder.companyId, companyId),
        eq(workOrder.vesselId, vesselId),
        eq(workOrder.componentId, componentId),
        eq(workOrder.state, "done"),
        ne(workOrder.id, exceptWorkOrderId),
      ),
    )
    .orderBy(desc(completion.doneAt), sql`${workOrder.number} desc`)
    .limit(HISTORY_LIMIT);
  return rows.map(({ c, ...w }) => ({
    workOrderId: w.id,
    number: w.number,
    title: w.title,
    kind: w.kind,
    doneAt: c.doneAt.toISOString(),
    counterHours: c.counterHours,
    manHours: c.manHours,
    doneBy: w.doneBy,
    outOfLimits: c.measurements.filter((m) => m.outOfLimits).map((m) => m.name),
    remarks: c.remarks,
  }));
}
