import { RequisitionParams } from "@/server/http/params";
import { withAccess } from "@/server/http/with-access";
import { ReceiptInput } from "@/server/parts/contract";
import { receiveRequisition } from "@/server/parts/requisitions";

/** Parts delivered against the requisition, received into the stores line by line. */
export const POST = withAccess(
  { permission: "stores:write", vessel: true, params: RequisitionParams, body: ReceiptInput },
  ({ access, vessel, params, body }) => receiveRequisition(access, vessel, params.requisitionId, body),
);
