// The worker's daily figures of each vessel (issue 5): the Fleet board's trend reads these rows.
import { date, index, integer, numeric, pgTable, unique, uuid } from "drizzle-orm/pg-core";
import { companyRef, instant, nowStamp, vesselRef } from "./refs";

export const vesselSnapshot = pgTable(
  "vessel_snapshot",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: companyRef(),
    vesselId: vesselRef(),
    /** The UTC day the figures stand for; one row a vessel a day (a rerun replaces it). */
    day: date({ mode: "string" }).notNull(),
    scheduled: integer().notNull().default(0),
    windowOpen: integer().notNull().default(0),
    late: integer().notNull().default(0),
    outOfTolerance: integer().notNull().default(0),
    deferred: integer().notNull().default(0),
    criticalLate: integer().notNull().default(0),
    criticalOutOfTolerance: integer().notNull().default(0),
    classLate: integer().notNull().default(0),
    classOutOfTolerance: integer().notNull().default(0),
    pendingDeferrals: integer().notNull().default(0),
    lastReadingAt: instant(),
    /** Completions of the last 90 days, and the share of them done before their grace ended. */
    completed90: integer().notNull().default(0),
    onTimeRate: numeric({ precision: 5, scale: 4, mode: "number" }),
    takenAt: nowStamp(),
  },
  (t) => [unique().on(t.vesselId, t.day), index().on(t.companyId, t.day)],
);
