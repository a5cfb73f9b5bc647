// The record of work done: completions and the photos and documents kept as their evidence.
// Every table carries company_id and its indexes start with it.
import { sql } from "drizzle-orm";
import { check, index, integer, jsonb, numeric, pgTable, text, unique, uuid } from "drizzle-orm/pg-core";
import { user } from "./auth";
import { hours } from "./columns";
import { companyRef, instant, nowStamp, vesselRef } from "./refs";
import { workOrder } from "./work-orders";

export type RecordedMeasurement = {
  name: string;
  unit: string;
  value: number;
  lower: number | null;
  upper: number | null;
  outOfLimits: boolean;
};

export type WorkedBy = { rank: string; name: string };

/** A part used on the job, as recorded (the stock movements are the stores' side of it). */
export type UsedPart = { partId: string; number: string; description: string; unit: string; quantity: number };

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
    /** Who recorded it in Keelson. */
    doneBy: text().references(() => user.id, { onDelete: "set null" }),
    /** Who answers for the job (often the chief engineer), apart from the people who did it. */
    responsibleId: text().references(() => user.id, { onDelete: "set null" }),
    /** The people who did the work, by rank and name (crew need not be Keelson users). */
    workedBy: jsonb().$type<WorkedBy[]>().notNull().default([]),
    /** The parts used, taken from the stores on board when recorded and put back when returned. */
    partsUsed: jsonb().$type<UsedPart[]>().notNull().default([]),
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
