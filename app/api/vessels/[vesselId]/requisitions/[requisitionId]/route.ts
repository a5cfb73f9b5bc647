import { RequisitionParams } from "@/server/http/params";
import { withAccess } from "@/server/http/with-access";
import { RequisitionPatch } from "@/server/parts/contract";
import { updateRequisition } from "@/server/parts/requisitions";

/** A draft changed before it is sent: its port stay, note or lines. */
export const PATCH = withAccess(
  { permission: "work:plan", vessel: true, params: RequisitionParams, body: RequisitionPatch },
  ({ access, vessel, params, body }) => updateRequisition(access, vessel, params.requisitionId, body),
);
