import "server-only";
import { createHmac, timingSafeEqual } from "node:crypto";
import { mailKind } from "@/db/schema";
import { env } from "@/server/env";
import { isAccountKind, type MailKind } from "./outbox";

/** The app's public address: KEELSON_APP_URL, else BETTER_AUTH_URL (what people type in). */
function appBase(): string {
  const { KEELSON_APP_URL, BETTER_AUTH_URL } = env();
  return KEELSON_APP_URL ?? BETTER_AUTH_URL;
}

/** An absolute link into the app, for a message read outside it. */
export function appUrl(path: string): string {
  return new URL(path, appBase()).toString();
}

/** HMAC-SHA256 over user, company and kind: a link for one kind cannot be turned into another. */
export function unsubscribeToken(userId: string, companyId: string, kind: MailKind): string {
  return createHmac("sha256", env().BETTER_AUTH_SECRET)
    .update(`unsubscribe\n${userId}\n${companyId}\n${kind}`)
    .digest("base64url");
}

export function unsubscribeUrl(userId: string, companyId: string, kind: MailKind): string {
  const params = new URLSearchParams({
    u: userId,
    c: companyId,
    k: kind,
    t: unsubscribeToken(userId, companyId, kind),
  });
  return appUrl(`/unsubscribe?${params}`);
}

export type UnsubscribeParams = { u?: unknown; c?: unknown; k?: unknown; t?: unknown };
export type UnsubscribeTarget = { userId: string; companyId: string; kind: MailKind };

/** The link's user, company and kind when its token is genuine, else null (timing-safe compare). */
export function verifyUnsubscribe(params: UnsubscribeParams): UnsubscribeTarget | null {
  const { u, c, k, t } = params;
  if (typeof u !== "string" || typeof c !== "string" || typeof k !== "string" || typeof t !== "string") return null;
  if (!u || !c || !t) return null;
  const kind = mailKind.enumValues.find((value) => value === k);
  // Account messages carry no unsubscribe link, so a token for one is never genuine.
  if (!kind || isAccountKind(kind)) return null;
  const expected = Buffer.from(unsubscribeToken(u, c, kind));
  const given = Buffer.from(t);
  if (given.length !== expected.length || !timingSafeEqual(given, expected)) return null;
  return { userId: u, companyId: c, kind };
}

/** The address an RFC 8058 mail client POSTs to (List-Unsubscribe header): the route, not the page. */
export function oneClickUnsubscribeUrl(userId: string, companyId: string, kind: MailKind): string {
  const params = new URLSearchParams({
    u: userId,
    c: companyId,
    k: kind,
    t: unsubscribeToken(userId, companyId, kind),
  });
  return appUrl(`/api/unsubscribe?${params}`);
}
