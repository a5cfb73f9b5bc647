import { withAccess } from "@/server/http/with-access";
import { ComponentPatch } from "@/server/register/contract";
import { updateComponent } from "@/server/register/queries";
import { ComponentParams } from "@/server/http/params";

/** Edits a component; sending `parentId` moves it (null: to the top level). */
export const PATCH = withAccess(
  { permission: "register:edit", vessel: true, body: ComponentPatch, params: ComponentParams },
  ({ access, vessel, params, body }) => updateComponent(access, vessel, params.componentId, body),
);
