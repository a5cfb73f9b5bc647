import { PortStayParams } from "@/server/http/params";
import { withAccess } from "@/server/http/with-access";
import { StayPartsQuery } from "@/server/parts/contract";
import { stayParts } from "@/server/parts/requisitions";

/** The parts the stay's jobs need against what is on board and already asked for. */
export const GET = withAccess(
  { permission: "vessel:read", vessel: true, params: PortStayParams, query: StayPartsQuery },
  ({ access, vessel, params, query }) => stayParts(access, vessel, params.stayId, query),
);
