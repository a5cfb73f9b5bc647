import "server-only";
import { and, asc, count, eq, ilike, inArray, isNull, ne, notExists, or, type SQL, sql } from "drizzle-orm";
import { type Db, getDb, type Tx } from "@/db/client";
import { completion, component, routine, routinePlanProblem, toleranceRule, workOrder } from "@/db/schema";
import type { Access, VesselRef } from "@/server/auth/access";
import { can } from "@/server/auth/roles";
import { instantOfShipTime, shipDay } from "@/server/format/hours";
import { AppError, fieldErrorsFromZod, type FieldError, invalidInput } from "@/server/http/problem";
import { requestRecompute } from "@/server/jobs/recompute-vessel";
import { formFromCalendarRule } from "@/server/scheduling/calendar-rule-words";
import {
  type NewRoutine,
  type Rank,
  type RoutineChange,
  RoutineInput,
  type RoutineList,
  type RoutineSummary,
  type RoutineView,
} from "./contract";
import { intervalWords } from "./interval-words";
import { loadPlanProblems } from "./plan-problems";

/** The list sends at most this many rows: a satellite link pays for every byte. */
export const LIST_LIMIT = 500;

type RoutineRow = typeof routine.$inferSelect;
type Scope = { access: Access; vessel: VesselRef };

const routineScope = ({ access, vessel }: Scope) =>
  and(eq(routine.companyId, access.company.id), eq(routine.vesselId, vessel.id), isNull(routine.retiredAt));

function noSuchRoutine(vessel: VesselRef): AppError {
  return new AppError("not-found", `There is no such routine on ${vessel.name}.`);
}

function toView(
  r: RoutineRow,
  c: { id: string; code: string; name: string },
  toleranceRuleName: string | null,
  timeZone: string,
): RoutineView {
  return {
    id: r.id,
    componentId: r.componentId,
    title: r.title,
    description: r.description,
    checklist: r.checklist,
    intervalHours: r.intervalHours,
    calendarRule: r.calendarRule,
    anchored: r.anchored,
    anchorDate: r.anchorDate,
    estimatedManHours: r.estimatedManHours,
    rank: r.rank as Rank,
    team: (r.team.length ? r.team : [{ rank: r.rank, count: 1 }]) as NewRoutine["team"],
    elapsedHours: r.elapsedHours,
    needsPort: r.needsPort,
    portEvent: r.portEvent,
    portEventHours: r.portEventHours,
    needsEngineStop: r.needsEngineStop,
    critical: r.critical,
    classRelated: r.classRelated,
    classItemRef: r.classItemRef,
    measurements: r.measurements,
    spareParts: r.spareParts,
    cautions: r.cautions,
    baselineAt: r.baselineAt ? shipDay(r.baselineAt, timeZone) : null,
    baselineHours: r.baselineHours,
    toleranceRuleId: r.toleranceRuleId,
    component: c,
    intervalWords: intervalWords(r.intervalHours, r.calendarRule, r.portEvent && r.portEventHours ? { event: r.portEvent, withinHours: r.portEventHours } : null),
    calendar: r.calendarRule ? formFromCalendarRule(r.calendarRule) : null,
    toleranceRuleName,
    revision: r.revision,
    updatedAt: r.updatedAt.toISOString(),
  };
}

function componentFilter(scope: Scope, componentId: string): SQL {
  const { access, vessel } = scope;
  return sql`${routine.componentId} in (
    with recursive sub as (
      select id from ${component} where company_id = ${access.company.id} and vessel_id = ${vessel.id} and id = ${componentId}
      union all
      select c.id from ${component} c join sub on c.parent_id = sub.id where c.company_id = ${access.company.id}
    ) select id from sub)`;
}

/** The vessel's routines in use (the component's subtree with `component`), by component code, as list rows. */
export async function listRoutines(
  access: Access,
  vessel: VesselRef,
  filter: { component?: string; q?: string },
): Promise<RoutineList> {
  const db = getDb();
  const scope = { access, vessel };
  const where: SQL[] = [routineScope(scope)!];
  if (filter.component) where.push(componentFilter(scope, filter.component));
  if (filter.q) {
    const like = `%${filter.q.replace(/[%_\\]/g, (ch) => `\\${ch}`)}%`;
    where.push(or(ilike(routine.title, like), ilike(component.code, like), ilike(component.name, like))!);
  }
  // Only the columns the table shows: checklists, measurements and texts stay in the database.
  const rows = await db
    .select({
      id: routine.id,
      title: routine.title,
      component: { id: component.id, code: component.code, name: component.name },
      intervalHours: routine.intervalHours,
      calendarRule: routine.calendarRule,
      anchored: routine.anchored,
      anchorDate: routine.anchorDate,
      rank: routine.rank,
      team: routine.team,
      elapsedHours: routine.elapsedHours,
      estimatedManHours: routine.estimatedManHours,
      critical: routine.critical,
      classRelated: routine.classRelated,
      classItemRef: routine.classItemRef,
      needsEngineStop: routine.needsEngineStop,
      needsPort: routine.needsPort,
      portEvent: routine.portEvent,
      portEventHours: routine.portEventHours,
      planProblem: routinePlanProblem.reason,
    })
    .from(routine)
    .innerJoin(component, eq(component.id, routine.componentId))
    .leftJoin(routinePlanProblem, eq(routinePlanProblem.routineId, routine.id))
    .where(and(...where))
    .orderBy(asc(component.code), asc(routine.title))
    .limit(LIST_LIMIT);
  const [total] = await db
    .select({ n: count() })
    .from(routine)
    .innerJoin(component, eq(component.id, routine.componentId))
    .where(and(...where));
  const components = await db
    .select({ id: component.id, code: component.code, name: component.name })
    .from(component)
    .where(and(eq(component.companyId, access.company.id), eq(component.vesselId, vessel.id)))
    .orderBy(asc(component.code));
  const rules = await db
    .select({ id: toleranceRule.id, name: toleranceRule.name, kind: toleranceRule.kind })
    .from(toleranceRule)
    .where(eq(toleranceRule.companyId, access.company.id))
    .orderBy(asc(toleranceRule.sortOrder), asc(toleranceRule.name));
  return {
    vessel: { id: vessel.id, name: vessel.name, code: vessel.code },
    canEdit: can(access.role, "register:edit"),
    routines: rows.map(({ intervalHours, calendarRule, anchored, anchorDate, rank, team, portEvent, portEventHours, ...shown }): RoutineSummary => ({
      ...shown,
      rank: rank as Rank,
      team: (team.length ? team : [{ rank, count: 1 }]) as RoutineSummary["team"],
      intervalWords: intervalWords(intervalHours, calendarRule, portEvent && portEventHours ? { event: portEvent, withinHours: portEventHours } : null),
      anchoredOn: anchored ? anchorDate : null,
    })),
    total: total?.n ?? 0,
    components,
    toleranceRules: rules,
    planProblems: await loadPlanProblems(db, access.company.id, vessel.id),
  };
}

async function findRoutine(tx: Db | Tx, scope: Scope, routineId: string) {
  const [row] = await tx
    .select({
      r: routine,
      c: { id: component.id, code: component.code, name: component.name },
      rule: toleranceRule.name,
    })
    .from(routine)
    .innerJoin(component, eq(component.id, routine.componentId))
    .leftJoin(toleranceRule, eq(toleranceRule.id, routine.toleranceRuleId))
    .where(and(routineScope(scope), eq(routine.id, routineId)));
  return row ?? null;
}

export async function getRoutine(access: Access, vessel: VesselRef, routineId: string): Promise<RoutineView> {
  const found = await findRoutine(getDb(), { access, vessel }, routineId);
  if (!found) throw noSuchRoutine(vessel);
  return toView(found.r, found.c, found.rule, vessel.timeZone);
}

/** An id in the body that names another vessel's component or another company's rule is bad input. */
export async function checkRoutineReferences(tx: Tx, scope: Scope, input: NewRoutine, errors: FieldError[]) {
  const [c] = await tx
    .select({ id: component.id })
    .from(component)
    .where(
      and(
        eq(component.companyId, scope.access.company.id),
        eq(component.vesselId, scope.vessel.id),
        eq(component.id, input.componentId),
      ),
    );
  if (!c) errors.push({ field: "componentId", message: `There is no such component on ${scope.vessel.name}.` });
  if (input.toleranceRuleId) {
    const [rule] = await tx
      .select({ id: toleranceRule.id })
      .from(toleranceRule)
      .where(and(eq(toleranceRule.companyId, scope.access.company.id), eq(toleranceRule.id, input.toleranceRuleId)));
    if (!rule) errors.push({ field: "toleranceRuleId", message: "There is no such tolerance rule in your company." });
  }
}

/** The columns a routine's definition writes; the baseline's ship's day becomes noon of that day on board. */
export function routineColumns(input: NewRoutine, timeZone: string) {
  const { baselineAt, ...rest } = input;
  return { ...rest, baselineAt: baselineAt ? instantOfShipTime(baselineAt, "12:00", timeZone) : null };
}

export async function createRoutine(access: Access, vessel: VesselRef, input: NewRoutine): Promise<RoutineView> {
  const scope = { access, vessel };
  const id = await getDb().transaction(async (tx) => {
    const errors: FieldError[] = [];
    await checkRoutineReferences(tx, scope, input, errors);
    if (errors.length) throw invalidInput(errors);
    const [row] = await tx
      .insert(routine)
      .values({ companyId: access.company.id, vesselId: vessel.id, ...routineColumns(input, vessel.timeZone) })
      .returning({ id: routine.id });
    await requestRecompute(tx, access.company.id, vessel.id);
    return row!.id;
  });
  return getRoutine(access, vessel, id);
}

/** The stored routine as the form would send it, so that an edit is checked as a whole. */
function inputOf(view: RoutineView): Record<string, unknown> {
  const {
    id: _id,
    component: _c,
    intervalWords: _w,
    calendar: _f,
    toleranceRuleName: _n,
    revision: _r,
    updatedAt: _u,
    ...rest
  } = view;
  return rest;
}

export async function updateRoutine(
  access: Access,
  vessel: VesselRef,
  routineId: string,
  change: RoutineChange,
  now = new Date(),
): Promise<RoutineView> {
  const scope = { access, vessel };
  await getDb().transaction(async (tx) => {
    const found = await findRoutine(tx, scope, routineId);
    if (!found) throw noSuchRoutine(vessel);
    const sent = Object.fromEntries(Object.entries(change).filter(([, v]) => v !== undefined));
    const merged = { ...inputOf(toView(found.r, found.c, found.rule, vessel.timeZone)), ...sent };
    // One rank and its man-hours sent without a team (an older client): they replace the team.
    if (!("team" in sent) && ("rank" in sent || "estimatedManHours" in sent)) {
      delete merged.team;
      delete merged.elapsedHours;
    }
    // A calendar sent either way replaces the stored one, whichever way it was given before.
    if ("calendar" in sent || "calendarRule" in sent) {
      merged.calendar = sent.calendar ?? null;
      merged.calendarRule = sent.calendarRule ?? null;
    }
    const parsed = RoutineInput.safeParse(merged);
    if (!parsed.success) throw invalidInput(fieldErrorsFromZod(parsed.error));
    const errors: FieldError[] = [];
    await checkRoutineReferences(tx, scope, parsed.data, errors);
    if (errors.length) throw invalidInput(errors);
    await tx
      .update(routine)
      .set({
        ...routineColumns(parsed.data, vessel.timeZone),
        revision: sql`${routine.revision} + 1`,
        updatedAt: now,
      })
      .where(and(routineScope(scope), eq(routine.id, found.r.id)));
    await requestRecompute(tx, access.company.id, vessel.id);
  });
  return getRoutine(access, vessel, routineId);
}

/**
 * Takes a routine out of use. Its open work order leaves the Backlog unless work was already
 * recorded on it; done work orders and their completions stay as the maintenance history.
 */
/** The open work orders of retired routines, unless a completion is recorded on one; how many went. */
export async function dropOpenWorkOrders(tx: Tx, companyId: string, routineIds: string[]): Promise<number> {
  const gone = await tx
    .delete(workOrder)
    .where(
      and(
        eq(workOrder.companyId, companyId),
        inArray(workOrder.routineId, routineIds),
        ne(workOrder.state, "done"),
        notExists(
          tx
            .select({ one: sql`1` })
            .from(completion)
            .where(eq(completion.workOrderId, workOrder.id)),
        ),
      ),
    )
    .returning({ id: workOrder.id });
  return gone.length;
}

export async function retireRoutine(
  access: Access,
  vessel: VesselRef,
  routineId: string,
  now = new Date(),
): Promise<{ id: string; retiredAt: string; openWorkOrdersRemoved: number }> {
  const scope = { access, vessel };
  const removed = await getDb().transaction(async (tx) => {
    const found = await findRoutine(tx, scope, routineId);
    if (!found) throw noSuchRoutine(vessel);
    await tx
      .update(routine)
      .set({ retiredAt: now, updatedAt: now, revision: sql`${routine.revision} + 1` })
      .where(eq(routine.id, found.r.id));
    const gone = await dropOpenWorkOrders(tx, access.company.id, [found.r.id]);
    await requestRecompute(tx, access.company.id, vessel.id);
    return gone;
  });
  return { id: routineId, retiredAt: now.toISOString(), openWorkOrdersRemoved: removed };
}
