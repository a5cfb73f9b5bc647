import { withAccess } from "@/server/http/with-access";
import { cancelMail } from "@/server/mail/admin";

/** Stops a waiting or failed message from being sent. */
export const POST = withAccess({ permission: "company:manage" }, ({ access, params }) =>
  cancelMail(access, params.messageId ?? ""),
);
