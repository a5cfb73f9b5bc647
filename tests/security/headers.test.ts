// The security headers on what the running app answers: a signed-out page, a signed-in page, a
// route handler, and the session cookie of a sign-in.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeTestDb, createCompany, type Fixture, PASSWORD } from "../support/fixtures";
import { BASE_URL, signIn } from "../support/http";

let fixture: Fixture;
let cookie = "";

beforeAll(async () => {
  fixture = await createCompany("headers");
  ({ cookie } = await signIn(fixture.users["chief-engineer"].email, PASSWORD));
});
afterAll(async () => {
  await closeTestDb();
});

const get = (path: string, withCookie = false) =>
  fetch(`${BASE_URL}${path}`, { redirect: "manual", headers: withCookie ? { cookie } : {} });

function expectFixedHeaders(response: Response) {
  expect(response.headers.get("x-content-type-options")).toBe("nosniff");
  expect(response.headers.get("x-frame-options")).toBe("DENY");
  expect(response.headers.get("referrer-policy")).toBe("same-origin");
  // The camera for Keelson's own pages only: the work order's photo capture.
  expect(response.headers.get("permissions-policy")).toContain("camera=(self)");
  // BETTER_AUTH_URL is http:// in the test stack: no HSTS (browsers ignore it over http anyway).
  expect(BASE_URL.startsWith("http://")).toBe(true);
  expect(response.headers.get("strict-transport-security")).toBeNull();
}

async function expectPagePolicy(response: Response) {
  const policy = response.headers.get("content-security-policy") ?? "";
  const nonce = policy.match(/'nonce-([^']+)'/)?.[1];
  expect(nonce).toBeDefined();
  expect(policy).toContain("'strict-dynamic'");
  expect(policy).toContain("frame-ancestors 'none'");
  expect(policy).not.toContain("unsafe-eval");
  // Every script of the page carries this response's nonce, or the browser would not run it.
  const html = await response.text();
  const scripts = html.match(/<script\b[^>]*>/g) ?? [];
  expect(scripts.length).toBeGreaterThan(1);
  for (const tag of scripts) expect(tag).toContain(`nonce="${nonce}"`);
  return nonce;
}

describe("security headers", () => {
  it("on the sign-in page, with a fresh nonce per answer", async () => {
    const first = await get("/sign-in");
    expect(first.status).toBe(200);
    expectFixedHeaders(first);
    const second = await get("/sign-in");
    expect(await expectPagePolicy(first)).not.toBe(await expectPagePolicy(second));
  });

  it("on a signed-in page, and on the redirect of an anonymous visitor", async () => {
    const page = await get("/account", true);
    expect(page.status).toBe(200);
    expectFixedHeaders(page);
    await expectPagePolicy(page);

    const anonymous = await get("/account");
    expect(anonymous.status).toBe(307);
    expect(anonymous.headers.get("location")).toMatch(/\/sign-in$/);
    expectFixedHeaders(anonymous);
  });

  it("on a page that does not exist", async () => {
    const missing = await get("/no-such-page", true);
    expect(missing.status).toBe(404);
    expectFixedHeaders(missing);
    await expectPagePolicy(missing);
  });

  it("on a route handler, signed in or refused", async () => {
    for (const response of [await get("/api/account/me", true), await get("/api/account/me")]) {
      expectFixedHeaders(response);
      const policy = response.headers.get("content-security-policy") ?? "";
      expect(policy).toContain("default-src 'none'");
      expect(policy).toContain("frame-ancestors 'none'");
    }
  });

  it("the session cookie is HttpOnly and SameSite", async () => {
    const response = await fetch(`${BASE_URL}/api/auth/sign-in/email`, {
      method: "POST",
      headers: { "content-type": "application/json", origin: BASE_URL },
      body: JSON.stringify({ email: fixture.users.engineer.email, password: PASSWORD }),
    });
    expect(response.status).toBe(200);
    expectFixedHeaders(response);
    const session = response.headers.getSetCookie().find((c) => /session_token=/.test(c));
    expect(session).toBeDefined();
    const attributes = session!.split(";").map((a) => a.trim().toLowerCase());
    expect(attributes).toContain("httponly");
    expect(attributes.some((a) => a === "samesite=lax" || a === "samesite=strict")).toBe(true);
    expect(attributes).toContain("path=/");
  });
});
