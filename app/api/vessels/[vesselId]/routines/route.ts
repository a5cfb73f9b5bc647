import { withAccess } from "@/server/http/with-access";
import { RoutineInput, RoutineListQuery } from "@/server/routines/contract";
import { createRoutine, listRoutines } from "@/server/routines/queries";

/**
 * The vessel's routines in use as list rows (what the table shows); a routine's whole definition
 * is GET …/routines/[routineId]. `component` narrows to a component and its parts, `q` to text.
 */
export const GET = withAccess(
  { permission: "vessel:read", vessel: true, query: RoutineListQuery },
  ({ access, vessel, query }) => listRoutines(access, vessel, query),
);

/** Adds a routine; the worker then writes its first work order. */
export const POST = withAccess(
  { permission: "register:edit", vessel: true, body: RoutineInput },
  async ({ access, vessel, body }) => Response.json(await createRoutine(access, vessel, body), { status: 201 }),
);
