import { RequisitionParams } from "@/server/http/params";
import { withAccess } from "@/server/http/with-access";
import { RequisitionMoveInput } from "@/server/parts/contract";
import { moveRequisition } from "@/server/parts/requisitions";

/** Sent by the chief engineer, ordered by the office, cancelled by whoever holds it (checked inside). */
export const POST = withAccess(
  { permission: "vessel:read", vessel: true, params: RequisitionParams, body: RequisitionMoveInput },
  ({ access, vessel, params, body }) => moveRequisition(access, vessel, params.requisitionId, body),
);
