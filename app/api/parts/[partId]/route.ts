import { withAccess } from "@/server/http/with-access";
import { PartParams } from "@/server/http/params";
import { PartPatch } from "@/server/parts/contract";
import { updatePart } from "@/server/parts/queries";

/** Changes a part of the catalogue: number, description, unit, critical, minimum, the components it fits. */
export const PATCH = withAccess({ permission: "parts:edit", params: PartParams, body: PartPatch }, async ({ access, params, body }) =>
  updatePart(access, params.partId, body),
);
