// Writes one open work order per active routine of a vessel (inside recomputeVessel's
// transaction). A routine's open work order is its next occurrence; the unique index on
// (routine, occurrence) makes a second writer's insert a no-op, never a duplicate.
import "server-only";
import { and, desc, eq, inArray, isNotNull, isNull, ne, sql } from "drizzle-orm";
import type { Tx } from "@/db/client";
import { completion, component, routine, toleranceRule, vessel, workOrder, workOrderStateChange } from "@/db/schema";
import { resolveCounters } from "@/server/register/tree";
import { round1 } from "@/server/readings/rules";
import {
  type DeferredLimit,
  type LastCompletion,
  planCorrective,
  planWorkOrder,
  type WorkOrderPlan,
} from "./plan-work-order";
import { toleranceRuleFromRow } from "@/server/tolerance/rows";
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

  let sequence = ctx.vessel.workOrderSeq;
  const updates: WorkOrderUpdate[] = [];
  const inserts: WorkOrderInsert[] = [];
  const stateChanges: StateChange[] = [];
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
    const existing = openByRoutine.get(r.id);
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
        deferral: existing ? deferralOf(existing) : null,
      });
    } catch (error) {
      summary.skipped.push({ routineId: r.id, reason: error instanceof Error ? error.message : String(error) });
      continue;
    }
    const fields: WorkOrderFields = {
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
      estimatedManHours: r.estimatedManHours,
      needsEngineStop: r.needsEngineStop,
      critical: r.critical,
      classRelated: r.classRelated,
    };
    const state = plan.state;
    if (existing) {
      const stateChanged = existing.state !== state;
      if (stateChanged || changed(existing, fields)) {
        updates.push({ id: existing.id, state, stateChanged, ...fields });
      }
      if (stateChanged) {
        stateChanges.push({ workOrderId: existing.id, fromState: existing.state, toState: state });
      }
      continue;
    }
    // A number is used up even when another writer's row wins the insert, as before batching.
    sequence++;
    inserts.push({
      routineId: r.id,
      number: workOrderNumber(ctx.vessel.code, sequence),
      occurrence: (done?.occurrence ?? 0) + 1,
      state,
      ...fields,
    });
  }

  for (const w of await openCorrective(tx, companyId, vesselId)) {
    const plan = planCorrective({
      dueDate: w.dueDate!,
      raisedAt: w.createdAt,
      deferral: deferralOf(w),
      now,
      timeZone: ctx.vessel.timeZone,
    });
    const fields: WorkOrderFields = {
      ...pickFields(w),
      windowOpensAt: plan.calendarWindow?.opensAt ?? null,
      graceEndsAt: plan.calendarWindow?.graceEndsAt ?? null,
      remainingDays: plan.remainingDays,
      planFrom: plan.planFrom,
      planUntil: plan.planUntil,
      outOfToleranceAt: plan.outOfToleranceAt,
    };
    const stateChanged = w.state !== plan.state;
    if (stateChanged || changed(w, fields)) updates.push({ id: w.id, state: plan.state, stateChanged, ...fields });
    if (stateChanged) stateChanges.push({ workOrderId: w.id, fromState: w.state, toState: plan.state });
  }

  // Written in a few statements rather than one per work order: a vessel of 3,000 routines made
  // 3,000–6,000 round trips a run, several seconds, most of a nightly fleet run.
  for (const chunk of chunks(updates, UPDATE_CHUNK)) await updateWorkOrders(tx, chunk, now);
  summary.updated = updates.length;
  for (const chunk of chunks(inserts, INSERT_CHUNK)) {
    const inserted = await insertWorkOrders(tx, chunk, { companyId, vesselId, now });
    summary.created += inserted.length;
    for (const w of inserted) {
      stateChanges.push({ workOrderId: w.id, fromState: null, toState: w.state });
    }
  }
  for (const chunk of chunks(stateChanges, STATE_CHANGE_CHUNK)) await insertStateChanges(tx, chunk, { companyId, now });
  summary.stateChanges = stateChanges.length;
  if (sequence !== ctx.vessel.workOrderSeq) {
    await tx.update(vessel).set({ workOrderSeq: sequence }).where(eq(vessel.id, vesselId));
  }
  return summary;
}

// Each statement binds one array per column, so any number of rows fits its parameters; chunks
// only keep one statement's arrays and its returned rows modest on a very large vessel.
type WorkOrderRow = typeof workOrder.$inferSelect;

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

function pickFields(w: WorkOrderRow): WorkOrderFields {
  return Object.fromEntries(FIELD_KEYS.map((k) => [k, w[k]])) as WorkOrderFields;
}

const INSERT_CHUNK = 2_000;
const UPDATE_CHUNK = 2_000;
const STATE_CHANGE_CHUNK = 5_000;

function* chunks<T>(rows: T[], size: number): Generator<T[]> {
  for (let i = 0; i < rows.length; i += size) yield rows.slice(i, i + size);
}

type WorkOrderFields = {
  componentId: string;
  counterId: string | null;
  title: string;
  dueDate: Date | null;
  dueHours: number | null;
  projectedDate: Date | null;
  calendarDue: Date | null;
  governing: "hours" | "calendar" | null;
  windowOpensAt: Date | null;
  graceEndsAt: Date | null;
  windowOpensHours: number | null;
  graceEndsHours: number | null;
  remainingHours: number | null;
  remainingDays: number | null;
  planFrom: string | null;
  planUntil: string | null;
  outOfToleranceAt: Date | null;
  rank: string;
  estimatedManHours: number;
  needsEngineStop: boolean;
  critical: boolean;
  classRelated: boolean;
};
type WorkOrderUpdate = WorkOrderFields & { id: string; state: WorkOrderState; stateChanged: boolean };
type WorkOrderState = (typeof workOrder.$inferSelect)["state"];
type WorkOrderInsert = WorkOrderFields & {
  routineId: string;
  number: string;
  occurrence: number;
  state: WorkOrderState;
};

/** The fields both statements write, as unnest arrays, in the order of FIELD_COLUMNS. */
function fieldArrays(rows: WorkOrderFields[]) {
  const column = <K extends keyof WorkOrderFields>(key: K) => sql.param(rows.map((r) => r[key]));
  return sql`${column("componentId")}::uuid[], ${column("counterId")}::uuid[], ${column("title")}::text[],
    ${column("dueDate")}::timestamptz[], ${column("dueHours")}::numeric[], ${column("projectedDate")}::timestamptz[],
    ${column("calendarDue")}::timestamptz[], ${column("governing")}::interval_kind[],
    ${column("windowOpensAt")}::timestamptz[], ${column("graceEndsAt")}::timestamptz[],
    ${column("windowOpensHours")}::numeric[], ${column("graceEndsHours")}::numeric[],
    ${column("remainingHours")}::numeric[], ${column("remainingDays")}::numeric[],
    ${column("planFrom")}::date[], ${column("planUntil")}::date[], ${column("outOfToleranceAt")}::timestamptz[],
    ${column("rank")}::text[],
    ${column("estimatedManHours")}::numeric[], ${column("needsEngineStop")}::boolean[],
    ${column("critical")}::boolean[], ${column("classRelated")}::boolean[]`;
}
const FIELD_COLUMNS = sql.raw(`component_id, counter_id, title, due_date, due_hours, projected_date, calendar_due,
  governing, window_opens_at, grace_ends_at, window_opens_hours, grace_ends_hours, remaining_hours,
  remaining_days, plan_from, plan_until, out_of_tolerance_at, rank, estimated_man_hours, needs_engine_stop,
  critical, class_related`);
const FIELD_KEYS = [
  "componentId",
  "counterId",
  "title",
  "dueDate",
  "dueHours",
  "projectedDate",
  "calendarDue",
  "governing",
  "windowOpensAt",
  "graceEndsAt",
  "windowOpensHours",
  "graceEndsHours",
  "remainingHours",
  "remainingDays",
  "planFrom",
  "planUntil",
  "outOfToleranceAt",
  "rank",
  "estimatedManHours",
  "needsEngineStop",
  "critical",
  "classRelated",
] as const satisfies readonly (keyof WorkOrderFields)[];

/**
 * One INSERT … SELECT FROM unnest(…) for many new work orders: a multi-row VALUES of 1,000 rows
 * cost about a second in query building alone. A row whose (routine, occurrence) another writer
 * inserted first is skipped, as the single-row insert was; only rows really inserted come back.
 */
async function insertWorkOrders(
  tx: Tx,
  rows: WorkOrderInsert[],
  at: { companyId: string; vesselId: string; now: Date },
): Promise<{ id: string; state: WorkOrderState }[]> {
  const column = <K extends keyof WorkOrderInsert>(key: K) => sql.param(rows.map((r) => r[key]));
  const result = await tx.execute<{ id: string; state: WorkOrderState }>(sql`
    insert into work_order (company_id, vessel_id, kind, state_changed_at, computed_at,
                            routine_id, number, occurrence, state, ${FIELD_COLUMNS})
    select ${at.companyId}::uuid, ${at.vesselId}::uuid, 'planned', ${at.now}::timestamptz, ${at.now}::timestamptz, v.*
    from unnest(${column("routineId")}::uuid[], ${column("number")}::text[], ${column("occurrence")}::int[],
                ${column("state")}::work_order_state[], ${fieldArrays(rows)}) as v
    on conflict do nothing
    returning id, state`);
  return result.rows;
}

/**
 * One UPDATE … FROM unnest(…) for many work orders: each column travels as one array, so the
 * statement binds 22 parameters whatever the number of rows. The state-change time moves only
 * where the state changed, as the per-row update did.
 */
async function updateWorkOrders(tx: Tx, rows: WorkOrderUpdate[], now: Date) {
  const column = <K extends keyof WorkOrderUpdate>(key: K) => sql.param(rows.map((r) => r[key]));
  await tx.execute(sql`
    update work_order as w set
      (${FIELD_COLUMNS}) = (select v.component_id, v.counter_id, v.title, v.due_date, v.due_hours,
        v.projected_date, v.calendar_due, v.governing, v.window_opens_at, v.grace_ends_at,
        v.window_opens_hours, v.grace_ends_hours, v.remaining_hours, v.remaining_days, v.plan_from,
        v.plan_until, v.out_of_tolerance_at, v.rank,
        v.estimated_man_hours, v.needs_engine_stop, v.critical, v.class_related),
      state = v.state, computed_at = ${now}::timestamptz,
      state_changed_at = case when v.state_changed then ${now}::timestamptz else w.state_changed_at end
    from unnest(${column("id")}::uuid[], ${column("state")}::work_order_state[], ${column("stateChanged")}::boolean[],
                ${fieldArrays(rows)})
      as v(id, state, state_changed, ${FIELD_COLUMNS})
    where w.id = v.id`);
}

type StateChange = { workOrderId: string; fromState: WorkOrderState | null; toState: WorkOrderState };

/** The state-change rows of a run, all stamped with the run's time, in one statement per chunk. */
async function insertStateChanges(tx: Tx, rows: StateChange[], at: { companyId: string; now: Date }) {
  const column = <K extends keyof StateChange>(key: K) => sql.param(rows.map((r) => r[key]));
  await tx.execute(sql`
    insert into ${workOrderStateChange} (company_id, work_order_id, from_state, to_state, changed_at)
    select ${at.companyId}::uuid, v.*, ${at.now}::timestamptz
    from unnest(${column("workOrderId")}::uuid[], ${column("fromState")}::work_order_state[],
                ${column("toState")}::work_order_state[]) as v`);
}

const SAME_AT = (a: Date | null, b: Date | null) => (a?.getTime() ?? null) === (b?.getTime() ?? null);

function changed(row: typeof workOrder.$inferSelect, f: WorkOrderFields): boolean {
  for (const [key, value] of Object.entries(f)) {
    const current = row[key as keyof typeof row];
    if (value instanceof Date || current instanceof Date) {
      if (!SAME_AT(value as Date | null, current as Date | null)) return true;
    } else if (current !== value) return true;
  }
  return false;
}
