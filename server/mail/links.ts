import "server-only";
import { createHmac, timingSafeEqual } from "node:crypto";
import { mailKind } from "@/db/schema";
import { isAccountKind, type MailKind } from "./outbox";

/** The app's public address: KEELSON_APP_URL, else BETTER_AUTH_URL (what people type in). */
function appBase(): string {
  return process.env.KEELSON_APP_URL ?? process.env.BETTER_AUTH_URL ?? "http://127.0.0.1:3000";
}

/** An absolute link into the app, for a message read outside it. */
export function appUrl(path: string): string {
  return new URL(path, appBase()).toString();
}

function secret(): string {
  const value = process.env.BETTER_AUTH_SECRET;
  if (!value) throw new Error("BETTER_AUTH_SECRET is not set: unsubscribe links cannot be signed");
  return value;
}

/** HMAC-SHA256 over user, company and kind: a link for one kind cannot be turned into another. */
export function unsubscribeToken(userId: string, companyId: string, kind: MailKind): string {
  return createHmac("sha256", secret()).update(`unsubscribe\n${userId}\n${companyId}\n${kind}`).digest("base64url");
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
