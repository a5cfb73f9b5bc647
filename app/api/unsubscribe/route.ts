import { z } from "zod";
import { getDb } from "@/db/client";
import { invalidInput } from "@/server/http/problem";
import { withToken } from "@/server/http/with-access";
import { appUrl, verifyUnsubscribe } from "@/server/mail/links";
import { optOut } from "@/server/mail/opt-out";

const UnsubscribeQuery = z.object({
  u: z.string({ error: "The link names no person." }).min(1, "The link names no person."),
  c: z.string({ error: "The link names no company." }).min(1, "The link names no company."),
  k: z.string({ error: "The link names no kind of message." }).min(1, "The link names no kind of message."),
  t: z.string({ error: "The link carries no token." }).min(1, "The link carries no token."),
});

// RFC 8058 one-click clients send `List-Unsubscribe=One-Click`; the page's button sends nothing.
const UnsubscribeBody = z.looseObject({ "List-Unsubscribe": z.literal("One-Click").optional() });

/**
 * One-click unsubscribe, public: the link's HMAC token is the proof (no session). A browser's
 * form gets a 303 back to the page, which then says what stopped; anyone else gets JSON.
 */
export const POST = withToken({ query: UnsubscribeQuery, body: UnsubscribeBody }, async ({ request, query }) => {
  const target = verifyUnsubscribe(query);
  if (!target) {
    throw invalidInput([
      {
        field: "query.t",
        message:
          "This unsubscribe link is not valid: it may have been cut short or changed. Use the link in the latest message, or ask your company administrator.",
      },
    ]);
  }
  const view = await optOut(getDb(), target);
  if (request.headers.get("accept")?.includes("text/html")) {
    const back = new URLSearchParams({ ...query, done: "1" });
    return Response.redirect(appUrl(`/unsubscribe?${back}`), 303);
  }
  return { unsubscribed: true, kind: view.kind, kindLabel: view.kindLabel };
});
