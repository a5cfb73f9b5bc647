import { withAccess } from "@/server/http/with-access";
import { FleetRequisitionsQuery } from "@/server/parts/contract";
import { fleetRequisitions } from "@/server/parts/requisitions";

/** The requisitions of every vessel the person sees (open ones unless `?state=all`). */
export const GET = withAccess({ permission: "vessel:read", query: FleetRequisitionsQuery }, async ({ access, query }) => ({
  requisitions: await fleetRequisitions(access, query.state),
}));
