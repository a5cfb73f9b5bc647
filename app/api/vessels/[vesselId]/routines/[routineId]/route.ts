import { withAccess } from "@/server/http/with-access";
import { RoutinePatch } from "@/server/routines/contract";
import { getRoutine, retireRoutine, updateRoutine } from "@/server/routines/queries";
import { RoutineParams } from "@/server/http/params";

export const GET = withAccess(
  { permission: "vessel:read", vessel: true, params: RoutineParams },
  ({ access, vessel, params }) => getRoutine(access, vessel, params.routineId),
);

/** Edits a routine: only the fields sent change, and the whole routine is checked again. */
export const PATCH = withAccess(
  { permission: "register:edit", vessel: true, body: RoutinePatch, params: RoutineParams },
  ({ access, vessel, params, body }) => updateRoutine(access, vessel, params.routineId, body),
);

/** Retires the routine; its history stays. */
export const DELETE = withAccess(
  { permission: "register:edit", vessel: true, params: RoutineParams },
  ({ access, vessel, params }) => retireRoutine(access, vessel, params.routineId),
);
