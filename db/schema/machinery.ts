// The machinery register: counters (hour meters, with their meter segments) and the component tree.
import { sql } from "drizzle-orm";
import {
  type AnyPgColumn,
  boolean,
  check,
  doublePrecision,
  index,
  integer,
  numeric,
  pgTable,
  text,
  unique,
  uuid,
} from "drizzle-orm/pg-core";
import { user } from "./auth";
import { hours } from "./columns";
import { companyRef, instant, nowStamp, vesselRef } from "./refs";

export const counter = pgTable(
  "counter",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: companyRef(),
    vesselId: vesselRef(),
    name: text().notNull(),
    /** Planned running hours per day, used where reading history is too short for a rate. */
    plannedHoursPerDay: numeric({ precision: 4, scale: 1, mode: "number" }).notNull().default(12),
    /** The meter fitted now; a replacement starts a new segment. */
    currentSegment: integer().notNull().default(1),
    sortOrder: integer().notNull().default(0),
    /** Written by the worker: hours per day over the look-back, or the planned rate, at full precision (shown rounded). */
    runningRate: doublePrecision(),
    rateBasis: text({ enum: ["measured", "planned"] }),
    rateComputedAt: instant(),
    createdAt: nowStamp(),
    retiredAt: instant(),
  },
  (t) => [
    unique().on(t.companyId, t.vesselId, t.name),
    index().on(t.companyId, t.vesselId, t.sortOrder),
    check("counter_planned_rate", sql`${t.plannedHoursPerDay} between 0 and 24`),
  ],
);

/**
 * One physical meter of a counter. `offsetHours` is added to what the meter shows so the
 * counter's total stays continuous across a replacement.
 */
export const counterSegment = pgTable(
  "counter_segment",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: companyRef(),
    counterId: uuid()
      .notNull()
      .references(() => counter.id, { onDelete: "cascade" }),
    segment: integer().notNull(),
    startedAt: instant().notNull(),
    /** Meter value of the new meter when fitted. */
    startMeter: hours().notNull().default(0),
    offsetHours: hours().notNull(),
    reason: text(),
    createdBy: text().references(() => user.id, { onDelete: "set null" }),
    createdAt: nowStamp(),
  },
  (t) => [unique().on(t.counterId, t.segment), index().on(t.companyId, t.counterId)],
);

export const component = pgTable(
  "component",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: companyRef(),
    vesselId: vesselRef(),
    parentId: uuid().references((): AnyPgColumn => component.id, { onDelete: "restrict" }),
    code: text().notNull(),
    name: text().notNull(),
    critical: boolean().notNull().default(false),
    classItemRef: text(),
    /** Its own counter; null means it uses the nearest ancestor's. */
    counterId: uuid().references(() => counter.id, { onDelete: "set null" }),
    maker: text(),
    model: text(),
    sortOrder: integer().notNull().default(0),
    createdAt: nowStamp(),
    updatedAt: nowStamp(),
  },
  (t) => [
    unique().on(t.companyId, t.vesselId, t.code),
    index().on(t.companyId, t.vesselId, t.parentId),
    check("component_code_format", sql`${t.code} ~ '^[A-Z0-9][A-Z0-9._-]{0,39}$'`),
    check("component_not_own_parent", sql`${t.parentId} is distinct from ${t.id}`),
  ],
);
