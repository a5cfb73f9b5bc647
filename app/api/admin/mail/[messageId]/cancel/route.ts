import { withAccess } from "@/server/http/with-access";
import { cancelMail } from "@/server/mail/admin";
import { MessageParams } from "@/server/http/params";

/** Stops a waiting or failed message from being sent. */
export const POST = withAccess({ permission: "company:manage", params: MessageParams }, ({ access, params }) =>
  cancelMail(access, params.messageId),
);
