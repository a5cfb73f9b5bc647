// The signed session cookie as better-auth writes it (better-call's `signCookieValue`: the value,
// a dot, base64 HMAC-SHA256 of the value with the secret, all URL-encoded).
import { createHmac } from "node:crypto";
import { describe, expect, it } from "vitest";
import { verifiedSessionToken } from "./session-cookie";

const SECRET = "a-test-secret-of-some-length-0123456789";
const NAME = "better-auth.session_token";
const signed = (token: string, secret = SECRET) =>
  encodeURIComponent(`${token}.${createHmac("sha256", secret).update(token).digest("base64")}`);

describe("verifiedSessionToken", () => {
  it("gives the token of a cookie signed with the secret, among other cookies", () => {
    const header = `theme=dark; ${NAME}=${signed("tok_ABC123")}; other=1`;
    expect(verifiedSessionToken(header, NAME, SECRET)).toBe("tok_ABC123");
  });

  it("refuses a cookie signed with another secret, or with its token changed", () => {
    expect(verifiedSessionToken(`${NAME}=${signed("tok_ABC123", "another-secret")}`, NAME, SECRET)).toBeNull();
    const tampered = signed("tok_ABC123").replace("tok_ABC123", "tok_ABC124");
    expect(verifiedSessionToken(`${NAME}=${tampered}`, NAME, SECRET)).toBeNull();
  });

  it("refuses what is not a signed cookie at all", () => {
    for (const header of [null, "", `${NAME}=`, `${NAME}=plain-token`, `${NAME}=%E0%A4%A`, `x${NAME}=${signed("t")}`]) {
      expect(verifiedSessionToken(header, NAME, SECRET)).toBeNull();
    }
  });
});
