import { withAccess } from "@/server/http/with-access";
import { retryMail } from "@/server/mail/admin";
import { MessageParams } from "@/server/http/params";

/** Puts a failed or waiting message back in the queue, due now; the worker tries it at once. */
export const POST = withAccess({ permission: "company:manage", params: MessageParams }, ({ access, params }) =>
  retryMail(access, params.messageId),
);
