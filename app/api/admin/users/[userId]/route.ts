import { UserPatch } from "@/server/admin/contract";
import { updatePerson } from "@/server/admin/people-queries";
import { withAccess } from "@/server/http/with-access";
import { UserParams } from "@/server/http/params";

/** Name, role, rank, assignments, disabling and password reset; a person of another company is 404. */
export const PATCH = withAccess(
  { permission: "company:manage", body: UserPatch, params: UserParams },
  ({ access, params, body }) => updatePerson(access, params.userId, body),
);
