import { withAccess } from "@/server/http/with-access";
import { RoutineParams } from "@/server/http/params";
import { loadRoutineTrends } from "@/server/measurements/queries";

/** Each measurement the routine records: its values over the completions, the straight line and where it leads. */
export const GET = withAccess({ permission: "vessel:read", vessel: true, params: RoutineParams }, ({ access, vessel, params }) =>
  loadRoutineTrends(access, vessel, params.routineId),
);
