import { index, integer, pgTable, text, unique, uuid } from "drizzle-orm/pg-core";
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
