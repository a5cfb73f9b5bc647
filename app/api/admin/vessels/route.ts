import { VesselInput } from "@/server/admin/contract";
import { createVessel, listCompanyVessels } from "@/server/admin/queries";
import { withAccess } from "@/server/http/with-access";

/** Every vessel of the company, retired ones last, with its counters and assigned people. */
export const GET = withAccess({ permission: "company:manage" }, async ({ access }) => ({
  vessels: await listCompanyVessels(access),
}));

export const POST = withAccess({ permission: "company:manage", body: VesselInput }, async ({ access, body }) =>
  Response.json(await createVessel(access, body), { status: 201 }),
);
