// The maintenance plan: tolerance rules and routines (issue 3). Their due work is in
// work-orders.ts, deferrals and port stays in port-stays.ts, completions in completions.ts. Every
// table carries company_id and its indexes start with it.
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
import { type HeadCount, hours } from "./columns";
import { component } from "./machinery";
import { companyRef, instant, nowStamp, vesselRef } from "./refs";

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
    /** Class-survey style: done or open anywhere inside the grace still counts as on time (no `late`). */
    graceOnTime: boolean().notNull().default(false),
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
    /** The routine's own code ("ME.CYL.3/OVERHAUL"), the key of an import; unique on the vessel. */
    code: text(),
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
    /** Who does it: ranks with a head count; `rank` is its first (lead) rank. */
    team: jsonb().$type<HeadCount[]>().notNull().default([]),
    /** Hours the job takes from start to end; man-hours = elapsed × the team's head count. */
    elapsedHours: numeric({ precision: 6, scale: 1, mode: "number" }).notNull().default(1),
    /** Needs the ship in port: shore crane, service engineer, surveyor, parts delivered in port. */
    needsPort: boolean().notNull().default(false),
    needsEngineStop: boolean().notNull().default(false),
    /** Falls due at an event of every port stay instead of (never beside) an interval. */
    portEvent: text({ enum: ["departure", "arrival"] }),
    /** Within how many hours before the departure / after the arrival. */
    portEventHours: numeric({ precision: 5, scale: 1, mode: "number" }),
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
    uniqueIndex("routine_code_on_vessel").on(t.companyId, t.vesselId, t.code),
    check("routine_code_format", sql`${t.code} is null or ${t.code} ~ '^[A-Z0-9][A-Z0-9._/-]{0,59}$'`),
    check(
      "routine_has_interval",
      sql`${t.intervalHours} is not null or ${t.calendarRule} is not null or ${t.portEvent} is not null`,
    ),
    check(
      "routine_port_event",
      sql`(${t.portEvent} is null and ${t.portEventHours} is null) or (${t.portEventHours} > 0 and ${t.intervalHours} is null and ${t.calendarRule} is null)`,
    ),
    check("routine_interval_positive", sql`${t.intervalHours} is null or ${t.intervalHours} > 0`),
  ],
);
