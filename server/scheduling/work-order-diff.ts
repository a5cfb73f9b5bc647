// What a recompute run changes in a vessel's work orders, from the rows it found and what the due
// engine planned: the rows to insert, the rows to update and the state changes to record. Pure:
// work-order-writer.ts loads and plans, work-order-bulk-write.ts writes.
import type { WorkOrderState } from "@/db/schema/work-order-states";
import { round1 } from "@/server/readings/rules";
import { WRITTEN_FIELDS, type WorkOrderRow, type WrittenFields } from "@/server/work-orders/fields";
import type { planCorrective, WorkOrderPlan } from "./plan-work-order";

/** A routine's next occurrence or a corrective follow-up, planned; `existing` is its open row, if any. */
export type PlannedWorkOrder =
  | { existing: WorkOrderRow; state: WorkOrderState; fields: WrittenFields }
  | { existing: null; routineId: string; occurrence: number; state: WorkOrderState; fields: WrittenFields };

export type WorkOrderInsert = WrittenFields & {
  routineId: string;
  number: string;
  occurrence: number;
  state: WorkOrderState;
};
export type WorkOrderUpdate = WrittenFields & { id: string; state: WorkOrderState; stateChanged: boolean };
export type StateChange = { workOrderId: string; fromState: WorkOrderState | null; toState: WorkOrderState };

export type WorkOrderDiff = {
  inserts: WorkOrderInsert[];
  updates: WorkOrderUpdate[];
  /** Of the updated rows; an inserted row's first state is recorded once its id is known. */
  stateChanges: StateChange[];
  /** The vessel's work-order sequence after the numbers the inserts took. */
  sequence: number;
};

export function workOrderNumber(vesselCode: string, sequence: number): string {
  return `WO-${vesselCode}-${String(sequence).padStart(5, "0")}`;
}

/** What the worker writes for a routine's work order: the routine's job and the plan's figures. */
export function routineFields(
  r: Pick<
    WrittenFields,
    | "componentId"
    | "title"
    | "rank"
    | "team"
    | "elapsedHours"
    | "estimatedManHours"
    | "needsPort"
    | "needsEngineStop"
    | "portEvent"
    | "portEventHours"
    | "critical"
    | "classRelated"
  >,
  counterId: string | null,
  plan: WorkOrderPlan,
): WrittenFields {
  return {
    componentId: r.componentId,
    counterId,
    title: r.title,
    dueDate: plan.dueDate,
    dueHours: plan.dueHours,
    projectedDate: plan.projectedDate,
    calendarDue: plan.calendarDue,
    governing: plan.governing,
    windowOpensAt: plan.calendarWindow?.opensAt ?? null,
    graceEndsAt: plan.calendarWindow?.graceEndsAt ?? null,
    windowOpensHours: plan.hoursWindow?.opensAtHours ?? null,
    graceEndsHours: plan.hoursWindow?.graceEndsHours ?? null,
    remainingHours: plan.remainingHours,
    remainingDays: plan.remainingDays === null ? null : round1(plan.remainingDays),
    planFrom: plan.planFrom,
    planUntil: plan.planUntil,
    outOfToleranceAt: plan.outOfToleranceAt,
    rank: r.rank,
    team: r.team,
    elapsedHours: r.elapsedHours,
    estimatedManHours: r.estimatedManHours,
    needsPort: r.needsPort,
    needsEngineStop: r.needsEngineStop,
    portEvent: r.portEvent,
    portEventHours: r.portEventHours,
    critical: r.critical,
    classRelated: r.classRelated,
  };
}

/** A corrective follow-up keeps what it was raised with; only its calendar figures move. */
export function correctiveFields(w: WorkOrderRow, plan: ReturnType<typeof planCorrective>): WrittenFields {
  return {
    ...writtenFieldsOf(w),
    windowOpensAt: plan.calendarWindow?.opensAt ?? null,
    graceEndsAt: plan.calendarWindow?.graceEndsAt ?? null,
    remainingDays: plan.remainingDays,
    planFrom: plan.planFrom,
    planUntil: plan.planUntil,
    outOfToleranceAt: plan.outOfToleranceAt,
  };
}

function writtenFieldsOf(w: WorkOrderRow): WrittenFields {
  return Object.fromEntries(WRITTEN_FIELDS.map((k) => [k, w[k]])) as WrittenFields;
}

/**
 * Updates for open rows whose state or figures moved (rows already as planned are left alone),
 * and inserts, numbered on from the vessel's sequence, for routines without an open row.
 */
export function diffWorkOrders(
  planned: readonly PlannedWorkOrder[],
  vessel: { code: string; workOrderSeq: number },
): WorkOrderDiff {
  const diff: WorkOrderDiff = { inserts: [], updates: [], stateChanges: [], sequence: vessel.workOrderSeq };
  for (const p of planned) {
    const { state, fields } = p;
    if (p.existing) {
      const w = p.existing;
      const stateChanged = w.state !== state;
      if (stateChanged || fieldsMoved(w, fields)) diff.updates.push({ id: w.id, state, stateChanged, ...fields });
      if (stateChanged) diff.stateChanges.push({ workOrderId: w.id, fromState: w.state, toState: state });
      continue;
    }
    // A number is used up even when another writer's row wins the insert, as before batching.
    diff.sequence++;
    const number = workOrderNumber(vessel.code, diff.sequence);
    diff.inserts.push({ routineId: p.routineId, number, occurrence: p.occurrence, state, ...fields });
  }
  return diff;
}

/** Instants compare by their time (the row's and the plan's are different Date objects), lists by value. */
function fieldsMoved(row: WorkOrderRow, fields: WrittenFields): boolean {
  return WRITTEN_FIELDS.some((key) => {
    const now = row[key];
    const next = fields[key];
    if (now instanceof Date || next instanceof Date) {
      return (now instanceof Date ? now.getTime() : null) !== (next instanceof Date ? next.getTime() : null);
    }
    // A team is a list: equal when its JSON is (rows keep the routine's order of ranks).
    if (Array.isArray(now) || Array.isArray(next)) return JSON.stringify(now) !== JSON.stringify(next);
    return now !== next;
  });
}
