// The maintenance plan and its due work: tolerance rules, routines, work orders, their state
// changes and completions (issue 3). Every table carries company_id and its indexes start with it.
import { sql } from "drizzle-orm";
import {
  boolean,
  check,
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
import { user } from "./auth";
import { hours } from "./columns";
import { component, counter } from "./machinery";
import { companyRef, instant, nowStamp, vesselRef } from "./refs";

export const workOrderState = pgEnum("work_order_state", [
  "scheduled",
  "window-open",
  "late",
  "out-of-tolerance",
  "deferred",
  "done",
]);

export const intervalKind = pgEnum("interval_kind", ["hours", "calendar"]);
export const toleranceUnit = pgEnum("tolerance_unit", ["days", "months", "hours", "percent"]);

/** A company's late-work rule: matched to routines by interval kind and size. */
export const toleranceRule = pgTable(
  "tolerance_rule",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: companyRef(),
    name: text().notNull(),
    kind: intervalKind().notNull(),
    /** Interval size range the rule matches: hours for `hours`, days for `calendar`. */
    minInterval: numeric({ precision: 10, scale: 1, mode: "number" }).notNull(),
    maxInterval: numeric({ precision: 10, scale: 1, mode: "number" }).notNull(),
    windowBeforeValue: numeric({ precision: 8, scale: 2, mode: "number" }).notNull(),
    windowBeforeUnit: toleranceUnit().notNull(),
    graceAfterValue: numeric({ precision: 8, scale: 2, mode: "number" }).notNull(),
    graceAfterUnit: toleranceUnit().notNull(),
    capHours: hours(),
    keepsAnniversary: boolean().notNull().default(false),
    sortOrder: integer().notNull().default(0),
    createdAt: nowStamp(),
    updatedAt: nowStamp(),
  },
  (t) => [
    unique().on(t.companyId, t.name),
    index().on(t.companyId, t.kind),
    check("tolerance_rule_range", sql`${t.minInterval} <= ${t.maxInterval}`),
  ],
);

export type RoutineMeasurement = { name: string; unit: string; lower: number | null; upper: number | null };
export type RoutineCaution =
  "isolation" | "permit-to-work" | "enclosed-space" | "hot-work" | "starting-air" | "turning-gear";

/** A maintenance task definition on a component: by running hours, a calendar rule, or both. */
export const routine = pgTable(
  "routine",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: companyRef(),
    vesselId: vesselRef(),
    componentId: uuid()
      .notNull()
      .references(() => component.id, { onDelete: "restrict" }),
    title: text().notNull(),
    description: text().notNull().default(""),
    checklist: jsonb().$type<string[]>().notNull().default([]),
    intervalHours: hours(),
    /** RFC 5545 RRULE (without DTSTART). */
    calendarRule: text(),
    anchored: boolean().notNull().default(false),
    /** The fixed anniversary an anchored routine keeps (class items). */
    anchorDate: date({ mode: "string" }),
    estimatedManHours: numeric({ precision: 6, scale: 1, mode: "number" }).notNull().default(1),
    rank: text().notNull().default("engineer"),
    needsEngineStop: boolean().notNull().default(false),
    critical: boolean().notNull().default(false),
    classRelated: boolean().notNull().default(false),
    classItemRef: text(),
    measurements: jsonb().$type<RoutineMeasurement[]>().notNull().default([]),
    spareParts: text().notNull().default(""),
    cautions: jsonb().$type<RoutineCaution[]>().notNull().default([]),
    /** Where the count starts for a routine never done. */
    baselineAt: instant(),
    baselineHours: hours(),
    /** Overrides the matched tolerance rule. */
    toleranceRuleId: uuid().references(() => toleranceRule.id, { onDelete: "set null" }),
    /** Bumped on every change, so the worker knows its rows are stale. */
    revision: integer().notNull().default(1),
    createdAt: nowStamp(),
    updatedAt: nowStamp(),
    retiredAt: instant(),
  },
  (t) => [
    index().on(t.companyId, t.vesselId),
    index().on(t.companyId, t.componentId),
    check("routine_has_interval", sql`${t.intervalHours} is not null or ${t.calendarRule} is not null`),
    check("routine_interval_positive", sql`${t.intervalHours} is null or ${t.intervalHours} > 0`),
  ],
);

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
    needsEngineStop: boolean().notNull().default(false),
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
    // index gives a page of 50 without sorting a vessel's 3,000 work orders. The expression must
    // stay the same as the query's for the planner to use it.
    index("work_order_backlog_urgency").on(
      t.companyId,
      t.vesselId,
      sql`(case ${t.state} when 'out-of-tolerance' then 0 when 'late' then 1 when 'window-open' then 2 when 'deferred' then 3 when 'scheduled' then 4 else 5 end)`,
      t.dueDate.asc().nullsLast(),
      t.number,
    ),
    // The fleet's overdue list (server/fleet/overdue.ts): only late and out-of-tolerance rows, in
    // the list's order, so its first page is read off the index instead of sorting the fleet's.
    // The expressions must stay the same as the query's.
    index("work_order_fleet_overdue")
      .on(
        t.companyId,
        sql`(case ${t.state} when 'out-of-tolerance' then 0 else 1 end)`,
        sql`(${t.critical} or ${t.classRelated}) desc`,
        sql`(coalesce(${t.deferredDueDate}, ${t.dueDate})) asc nulls last`,
        t.stateChangedAt,
        t.number,
      )
      .where(sql`${t.state} in ('out-of-tolerance', 'late')`),
  ],
);

export const deferralStatus = pgEnum("deferral_status", ["pending", "approved", "rejected", "withdrawn"]);

/** A request to postpone a work order's limit: asked on board, decided by the chief or the office. */
export const deferral = pgTable(
  "deferral",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: companyRef(),
    vesselId: vesselRef(),
    workOrderId: uuid()
      .notNull()
      .references(() => workOrder.id, { onDelete: "cascade" }),
    status: deferralStatus().notNull().default("pending"),
    reason: text().notNull(),
    /** The proposed new limit: a ship's day (the end of it), running hours, or both. */
    proposedDueDay: date({ mode: "string" }),
    proposedDueHours: hours(),
    /** Critical and class-related work (or a company rule) needs the superintendent's decision. */
    needsOffice: boolean().notNull(),
    requestedBy: text().references(() => user.id, { onDelete: "set null" }),
    requestedAt: nowStamp(),
    decidedBy: text().references(() => user.id, { onDelete: "set null" }),
    decidedAt: instant(),
    decisionNote: text(),
  },
  (t) => [
    // One open request per work order.
    uniqueIndex("deferral_one_pending").on(t.workOrderId).where(sql`${t.status} = 'pending'`),
    index().on(t.companyId, t.vesselId, t.status),
    check("deferral_has_limit", sql`${t.proposedDueDay} is not null or ${t.proposedDueHours} is not null`),
  ],
);

export type CrewCapacity = { rank: string; manHoursPerDay: number };

/** A port call: when, whether the main engine may be immobilised and for how long, the crew's hours. */
export const portStay = pgTable(
  "port_stay",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: companyRef(),
    vesselId: vesselRef(),
    port: text().notNull(),
    arrivesAt: instant().notNull(),
    departsAt: instant().notNull(),
    engineMayStop: boolean().notNull().default(false),
    /** Hours the main engine may be immobilised; 0 when it may not. */
    immobilisationHours: numeric({ precision: 6, scale: 1, mode: "number" }).notNull().default(0),
    /** The man-hours each rank has for maintenance on each day of the stay. */
    crew: jsonb().$type<CrewCapacity[]>().notNull().default([]),
    remarks: text().notNull().default(""),
    packageAcceptedAt: instant(),
    packageAcceptedBy: text().references(() => user.id, { onDelete: "set null" }),
    createdAt: nowStamp(),
    updatedAt: nowStamp(),
  },
  (t) => [
    index().on(t.companyId, t.vesselId, t.arrivesAt),
    check("port_stay_order", sql`${t.departsAt} > ${t.arrivesAt}`),
    check("port_stay_immobilisation", sql`${t.immobilisationHours} >= 0`),
  ],
);

/** A work order accepted into a port stay's work package, on one day of the stay. */
export const workPackageItem = pgTable(
  "work_package_item",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: companyRef(),
    vesselId: vesselRef(),
    portStayId: uuid()
      .notNull()
      .references(() => portStay.id, { onDelete: "cascade" }),
    workOrderId: uuid()
      .notNull()
      .references(() => workOrder.id, { onDelete: "cascade" }),
    plannedDate: date({ mode: "string" }).notNull(),
    /** Why the work is in the package, in words. */
    reason: text().notNull(),
    position: integer().notNull().default(0),
    createdAt: nowStamp(),
  },
  (t) => [unique().on(t.portStayId, t.workOrderId), index().on(t.companyId, t.workOrderId)],
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

export type RecordedMeasurement = {
  name: string;
  unit: string;
  value: number;
  lower: number | null;
  upper: number | null;
  outOfLimits: boolean;
};

/** The record of a job done: checklist, measurements, counter value, who; approved by the chief. */
export const completion = pgTable(
  "completion",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: companyRef(),
    vesselId: vesselRef(),
    workOrderId: uuid()
      .notNull()
      .references(() => workOrder.id, { onDelete: "cascade" }),
    doneAt: instant().notNull(),
    counterHours: hours(),
    manHours: numeric({ precision: 6, scale: 1, mode: "number" }).notNull(),
    checklist: jsonb().$type<{ step: string; done: boolean }[]>().notNull().default([]),
    measurements: jsonb().$type<RecordedMeasurement[]>().notNull().default([]),
    remarks: text().notNull().default(""),
    doneBy: text().references(() => user.id, { onDelete: "set null" }),
    status: text({ enum: ["awaiting-approval", "approved", "returned"] })
      .notNull()
      .default("awaiting-approval"),
    decidedBy: text().references(() => user.id, { onDelete: "set null" }),
    decidedAt: instant(),
    decisionNote: text(),
    createdAt: nowStamp(),
  },
  (t) => [unique().on(t.workOrderId), index().on(t.companyId, t.vesselId, t.doneAt)],
);

/**
 * A photo or document kept as evidence of a job (the condition found, the job done, a maker's
 * service report). It belongs to the work order: photos are added while the completion form is
 * being filled in, before a completion row exists, and a work order has at most one completion
 * (resubmitted in place), so the work order names it. The bytes live in object storage under
 * `object_key`; the file name is kept for display only.
 */
export const completionAttachment = pgTable(
  "completion_attachment",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: companyRef(),
    vesselId: vesselRef(),
    workOrderId: uuid()
      .notNull()
      .references(() => workOrder.id, { onDelete: "cascade" }),
    /** `<company>/<vessel>/<work order>/<uuid>`: never built from the file name. */
    objectKey: text().notNull(),
    fileName: text().notNull(),
    /** The type the server found in the file's first bytes, not the one the browser sent. */
    contentType: text({ enum: ["image/jpeg", "image/png", "image/webp", "application/pdf"] }).notNull(),
    byteSize: integer().notNull(),
    sha256: text().notNull(),
    caption: text(),
    uploadedBy: text().references(() => user.id, { onDelete: "set null" }),
    uploadedAt: nowStamp(),
  },
  (t) => [
    unique().on(t.objectKey),
    index().on(t.companyId, t.workOrderId, t.uploadedAt),
    check("completion_attachment_caption_length", sql`char_length(${t.caption}) <= 200`),
    check("completion_attachment_size", sql`${t.byteSize} > 0`),
  ],
);
