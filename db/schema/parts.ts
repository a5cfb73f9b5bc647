// Spare parts (issue 13): the company's catalogue, the store locations on board, and every movement
// of stock as its own row — received, used on a work order, counted, moved between locations — so
// that what is on board is always the sum of its movements and nothing is edited in place.
import { sql } from "drizzle-orm";
import { boolean, check, index, integer, numeric, pgTable, text, unique, uuid, type AnyPgColumn } from "drizzle-orm/pg-core";
import { user } from "./auth";
import { component } from "./machinery";
import { companyRef, instant, nowStamp, vesselRef } from "./refs";
import { routine } from "./maintenance";
import { workOrder } from "./work-orders";
import { portStay } from "./port-stays";

export const PART_UNITS = ["piece", "set", "litre", "kg", "metre"] as const;
export type PartUnit = (typeof PART_UNITS)[number];

/** A quantity: whole pieces and sets, or litres, kilograms and metres to three decimals. */
const quantity = () => numeric({ precision: 12, scale: 3, mode: "number" });

/** One part of the company's catalogue, by the company's own part number. */
export const part = pgTable(
  "part",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: companyRef(),
    /** The company's part number ("KP-10432"), the key people use. */
    number: text().notNull(),
    /** The maker's reference, as on the maker's parts list. */
    makerRef: text(),
    description: text().notNull(),
    unit: text({ enum: PART_UNITS }).notNull().default("piece"),
    /** A critical spare: the maker's or class's recommendation to keep some on board. */
    critical: boolean().notNull().default(false),
    /** The least to keep on board of each vessel it is stocked on, entered by the company. */
    minimumOnBoard: quantity().notNull().default(0),
    createdAt: nowStamp(),
    updatedAt: nowStamp(),
  },
  (t) => [
    unique().on(t.companyId, t.number),
    check("part_minimum", sql`${t.minimumOnBoard} >= 0`),
    check("part_number_format", sql`${t.number} ~ '^[A-Za-z0-9][A-Za-z0-9._/-]{0,39}$'`),
  ],
);

/** The components a part fits (many to many; a component belongs to one vessel). */
export const partFit = pgTable(
  "part_fit",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: companyRef(),
    partId: uuid()
      .notNull()
      .references(() => part.id, { onDelete: "cascade" }),
    componentId: uuid()
      .notNull()
      .references(() => component.id, { onDelete: "cascade" }),
  },
  (t) => [unique().on(t.partId, t.componentId), index().on(t.companyId, t.componentId)],
);

/** A place on board parts are kept: the store, and within it a rack and a bin. */
export const storeLocation = pgTable(
  "store_location",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: companyRef(),
    vesselId: vesselRef(),
    store: text().notNull(),
    rack: text().notNull().default(""),
    bin: text().notNull().default(""),
    createdAt: nowStamp(),
  },
  (t) => [unique().on(t.companyId, t.vesselId, t.store, t.rack, t.bin)],
);

export const STOCK_MOVES = ["received", "used", "counted", "moved-out", "moved-in", "returned"] as const;
export type StockMove = (typeof STOCK_MOVES)[number];

/**
 * One movement of a part at a location on board, signed: + in, − out. A count correction is the
 * difference between what was counted and what the movements said, with the reason.
 */
export const stockMovement = pgTable(
  "stock_movement",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: companyRef(),
    vesselId: vesselRef(),
    partId: uuid()
      .notNull()
      .references(() => part.id, { onDelete: "restrict" }),
    locationId: uuid()
      .notNull()
      .references(() => storeLocation.id, { onDelete: "restrict" }),
    kind: text({ enum: STOCK_MOVES }).notNull(),
    quantity: quantity().notNull(),
    /** The job a part was used on (or returned from). */
    workOrderId: uuid().references(() => workOrder.id, { onDelete: "set null" }),
    /** The two rows of a move between locations share it. */
    moveId: uuid(),
    /** The requisition line a delivery was received against. */
    requisitionLineId: uuid().references((): AnyPgColumn => requisitionLine.id, { onDelete: "set null" }),
    reason: text().notNull().default(""),
    movedBy: text().references(() => user.id, { onDelete: "set null" }),
    movedAt: instant().notNull().defaultNow(),
  },
  (t) => [
    index().on(t.companyId, t.vesselId, t.partId),
    index().on(t.companyId, t.vesselId, t.movedAt),
    check("stock_movement_sign", sql`(${t.kind} in ('received', 'moved-in', 'returned') and ${t.quantity} > 0)
      or (${t.kind} in ('used', 'moved-out') and ${t.quantity} < 0)
      or (${t.kind} = 'counted' and ${t.quantity} <> 0)`),
  ],
);

/** The parts a routine needs each time it is done, with quantities (a bolt set renewed, a litre of sealant). */
export const routinePart = pgTable(
  "routine_part",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: companyRef(),
    routineId: uuid()
      .notNull()
      .references(() => routine.id, { onDelete: "cascade" }),
    partId: uuid()
      .notNull()
      .references(() => part.id, { onDelete: "restrict" }),
    quantity: quantity().notNull(),
  },
  (t) => [unique().on(t.routineId, t.partId), index().on(t.companyId, t.partId), check("routine_part_quantity", sql`${t.quantity} > 0`)],
);

export const REQUISITION_STATES = ["drafted", "sent", "ordered", "delivered", "cancelled"] as const;
export type RequisitionState = (typeof REQUISITION_STATES)[number];

/**
 * Parts asked of the office for delivery at a port stay: drafted on board, sent, ordered by the
 * office, delivered (received into the stores line by line), or cancelled.
 */
export const requisition = pgTable(
  "requisition",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: companyRef(),
    vesselId: vesselRef(),
    /** "RQ-ALPHA-0007": the vessel's code and its own sequence. */
    number: text().notNull(),
    /** Where the parts are to be delivered. */
    portStayId: uuid().references(() => portStay.id, { onDelete: "set null" }),
    state: text({ enum: REQUISITION_STATES }).notNull().default("drafted"),
    note: text().notNull().default(""),
    /** The office's purchase order, when ordered. */
    orderRef: text().notNull().default(""),
    createdBy: text().references(() => user.id, { onDelete: "set null" }),
    createdAt: nowStamp(),
    sentAt: instant(),
    orderedAt: instant(),
    deliveredAt: instant(),
    cancelledAt: instant(),
    updatedAt: nowStamp(),
  },
  (t) => [unique().on(t.companyId, t.number), index().on(t.companyId, t.vesselId, t.state)],
);

/** One part asked for, with why (short for a job of the stay, under its minimum). */
export const requisitionLine = pgTable(
  "requisition_line",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: companyRef(),
    requisitionId: uuid()
      .notNull()
      .references(() => requisition.id, { onDelete: "cascade" }),
    partId: uuid()
      .notNull()
      .references(() => part.id, { onDelete: "restrict" }),
    quantity: quantity().notNull(),
    reason: text().notNull().default(""),
    position: integer().notNull().default(0),
  },
  (t) => [unique().on(t.requisitionId, t.partId), index().on(t.companyId, t.partId), check("requisition_line_quantity", sql`${t.quantity} > 0`)],
);
