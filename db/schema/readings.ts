import { sql } from "drizzle-orm";
import { check, index, integer, pgTable, text, unique, uuid } from "drizzle-orm/pg-core";
import { user } from "./auth";
import { hours } from "./columns";
import { counter } from "./machinery";
import { companyRef, instant, nowStamp, vesselRef } from "./refs";

/** A value read off a counter's meter at an instant. `totalHours` = meter + the segment's offset. */
export const reading = pgTable(
  "reading",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: companyRef(),
    vesselId: vesselRef(),
    counterId: uuid()
      .notNull()
      .references(() => counter.id, { onDelete: "cascade" }),
    readAt: instant().notNull(),
    segment: integer().notNull(),
    meterValue: hours().notNull(),
    totalHours: hours().notNull(),
    enteredBy: text().references(() => user.id, { onDelete: "set null" }),
    enteredAt: nowStamp(),
    remark: text(),
  },
  (t) => [
    unique().on(t.counterId, t.readAt),
    index().on(t.companyId, t.counterId, t.readAt.desc()),
    index().on(t.companyId, t.vesselId, t.readAt.desc()),
  ],
);

/**
 * The audit trail of a corrected or removed reading: who, when, the value before and after, and
 * why. The row outlives the reading it describes (a removal deletes the reading; `readingId` then
 * turns null), so it keeps the counter, the instant and the values itself.
 */
export const readingCorrection = pgTable(
  "reading_correction",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: companyRef(),
    vesselId: vesselRef(),
    readingId: uuid().references(() => reading.id, { onDelete: "set null" }),
    counterId: uuid()
      .notNull()
      .references(() => counter.id, { onDelete: "cascade" }),
    readAt: instant().notNull(),
    segment: integer().notNull(),
    kind: text({ enum: ["corrected", "removed"] }).notNull(),
    oldMeterValue: hours().notNull(),
    /** Null for a removal. */
    newMeterValue: hours(),
    oldRemark: text(),
    newRemark: text(),
    reason: text().notNull(),
    correctedBy: text().references(() => user.id, { onDelete: "set null" }),
    correctedAt: nowStamp(),
  },
  (t) => [
    index().on(t.companyId, t.counterId, t.readAt),
    index().on(t.companyId, t.readingId),
    check("reading_correction_new_value", sql`(${t.kind} = 'removed') = (${t.newMeterValue} is null)`),
  ],
);
