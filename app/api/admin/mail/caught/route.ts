import { withAccess } from "@/server/http/with-access";
import { clearCaughtMail } from "@/server/mail/admin";

/** Clears the company's own messages from the local mail catcher (development only: 404 where mail goes to a relay). */
export const DELETE = withAccess({ permission: "company:manage" }, ({ access }) => clearCaughtMail(access));
