// Writes one open work order per active routine of a vessel (inside recomputeVessel's
// transaction). A routine's open work order is its next occurrence; the unique index on
// (routine, occurrence) makes a second writer's insert a no-op, never a duplicate.
import "server-only";
import { and, desc, eq, inArray, isNull, ne } from "drizzle-orm";
import type { Tx } from "@/db/client";
import { completion, component, routine, toleranceRule, vessel, workOrder, workOrderStateChange } from "@/db/schema";
import { resolveCounters } from "@/server/register/tree";
import { round1 } from "@/server/readings/rules";
import { type LastCompletion, planWorkOrder, type WorkOrderPlan } from "./plan-work-order";
import { presetToleranceRules } from "./presets";
import type { ToleranceRule } from "./tolerance";
import type { CounterNow } from "./recompute";

export type WorkOrderRunSummary = {
  created: number;
  updated: number;
  stateChanges: number;
  skipped: { routineId: string; reason: string }[];
};

type Context = {
  companyId: string;
  vesselId: string;
  vessel: { code: string; timeZone: string; workOrderSeq: number };
  counters: Map<string, CounterNow | null>;
  now: Date;
};

export function workOrderNumber(vesselCode: string, sequence: number): string {
  return `WO-${vesselCode}-${String(sequence).padStart(5, "0")}`;
}

async function companyRules(tx: Tx, companyId: string): Promise<ToleranceRule[]> {
  const rows = await tx.select().from(toleranceRule).where(eq(toleranceRule.companyId, companyId));
  // A company that has not configured any rule gets the presets (the same ones it is offered).
  if (rows.length === 0) return presetToleranceRules();
  return rows.map((r) => ({
    id: r.id,
    name: r.name,
    kind: r.kind,
    minInterval: r.minInterval,
    maxInterval: r.maxInterval,
    windowBefore: { value: r.windowBeforeValue, unit: r.windowBeforeUnit },
    graceAfter: { value: r.graceAfterValue, unit: r.graceAfterUnit },
    ...(r.capHours !== null ? { capHours: r.capHours } : {}),
    keepsAnniversary: r.keepsAnniversary,
  }));
}

export async function writeWorkOrders(tx: Tx, ctx: Context): Promise<WorkOrderRunSummary> {
  const { companyId, vesselId, now } = ctx;
  const summary: WorkOrderRunSummary = { created: 0, updated: 0, stateChanges: 0, skipped: [] };
  const rules = await companyRules(tx, companyId);
  const components = await tx
    .select({ id: component.id, parentId: component.parentId, code: component.code, counterId: component.counterId })
    .from(component)
    .where(and(eq(component.companyId, companyId), eq(component.vesselId, vesselId)));
  const effective = resolveCounters(components);
  const routines = await tx
    .select()
    .from(routine)
    .where(and(eq(routine.companyId, companyId), eq(routine.vesselId, vesselId), isNull(routine.retiredAt)));
  if (routines.length === 0) return summary;
  const routineIds = routines.map((r) => r.id);

  const open = await tx
    .select()
    .from(workOrder)
    .where(
      and(eq(workOrder.companyId, companyId), inArray(workOrder.routineId, routineIds), ne(workOrder.state, "done")),
    );
  const openByRoutine = new Map(open.map((w) => [w.routineId!, w]));

  // The latest approved completion of each routine, with the due point its work order aimed at.
  const lastDone = await tx
    .selectDistinctOn([workOrder.routineId], {
      routineId: workOrder.routineId,
      occurrence: workOrder.occurrence,
      calendarDue: workOrder.calendarDue,
      doneAt: completion.doneAt,
      counterHours: completion.counterHours,
    })
    .from(workOrder)
    .innerJoin(completion, and(eq(completion.workOrderId, workOrder.id), eq(completion.status, "approved")))
    .where(
      and(eq(workOrder.companyId, companyId), inArray(workOrder.routineId, routineIds), eq(workOrder.state, "done")),
    )
    .orderBy(workOrder.routineId, desc(workOrder.occurrence));
  const lastByRoutine = new Map(lastDone.map((l) => [l.routineId!, l]));

  let sequence = ctx.vessel.workOrderSeq;
  for (const r of routines) {
    const eff = effective.get(r.componentId);
    const counterId = eff && eff.kind !== "none" ? eff.counterId : null;
    const counterNow = counterId ? (ctx.counters.get(counterId) ?? null) : null;
    const done = lastByRoutine.get(r.id);
    const last: LastCompletion | null = done
      ? {
          at: done.doneAt,
          counterHours: done.counterHours ?? counterNow?.totalHours ?? 0,
          previousCalendarDue: done.calendarDue,
        }
      : null;
    let plan: WorkOrderPlan;
    try {
      plan = planWorkOrder({
        routine: {
          intervalHours: r.intervalHours,
          calendarRule: r.calendarRule,
          anchored: r.anchored,
          anchorDate: r.anchorDate,
          baseline:
            r.baselineAt && r.baselineHours !== null
              ? { at: r.baselineAt, counterHours: r.baselineHours }
              : r.baselineAt
                ? { at: r.baselineAt, counterHours: 0 }
                : null,
          toleranceRuleId: r.toleranceRuleId,
        },
        rules,
        last,
        counter: counterNow,
        now,
        timeZone: ctx.vessel.timeZone,
      });
    } catch (error) {
      summary.skipped.push({ routineId: r.id, reason: error instanceof Error ? error.message : String(error) });
      continue;
    }
    const fields = {
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
      rank: r.rank,
      estimatedManHours: r.estimatedManHours,
      needsEngineStop: r.needsEngineStop,
      critical: r.critical,
      classRelated: r.classRelated,
    };
    const existing = openByRoutine.get(r.id);
    // A deferral in force keeps its state until the worker's deferral rules (a later issue) move it.
    const state = existing?.state === "deferred" ? "deferred" : plan.state;
    if (existing) {
      const stateChanged = existing.state !== state;
      if (stateChanged || changed(existing, fields)) {
        await tx
          .update(workOrder)
          .set({ ...fields, state, computedAt: now, ...(stateChanged ? { stateChangedAt: now } : {}) })
          .where(eq(workOrder.id, existing.id));
        summary.updated++;
      }
      if (stateChanged) {
        await tx
          .insert(workOrderStateChange)
          .values({ companyId, workOrderId: existing.id, fromState: existing.state, toState: state, changedAt: now });
        summary.stateChanges++;
      }
      continue;
    }
    sequence++;
    const inserted = await tx
      .insert(workOrder)
      .values({
        companyId,
        vesselId,
        routineId: r.id,
        number: workOrderNumber(ctx.vessel.code, sequence),
        occurrence: (done?.occurrence ?? 0) + 1,
        kind: "planned",
        state,
        stateChangedAt: now,
        computedAt: now,
        ...fields,
      })
      .onConflictDoNothing()
      .returning({ id: workOrder.id });
    if (inserted[0]) {
      summary.created++;
      await tx
        .insert(workOrderStateChange)
        .values({ companyId, workOrderId: inserted[0].id, fromState: null, toState: state, changedAt: now });
      summary.stateChanges++;
    }
  }
  if (sequence !== ctx.vessel.workOrderSeq) {
    await tx.update(vessel).set({ workOrderSeq: sequence }).where(eq(vessel.id, vesselId));
  }
  return summary;
}

const SAME_AT = (a: Date | null, b: Date | null) => (a?.getTime() ?? null) === (b?.getTime() ?? null);

function changed(row: typeof workOrder.$inferSelect, f: Record<string, unknown>): boolean {
  for (const [key, value] of Object.entries(f)) {
    const current = row[key as keyof typeof row];
    if (value instanceof Date || current instanceof Date) {
      if (!SAME_AT(value as Date | null, current as Date | null)) return true;
    } else if (current !== value) return true;
  }
  return false;
}
