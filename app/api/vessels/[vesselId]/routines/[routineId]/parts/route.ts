import { withAccess } from "@/server/http/with-access";
import { RoutineParams } from "@/server/http/params";
import { RoutinePartsInput } from "@/server/parts/contract";
import { getRoutineParts, setRoutineParts } from "@/server/parts/queries";

/** The parts the routine needs each time, with their quantities. */
export const GET = withAccess({ permission: "vessel:read", vessel: true, params: RoutineParams }, ({ access, vessel, params }) =>
  getRoutineParts(access, vessel, params.routineId),
);

/** The parts the routine needs each time it is done, with quantities: the whole list, replaced. */
export const PUT = withAccess(
  { permission: "register:edit", vessel: true, params: RoutineParams, body: RoutinePartsInput },
  ({ access, vessel, params, body }) => setRoutineParts(access, vessel, params.routineId, body.parts),
);
