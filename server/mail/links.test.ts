import { describe, expect, it, vi } from "vitest";
import { appUrl, oneClickUnsubscribeUrl, unsubscribeToken, unsubscribeUrl, verifyUnsubscribe } from "./links";

const U = "user-1";
const C = "2b0f0f7e-9f5e-4a57-9d7e-0c2c1b7a9c11";

const config = vi.hoisted(() => ({
  DATABASE_URL: "postgres://unused/keelson",
  BETTER_AUTH_SECRET: "test-secret-for-links",
  KEELSON_APP_URL: "https://keelson.example/",
}));
vi.mock("@/server/env", async (importOriginal) => {
  const actual = await importOriginal<typeof import("@/server/env")>();
  return { ...actual, env: () => actual.loadEnv(config) };
});

function paramsOf(url: string) {
  return Object.fromEntries(new URL(url).searchParams);
}

describe("appUrl", () => {
  it("makes absolute links from KEELSON_APP_URL", () => {
    expect(appUrl("/vessels/a/backlog?state=late")).toBe("https://keelson.example/vessels/a/backlog?state=late");
  });
});

describe("unsubscribe links", () => {
  it("verifies a genuine link", () => {
    const url = unsubscribeUrl(U, C, "due-digest");
    expect(new URL(url).pathname).toBe("/unsubscribe");
    expect(verifyUnsubscribe(paramsOf(url))).toEqual({ userId: U, companyId: C, kind: "due-digest" });
    const oneClick = oneClickUnsubscribeUrl(U, C, "escalation");
    expect(new URL(oneClick).pathname).toBe("/api/unsubscribe");
    expect(verifyUnsubscribe(paramsOf(oneClick))?.kind).toBe("escalation");
  });

  it("refuses a link whose kind, user, company or token was changed", () => {
    const p = paramsOf(unsubscribeUrl(U, C, "due-digest"));
    expect(verifyUnsubscribe({ ...p, k: "escalation" })).toBeNull();
    expect(verifyUnsubscribe({ ...p, u: "user-2" })).toBeNull();
    expect(verifyUnsubscribe({ ...p, c: "5c7c3a2e-0000-4000-8000-000000000000" })).toBeNull();
    const t = p.t!;
    expect(verifyUnsubscribe({ ...p, t: (t[0] === "A" ? "B" : "A") + t.slice(1) })).toBeNull();
    expect(verifyUnsubscribe({ ...p, t: t.slice(0, -1) })).toBeNull();
    expect(verifyUnsubscribe({ ...p, t: undefined })).toBeNull();
    expect(verifyUnsubscribe({})).toBeNull();
  });

  it("refuses a token signed with another secret", () => {
    const p = paramsOf(unsubscribeUrl(U, C, "fleet-summary"));
    config.BETTER_AUTH_SECRET = "another-secret";
    try {
      expect(verifyUnsubscribe(p)).toBeNull();
    } finally {
      config.BETTER_AUTH_SECRET = "test-secret-for-links";
    }
  });

  it("never accepts account messages, which cannot be opted out of", () => {
    const t = unsubscribeToken(U, C, "password-reset");
    expect(verifyUnsubscribe({ u: U, c: C, k: "password-reset", t })).toBeNull();
    expect(verifyUnsubscribe({ u: U, c: C, k: "invitation", t: unsubscribeToken(U, C, "invitation") })).toBeNull();
  });

  it("is the same token for the same user, company and kind (HMAC, no state)", () => {
    expect(unsubscribeToken(U, C, "due-digest")).toBe(unsubscribeToken(U, C, "due-digest"));
    expect(unsubscribeToken(U, C, "due-digest")).not.toBe(unsubscribeToken(U, C, "missing-readings"));
    expect(unsubscribeToken(U, C, "due-digest")).toMatch(/^[A-Za-z0-9_-]{43}$/);
  });
});
