import { withAccess } from "@/server/http/with-access";
import { RequisitionInput } from "@/server/parts/contract";
import { createRequisition, listRequisitions } from "@/server/parts/requisitions";

/** The vessel's requisitions, newest first, with the port stays and store locations to use. */
export const GET = withAccess({ permission: "vessel:read", vessel: true }, ({ access, vessel }) => listRequisitions(access, vessel));

/** The chief engineer drafts a requisition of parts for delivery at a port stay. */
export const POST = withAccess({ permission: "work:plan", vessel: true, body: RequisitionInput }, async ({ access, vessel, body }) =>
  Response.json(await createRequisition(access, vessel, body), { status: 201 }),
);
