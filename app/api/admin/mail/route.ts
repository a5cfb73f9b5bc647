import { withAccess } from "@/server/http/with-access";
import { loadAdminMail } from "@/server/mail/admin";

/** The company's outbox, and the messages the local mail fake caught (development). */
export const GET = withAccess({ permission: "company:manage" }, ({ access }) => loadAdminMail(access));
