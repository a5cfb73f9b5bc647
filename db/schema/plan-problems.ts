// Routines the due engine could not plan on its last run, with the reason in words: shown to the
// chief engineer on the Routines page instead of a line in the worker's log. Written by each
// recompute of the vessel (server/scheduling/recompute.ts): a routine planned again loses its row.
import { index, pgTable, primaryKey, text, uuid } from "drizzle-orm/pg-core";
import { routine } from "./maintenance";
import { companyRef, nowStamp, vesselRef } from "./refs";

export const routinePlanProblem = pgTable(
  "routine_plan_problem",
  {
    companyId: companyRef(),
    vesselId: vesselRef(),
    routineId: uuid()
      .notNull()
      .references(() => routine.id, { onDelete: "cascade" }),
    reason: text().notNull(),
    /** When the engine first failed to plan it with this reason. */
    since: nowStamp(),
  },
  (t) => [primaryKey({ columns: [t.companyId, t.routineId] }), index().on(t.companyId, t.vesselId)],
);
