import { VesselPatch } from "@/server/admin/contract";
import { retireVessel, updateVessel } from "@/server/admin/queries";
import { withAccess } from "@/server/http/with-access";

// `vessel: true` makes another company's vessel id a 404; an administrator sees every vessel of theirs.

export const PATCH = withAccess(
  { permission: "company:manage", vessel: true, body: VesselPatch },
  ({ access, vessel, body }) => updateVessel(access, vessel.id, body),
);

/** Retires the vessel: its records stay, it leaves the vessel lists. */
export const DELETE = withAccess({ permission: "company:manage", vessel: true }, ({ access, vessel }) =>
  retireVessel(access, vessel.id),
);
