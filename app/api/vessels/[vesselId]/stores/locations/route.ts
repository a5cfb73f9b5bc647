import { withAccess } from "@/server/http/with-access";
import { LocationInput } from "@/server/parts/contract";
import { createLocation } from "@/server/parts/queries";

/** A new place on board parts are kept: store, rack, bin. */
export const POST = withAccess({ permission: "stores:write", vessel: true, body: LocationInput }, async ({ access, vessel, body }) =>
  Response.json(await createLocation(access, vessel, body), { status: 201 }),
);
