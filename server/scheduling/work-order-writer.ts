// Writes one open work order per active routine of a vessel (inside recomputeVessel's
// transaction). A routine's open work order is its next occurrence; the unique index on
// (routine, occurrence) makes a second writer's insert a no-op, never a duplicate.
import "server-only";
import { and, desc, eq, inArray, isNotNull, isNull, ne, sql } from "drizzle-orm";
import type { Tx } from "@/db/client";
import { completion, component, portStay, routine, toleranceRule, vessel, workOrder } from "@/db/schema";
import { resolveCounters } from "@/server/register/tree";
import { toleranceRuleFromRow } from "@/server/tolerance/rows";
import type { WorkOrderRow } from "@/server/work-orders/fields";
import {
  type DeferredLimit,
  type LastCompletion,
  planCorrective,
  planWorkOrder,
  type WorkOrderPlan,
} from "./plan-work-order";
import { planEventWorkOrder } from "./plan-event-work-order";
import { passedAt, passedKey } from "./passed-at";
import { presetToleranceRules } from "./presets";
import type { CounterNow } from "./recompute";
import type { ToleranceRule } from "./tolerance";
import { insertStateChanges, insertWorkOrders, updateWorkOrders } from "./work-order-bulk-write";
import { correctiveFields, diffWorkOrders, type PlannedWorkOrder, routineFields } from "./work-order-diff";

// db/seed/history.ts numbers its work orders with this, from here.
export { workOrderNumber } from "./work-order-diff";

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

async function companyRules(tx: Tx, companyId: string): Promise<ToleranceRule[]> {
  const rows = await tx.select().from(toleranceRule).where(eq(toleranceRule.companyId, companyId));
  // A company that has not configured any rule gets the presets (the same ones it is offered).
  if (rows.length === 0) return presetToleranceRules();
  return rows.map(toleranceRuleFromRow);
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

  // A sentinel id keeps the two lookups valid SQL on a vessel with no routine (only follow-ups).
  const routineIds = routines.length ? routines.map((r) => r.id) : ["00000000-0000-0000-0000-000000000000"];

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
  // Routines tied to a port stay's event fall due at the vessel's stays.
  const stays = routines.some((r) => r.portEvent)
    ? await tx
        .select({ arrivesAt: portStay.arrivesAt, departsAt: portStay.departsAt })
        .from(portStay)
        .where(and(eq(portStay.companyId, companyId), eq(portStay.vesselId, vesselId)))
    : [];

  type Entry = {
    r: (typeof routines)[number];
    counterId: string | null;
    counterNow: CounterNow | null;
    done: (typeof lastDone)[number] | undefined;
    existing: WorkOrderRow | null;
    plan: WorkOrderPlan;
    replan: ((counter: CounterNow | null) => WorkOrderPlan) | null;
  };
  const entries: Entry[] = [];
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
    const existing = openByRoutine.get(r.id) ?? null;
    let plan: WorkOrderPlan;
    let replan: Entry["replan"] = null;
    if (r.portEvent && r.portEventHours) {
      const tied = planEventWorkOrder({
        tie: { event: r.portEvent, withinHours: r.portEventHours },
        stays,
        createdAt: r.createdAt,
        lastDone: done?.doneAt ?? null,
        now,
        timeZone: ctx.vessel.timeZone,
      });
      // No stay planned: no work order yet; one already open stays as it was.
      if (!tied) continue;
      plan = tied;
    } else try {
      const planWith = (counter: CounterNow | null) => planWorkOrder({
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
        counter,
        now,
        timeZone: ctx.vessel.timeZone,
        deferral: existing ? deferralOf(existing) : null,
      });
      plan = planWith(counterNow);
      replan = planWith;
    } catch (error) {
      summary.skipped.push({ routineId: r.id, reason: error instanceof Error ? error.message : String(error) });
      continue;
    }
    entries.push({ r, counterId, counterNow, done, existing, plan, replan });
  }

  // Hours limits the counters have already passed are dated by the readings around them, not
  // projected back at today's rate: a passed due date stays put as new readings arrive.
  const questions = entries.map((e) => passedHours(e.plan, e.counterId, e.counterNow));
  const passed = await passedLookup(tx, companyId, questions.flat());
  const planned: PlannedWorkOrder[] = [];
  for (const [i, e] of entries.entries()) {
    const { r, counterId, done, existing } = e;
    const plan =
      questions[i]!.length > 0 && e.replan && e.counterNow && counterId
        ? e.replan({ ...e.counterNow, passedAt: (hours) => passed.get(passedKey(counterId, hours)) ?? null })
        : e.plan;
    const fields = routineFields(r, counterId, plan);
    planned.push(
      existing
        ? { existing, state: plan.state, fields }
        : { existing: null, routineId: r.id, occurrence: (done?.occurrence ?? 0) + 1, state: plan.state, fields },
    );
  }

  for (const w of await openCorrective(tx, companyId, vesselId)) {
    const plan = planCorrective({
      dueDate: w.dueDate!,
      raisedAt: w.createdAt,
      deferral: deferralOf(w),
      now,
      timeZone: ctx.vessel.timeZone,
    });
    planned.push({ existing: w, state: plan.state, fields: correctiveFields(w, plan) });
  }

  const diff = diffWorkOrders(planned, ctx.vessel);
  await updateWorkOrders(tx, diff.updates, now);
  summary.updated = diff.updates.length;
  const inserted = await insertWorkOrders(tx, diff.inserts, { companyId, vesselId, now });
  summary.created = inserted.length;
  const stateChanges = [
    ...diff.stateChanges,
    ...inserted.map((w) => ({ workOrderId: w.id, fromState: null, toState: w.state })),
  ];
  await insertStateChanges(tx, stateChanges, { companyId, now });
  summary.stateChanges = stateChanges.length;
  if (diff.sequence !== ctx.vessel.workOrderSeq) {
    await tx.update(vessel).set({ workOrderSeq: diff.sequence }).where(eq(vessel.id, vesselId));
  }
  return summary;
}

function deferralOf(w: WorkOrderRow): DeferredLimit | null {
  if (w.deferredDueDate === null && w.deferredDueHours === null) return null;
  return { dueDate: w.deferredDueDate, dueHours: w.deferredDueHours };
}

/** Open corrective work orders (follow-ups with a due date): their state moves with the calendar. */
function openCorrective(tx: Tx, companyId: string, vesselId: string) {
  return tx
    .select()
    .from(workOrder)
    .where(
      and(
        eq(workOrder.companyId, companyId),
        eq(workOrder.vesselId, vesselId),
        eq(workOrder.kind, "corrective"),
        isNull(workOrder.routineId),
        ne(workOrder.state, "done"),
        isNotNull(workOrder.dueDate),
      ),
    );
}

type PassedQuestion = { counterId: string; hours: number };

/** The hours of a plan's limits (window, due, grace) its counter has already passed. */
function passedHours(plan: WorkOrderPlan, counterId: string | null, counter: CounterNow | null): PassedQuestion[] {
  const w = plan.hoursWindow;
  if (!w || !counterId || !counter) return [];
  return [w.opensAtHours, w.dueHours, w.graceEndsHours]
    .filter((hours) => hours <= counter.totalHours)
    .map((hours) => ({ counterId, hours }));
}

/**
 * When each counter passed each value, in one statement: the last reading below the value and the
 * first reading at or above it after that one (totals never fall, so both are found from the
 * newest end of the counter's index, where a recently passed limit lies).
 */
async function passedLookup(tx: Tx, companyId: string, questions: PassedQuestion[]): Promise<Map<string, Date>> {
  const unique = [...new Map(questions.map((q) => [passedKey(q.counterId, q.hours), q])).values()];
  const result = new Map<string, Date>();
  if (unique.length === 0) return result;
  const rows = await tx.execute<{
    counter_id: string;
    hours: string;
    below_at: Date | null;
    below_hours: string | null;
    reached_at: Date | null;
    reached_hours: string | null;
  }>(sql`
    select q.counter_id, q.hours, b.read_at as below_at, b.total_hours as below_hours,
           a.read_at as reached_at, a.total_hours as reached_hours
      from unnest(${`{${unique.map((q) => q.counterId).join(",")}}`}::uuid[],
                  ${`{${unique.map((q) => q.hours).join(",")}}`}::numeric[]) as q(counter_id, hours)
      left join lateral (
        select r.read_at, r.total_hours from reading r
         where r.company_id = ${companyId} and r.counter_id = q.counter_id and r.total_hours < q.hours
         order by r.read_at desc limit 1) b on true
      left join lateral (
        select r.read_at, r.total_hours from reading r
         where r.company_id = ${companyId} and r.counter_id = q.counter_id and r.total_hours >= q.hours
           and (b.read_at is null or r.read_at > b.read_at)
         order by r.read_at asc limit 1) a on true`);
  for (const row of rows.rows) {
    const hours = Number(row.hours);
    const at = passedAt(
      hours,
      row.below_at ? { at: new Date(row.below_at), totalHours: Number(row.below_hours) } : null,
      row.reached_at ? { at: new Date(row.reached_at), totalHours: Number(row.reached_hours) } : null,
    );
    if (at) result.set(passedKey(row.counter_id, hours), at);
  }
  return result;
}
