import { DeferralRequestInput } from "@/server/deferrals/contract";
import { loadWorkOrderDeferralHistory } from "@/server/deferrals/queries";
import { requestDeferral } from "@/server/deferrals/request";
import { withAccess } from "@/server/http/with-access";
import { WorkOrderParams } from "@/server/http/params";

/** A work order's deferral requests, newest first, with who asked, who decided and why. */
export const GET = withAccess(
  { permission: "vessel:read", vessel: true, params: WorkOrderParams },
  async ({ access, vessel, params }) => ({
    deferrals: await loadWorkOrderDeferralHistory(access, vessel, params.workOrderId),
  }),
);

/** The chief engineer asks to postpone the work order's limit. */
export const POST = withAccess(
  { permission: "work:plan", vessel: true, body: DeferralRequestInput, params: WorkOrderParams },
  async ({ access, vessel, params, body }) =>
    Response.json(await requestDeferral(access, vessel, params.workOrderId, body), { status: 201 }),
);
