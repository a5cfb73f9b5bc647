import { UserPatch } from "@/server/admin/contract";
import { updatePerson } from "@/server/admin/people-queries";
import { withAccess } from "@/server/http/with-access";

/** Name, role, rank, assignments, disabling and password reset; a person of another company is 404. */
export const PATCH = withAccess({ permission: "company:manage", body: UserPatch }, ({ access, params, body }) =>
  updatePerson(access, params.userId ?? "", body),
);
