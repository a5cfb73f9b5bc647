import { withAccess } from "@/server/http/with-access";
import { RoutineCopyInput } from "@/server/routines/contract";
import { copyRoutine, copyTargets } from "@/server/routines/copies";
import { RoutineParams } from "@/server/http/params";

/** The components the routine may be copied to. */
export const GET = withAccess(
  { permission: "register:edit", vessel: true, params: RoutineParams },
  ({ access, vessel, params }) => copyTargets(access, vessel, params.routineId),
);

export const POST = withAccess(
  { permission: "register:edit", vessel: true, body: RoutineCopyInput, params: RoutineParams },
  async ({ access, vessel, params, body }) =>
    Response.json(await copyRoutine(access, vessel, params.routineId, body.componentIds), { status: 201 }),
);
