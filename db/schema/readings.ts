import { index, integer, pgTable, text, timestamp, unique, uuid } from "drizzle-orm/pg-core";
import { user } from "./auth";
import { hours } from "./columns";
import { counter } from "./machinery";
import { company, vessel } from "./tenancy";


/** A value read off a counter's meter at an instant. `totalHours` = meter + the segment's offset. */
export const reading = pgTable(
  "reading",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: uuid()
      .notNull()
      .references(() => company.id, { onDelete: "cascade" }),
    vesselId: uuid()
      .notNull()
      .references(() => vessel.id, { onDelete: "cascade" }),
    counterId: uuid()
      .notNull()
      .references(() => counter.id, { onDelete: "cascade" }),
    readAt: timestamp({ withTimezone: true }).notNull(),
    segment: integer().notNull(),
    meterValue: hours().notNull(),
    totalHours: hours().notNull(),
    enteredBy: text().references(() => user.id, { onDelete: "set null" }),
    enteredAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    remark: text(),
  },
  (t) => [
    unique().on(t.counterId, t.readAt),
    index().on(t.companyId, t.counterId, t.readAt.desc()),
    index().on(t.companyId, t.vesselId, t.readAt.desc()),
  ],
);
