// A routine's due work: work orders, written by the worker (server/scheduling/work-order-writer.ts),
// and their state changes. Every table carries company_id and its indexes start with it.
import { type AnyColumn, type SQL, sql } from "drizzle-orm";
import {
  boolean,
  date,
  index,
  integer,
  jsonb,
  numeric,
  pgEnum,
  pgTable,
  text,
  unique,
  uniqueIndex,
  uuid,
} from "drizzle-orm/pg-core";
import { type HeadCount, hours } from "./columns";
import { component, counter } from "./machinery";
import { intervalKind, routine } from "./maintenance";
import { companyRef, instant, nowStamp, vesselRef } from "./refs";
import { OPEN_STATES_BY_URGENCY, OVERDUE_STATES, WORK_ORDER_STATES, type WorkOrderState } from "./work-order-states";

export const workOrderState = pgEnum("work_order_state", WORK_ORDER_STATES);

/** `case <state> when … then 0 … else n end`: a state's place in `order`; any other state after them. */
function stateOrder(state: AnyColumn, order: readonly WorkOrderState[]): SQL {
  const whens = order.map((s, i) => `when '${s}' then ${i}`).join(" ");
  return sql`case ${state} ${sql.raw(whens)} else ${sql.raw(String(order.length))} end`;
}

// The list orders below are also index expressions: built here once, so a query and its index
// cannot drift apart (the planner uses the index only for the very same expression).

/** Most urgent first (work-order-states.ts), done last: the Backlog's default order. */
export const urgencyOrder = (state: AnyColumn) => stateOrder(state, OPEN_STATES_BY_URGENCY);

/** Out of tolerance before late: the fleet's overdue list. */
export const overdueOrder = (state: AnyColumn) => stateOrder(state, ["out-of-tolerance"]);

/** One due occurrence of a routine (or a corrective follow-up), written by the worker. */
export const workOrder = pgTable(
  "work_order",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: companyRef(),
    vesselId: vesselRef(),
    routineId: uuid().references(() => routine.id, { onDelete: "restrict" }),
    componentId: uuid()
      .notNull()
      .references(() => component.id, { onDelete: "restrict" }),
    counterId: uuid().references(() => counter.id, { onDelete: "set null" }),
    /** WO-<vessel code>-<sequence>. */
    number: text().notNull(),
    /** 1 for a routine's first occurrence, 2 for the next… */
    occurrence: integer().notNull(),
    kind: text({ enum: ["planned", "corrective"] })
      .notNull()
      .default("planned"),
    title: text().notNull(),
    state: workOrderState().notNull(),
    stateChangedAt: nowStamp(),
    dueDate: instant(),
    dueHours: hours(),
    projectedDate: instant(),
    calendarDue: instant(),
    governing: intervalKind(),
    windowOpensAt: instant(),
    graceEndsAt: instant(),
    windowOpensHours: hours(),
    graceEndsHours: hours(),
    remainingHours: hours(),
    remainingDays: numeric({ precision: 8, scale: 1, mode: "number" }),
    /** The chief's planned date, beside — never instead of — the computed due date. */
    plannedDate: date({ mode: "string" }),
    /**
     * The ship's days the work may be planned on: from the first window's opening to the first
     * grace's end (hours limits projected at the running rate). Written by the worker.
     */
    planFrom: date({ mode: "string" }),
    planUntil: date({ mode: "string" }),
    /** When the work goes out of tolerance (the earlier grace end; hours projected). */
    outOfToleranceAt: instant(),
    /** The new limit of an approved deferral in force; the tolerance rules apply to it. */
    deferredDueDate: instant(),
    deferredDueHours: hours(),
    rank: text().notNull().default("engineer"),
    estimatedManHours: numeric({ precision: 6, scale: 1, mode: "number" }).notNull().default(1),
    /** Who does it: ranks with a head count; `rank` is its first (lead) rank. */
    team: jsonb().$type<HeadCount[]>().notNull().default([]),
    /** Hours the job takes from start to end; man-hours = elapsed × the team's head count. */
    elapsedHours: numeric({ precision: 6, scale: 1, mode: "number" }).notNull().default(1),
    /** Needs the ship in port: shore crane, service engineer, surveyor, parts delivered in port. */
    needsPort: boolean().notNull().default(false),
    needsEngineStop: boolean().notNull().default(false),
    /** Copied from a routine tied to a port stay's event: the planner keeps the job in its window. */
    portEvent: text({ enum: ["departure", "arrival"] }),
    portEventHours: numeric({ precision: 5, scale: 1, mode: "number" }),
    critical: boolean().notNull().default(false),
    classRelated: boolean().notNull().default(false),
    computedAt: nowStamp(),
    completedAt: instant(),
    createdAt: nowStamp(),
  },
  (t) => [
    unique().on(t.companyId, t.number),
    // One work order per routine occurrence: two workers racing cannot both insert it.
    uniqueIndex("work_order_routine_occurrence").on(t.routineId, t.occurrence),
    index().on(t.companyId, t.vesselId, t.state, t.dueDate),
    index().on(t.companyId, t.vesselId, t.componentId),
    // The Backlog's default order (most urgent first, server/backlog/queries.ts): walking this
    // index gives a page of 50 without sorting a vessel's 3,000 work orders. The query orders by
    // the same urgencyOrder, so the planner uses it.
    index("work_order_backlog_urgency").on(
      t.companyId,
      t.vesselId,
      sql`(${urgencyOrder(t.state)})`,
      t.dueDate.asc().nullsLast(),
      t.number,
    ),
    // The fleet's overdue list (server/fleet/overdue.ts): only late and out-of-tolerance rows, in
    // the list's order, so its first page is read off the index instead of sorting the fleet's.
    // The expressions must stay the same as the query's (overdueOrder is shared).
    index("work_order_fleet_overdue")
      .on(
        t.companyId,
        sql`(${overdueOrder(t.state)})`,
        sql`(${t.critical} or ${t.classRelated}) desc`,
        sql`(coalesce(${t.deferredDueDate}, ${t.dueDate})) asc nulls last`,
        t.stateChangedAt,
        t.number,
      )
      .where(sql`${t.state} in (${sql.raw(OVERDUE_STATES.map((s) => `'${s}'`).join(", "))})`),
  ],
);

/** Every state change, with its time, so escalation acts once per change. */
export const workOrderStateChange = pgTable(
  "work_order_state_change",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: companyRef(),
    workOrderId: uuid()
      .notNull()
      .references(() => workOrder.id, { onDelete: "cascade" }),
    fromState: workOrderState(),
    toState: workOrderState().notNull(),
    changedAt: nowStamp(),
    escalatedAt: instant(),
  },
  (t) => [index().on(t.companyId, t.workOrderId, t.changedAt)],
);
