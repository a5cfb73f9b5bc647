import { withAccess } from "@/server/http/with-access";
import { MovementInput } from "@/server/parts/contract";
import { recordMovement } from "@/server/parts/queries";

/** Parts received, counted or moved between locations on board: each a movement of its own. */
export const POST = withAccess({ permission: "stores:write", vessel: true, body: MovementInput }, async ({ access, vessel, body }) =>
  Response.json(await recordMovement(access, vessel, body), { status: 201 }),
);
