import { withAccess } from "@/server/http/with-access";
import { ComponentInput } from "@/server/register/contract";
import { createComponent } from "@/server/register/queries";

/** Adds a component to the register, at the top level or under `parentId`. */
export const POST = withAccess(
  { permission: "register:edit", vessel: true, body: ComponentInput },
  async ({ access, vessel, body }) => Response.json(await createComponent(access, vessel, body), { status: 201 }),
);
