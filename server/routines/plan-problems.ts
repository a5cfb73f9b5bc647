import "server-only";
import { and, asc, eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { component, routine, routinePlanProblem } from "@/db/schema";
import type { RoutinePlanProblem } from "./contract";

/** Every routine of the vessel the due engine could not plan on its last run, by component code. */
export async function loadPlanProblems(db: Db, companyId: string, vesselId: string): Promise<RoutinePlanProblem[]> {
  const rows = await db
    .select({
      id: routine.id,
      title: routine.title,
      componentCode: component.code,
      reason: routinePlanProblem.reason,
      since: routinePlanProblem.since,
    })
    .from(routinePlanProblem)
    .innerJoin(routine, eq(routine.id, routinePlanProblem.routineId))
    .innerJoin(component, eq(component.id, routine.componentId))
    .where(and(eq(routinePlanProblem.companyId, companyId), eq(routinePlanProblem.vesselId, vesselId)))
    .orderBy(asc(component.code), asc(routine.title));
  return rows.map((r) => ({ ...r, since: r.since.toISOString() }));
}
