import { loadWorkOrderDetail } from "@/server/completions/queries";
import { withAccess } from "@/server/http/with-access";
import { WorkOrderParams } from "@/server/http/params";

/** A work order with its routine, counter, completion and the component's earlier work. */
export const GET = withAccess(
  { permission: "vessel:read", vessel: true, params: WorkOrderParams },
  ({ access, vessel, params }) => loadWorkOrderDetail(access, vessel, params.workOrderId),
);
