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
  pgEnum,
  pgTable,
  smallint,
  text,
  unique,
  uniqueIndex,
  uuid,
} from "drizzle-orm/pg-core";
import { user } from "./auth";
import { type HeadCount, hours } from "./columns";
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

/** People of a rank on board for maintenance during a stay. */
export type CrewOnBoard = HeadCount;
/** A port watch (cargo, bunkering) of the n-th person of a rank; instants as ISO strings. */
export type PortWatchRow = { rank: string; person: number; from: string; to: string; label: string };

/**
 * A port call: when, the working day on board, when the main engine may be immobilised (a slot in
 * the stay, none when it may not stop), the crew on board per rank, and their port watches.
 */
export const portStay = pgTable(
  "port_stay",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: companyRef(),
    vesselId: vesselRef(),
    port: text().notNull(),
    arrivesAt: instant().notNull(),
    departsAt: instant().notNull(),
    /** Maintenance hours of the ship's day, minutes after midnight: [from, to). */
    workdayFrom: smallint().notNull().default(480),
    workdayTo: smallint().notNull().default(1020),
    engineStopFrom: instant(),
    engineStopTo: instant(),
    crew: jsonb().$type<CrewOnBoard[]>().notNull().default([]),
    watches: jsonb().$type<PortWatchRow[]>().notNull().default([]),
    remarks: text().notNull().default(""),
    packageAcceptedAt: instant(),
    packageAcceptedBy: text().references(() => user.id, { onDelete: "set null" }),
    createdAt: nowStamp(),
    updatedAt: nowStamp(),
  },
  (t) => [
    index().on(t.companyId, t.vesselId, t.arrivesAt),
    check("port_stay_order", sql`${t.departsAt} > ${t.arrivesAt}`),
    check("port_stay_workday", sql`${t.workdayFrom} >= 0 and ${t.workdayFrom} < ${t.workdayTo} and ${t.workdayTo} <= 1440`),
    check(
      "port_stay_engine_stop",
      sql`(${t.engineStopFrom} is null and ${t.engineStopTo} is null) or ${t.engineStopTo} > ${t.engineStopFrom}`,
    ),
  ],
);

/** A work order accepted into a port stay's work package, on the stay's clock. */
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
    /** The ship's day the job starts on (the work order's planned date). */
    plannedDate: date({ mode: "string" }).notNull(),
    startsAt: instant(),
    endsAt: instant(),
    /** Its working periods, split where the working day ends (ISO instants). */
    segments: jsonb().$type<{ from: string; to: string }[]>().notNull().default([]),
    /** Who does it: "rank#n" of the stay's crew. */
    people: jsonb().$type<string[]>().notNull().default([]),
    /** Why the work is in the package, in words. */
    reason: text().notNull(),
    position: integer().notNull().default(0),
    createdAt: nowStamp(),
  },
  (t) => [unique().on(t.portStayId, t.workOrderId), index().on(t.companyId, t.workOrderId)],
);
