// Postponing due work and planning it into a port call: deferral requests, port stays and their
// accepted work packages. Every table carries company_id and its indexes start with it.
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
import { companyRef, instant, nowStamp, vesselRef } from "./refs";
import { workOrder } from "./work-orders";

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
    uniqueIndex("deferral_one_pending")
      .on(t.workOrderId)
      .where(sql`${t.status} = 'pending'`),
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
