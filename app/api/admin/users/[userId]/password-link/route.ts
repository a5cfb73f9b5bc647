import { sendPersonPasswordLink } from "@/server/admin/people-queries";
import { withAccess } from "@/server/http/with-access";
import { UserParams } from "@/server/http/params";

/** E-mails the person a one-time link to choose a password: the invitation again, or a reset. */
export const POST = withAccess({ permission: "company:manage", params: UserParams }, ({ access, params }) =>
  sendPersonPasswordLink(access, params.userId),
);
