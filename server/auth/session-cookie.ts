// better-auth's session cookie, read without better-auth: `<token>.<signature>`, URL-encoded, the
// signature an HMAC-SHA256 of the token with the auth secret in base64 (better-call's signed
// cookie). Pure, so it is tested beside the file.
import { createHmac, timingSafeEqual } from "node:crypto";

/**
 * The session token from better-auth's cookie, or null when it is absent or its signature (an
 * HMAC-SHA256 over the token with the auth secret, base64) does not match.
 */
export function verifiedSessionToken(cookieHeader: string | null, cookieName: string, secret: string): string | null {
  if (!cookieHeader) return null;
  const raw = cookieHeader
    .split(";")
    .map((part) => part.trim())
    .find((part) => part.startsWith(`${cookieName}=`))
    ?.slice(cookieName.length + 1);
  if (!raw) return null;
  let value: string;
  try {
    value = decodeURIComponent(raw);
  } catch {
    return null;
  }
  const dot = value.lastIndexOf(".");
  if (dot < 1) return null;
  const token = value.slice(0, dot);
  const given = Buffer.from(value.slice(dot + 1), "base64");
  const expected = createHmac("sha256", secret).update(token).digest();
  return given.length === expected.length && timingSafeEqual(given, expected) ? token : null;
}
