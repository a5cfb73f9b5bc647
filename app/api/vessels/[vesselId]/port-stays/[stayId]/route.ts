import { DeleteStayQuery, PortStayPatch } from "@/server/port-stays/contract";
import { deletePortStay, loadPortStay, updatePortStay } from "@/server/port-stays/queries";
import { withAccess } from "@/server/http/with-access";
import { PortStayParams } from "@/server/http/params";

/** A port stay with its accepted work package. */
export const GET = withAccess(
  { permission: "vessel:read", vessel: true, params: PortStayParams },
  ({ access, vessel, params }) => loadPortStay(access, vessel, params.stayId),
);

export const PATCH = withAccess(
  { permission: "work:plan", vessel: true, body: PortStayPatch, params: PortStayParams },
  ({ access, vessel, params, body }) => updatePortStay(access, vessel, params.stayId, body),
);

/** Refused for a stay with an accepted package unless `?releasePackage=true` (see deletePortStay). */
export const DELETE = withAccess(
  { permission: "work:plan", vessel: true, query: DeleteStayQuery, params: PortStayParams },
  ({ access, vessel, params, query }) => deletePortStay(access, vessel, params.stayId, query.releasePackage === "true"),
);
