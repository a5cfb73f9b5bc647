import { withAccess } from "@/server/http/with-access";

/** Who is signed in: name, company, role and the vessels they may open (null: every vessel). */
export const GET = withAccess({ permission: "vessel:read" }, async ({ access }) => ({
  user: access.user,
  company: access.company,
  role: access.role,
  assignedVesselIds: access.assignedVesselIds,
}));
