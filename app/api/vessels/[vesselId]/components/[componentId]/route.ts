import { withAccess } from "@/server/http/with-access";
import { ComponentPatch } from "@/server/register/contract";
import { updateComponent } from "@/server/register/queries";

/** Edits a component; sending `parentId` moves it (null: to the top level). */
export const PATCH = withAccess(
  { permission: "register:edit", vessel: true, body: ComponentPatch },
  ({ access, vessel, params, body }) => updateComponent(access, vessel, params.componentId ?? "", body),
);
