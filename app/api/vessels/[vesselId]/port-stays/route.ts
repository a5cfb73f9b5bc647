import { PortStayInput } from "@/server/port-stays/contract";
import { createPortStay, listPortStays } from "@/server/port-stays/queries";
import { withAccess } from "@/server/http/with-access";

/** The vessel's port stays still to come and the latest past ones. */
export const GET = withAccess({ permission: "vessel:read", vessel: true }, ({ access, vessel }) =>
  listPortStays(access, vessel),
);

export const POST = withAccess(
  { permission: "work:plan", vessel: true, body: PortStayInput },
  async ({ access, vessel, body }) => Response.json(await createPortStay(access, vessel, body), { status: 201 }),
);
