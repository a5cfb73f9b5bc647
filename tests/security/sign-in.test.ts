// Sign-in answers and limits. The answers are asked of the running app (which runs with the limits
// off, as the whole suite signs in from one address); the limits are exercised with limits ON on a
// better-auth instance of their own, built from the same options as server/auth/auth.ts (the
// rules, the address header and the hooks of server/auth/sign-in-limit.ts) on the real database.
import { randomUUID } from "node:crypto";
import { betterAuth } from "better-auth";
import { drizzleAdapter } from "better-auth/adapters/drizzle";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as schema from "@/db/schema";
import {
  ACCOUNT_RULE,
  ADDRESS_RULES,
  accountLimiter,
  RESET_RULE,
  signInLimitOptions,
} from "@/server/auth/sign-in-limit";
import { AUTH_TABLES } from "@/server/auth/tables";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { BASE_URL } from "../support/http";

const SECRET = process.env.BETTER_AUTH_SECRET ?? "a-test-secret-of-some-length-0123456789";
let fixture: Fixture;

beforeAll(async () => {
  fixture = await createCompany("sign-in");
});
afterAll(async () => {
  await closeTestDb();
});

async function post(path: string, body: unknown) {
  const response = await fetch(`${BASE_URL}/api/auth${path}`, {
    method: "POST",
    headers: { "content-type": "application/json", origin: BASE_URL },
    body: JSON.stringify(body),
  });
  return { status: response.status, body: await response.text() };
}

describe("the same answer for a known and an unknown e-mail", () => {
  it("on sign-in with a wrong password", async () => {
    const known = await post("/sign-in/email", { email: fixture.users.engineer.email, password: "not-the-password-1" });
    const unknown = await post("/sign-in/email", {
      email: `nobody-${randomUUID()}@fixture.example`,
      password: "not-the-password-1",
    });
    expect(known.status).toBe(401);
    expect(unknown).toEqual(known);
  });

  it("on forgot-password", async () => {
    const known = await post("/request-password-reset", {
      email: fixture.users.viewer.email,
      redirectTo: "/set-password",
    });
    const unknown = await post("/request-password-reset", {
      email: `nobody-${randomUUID()}@fixture.example`,
      redirectTo: "/set-password",
    });
    expect(known.status).toBe(200);
    expect(unknown).toEqual(known);
  });
});

describe("the per-account limit on the database", () => {
  it(`refuses after ${ACCOUNT_RULE.maxFailures} failures within ${ACCOUNT_RULE.windowSeconds / 60} minutes, until the window ends`, async () => {
    const limiter = accountLimiter(testDb(), SECRET);
    const email = `Locked-${randomUUID()}@Fixture.example`;
    const start = new Date();
    for (let i = 0; i < ACCOUNT_RULE.maxFailures - 1; i++) await limiter.recordFailure(email, start);
    expect(await limiter.check(email, start)).toEqual({ locked: false });
    await limiter.recordFailure(email.toLowerCase(), start);
    expect(await limiter.check(` ${email.toUpperCase()} `, start)).toEqual({
      locked: true,
      retryAfterSeconds: ACCOUNT_RULE.windowSeconds,
    });

    const justBefore = new Date(start.getTime() + ACCOUNT_RULE.windowSeconds * 1000 - 1000);
    expect(await limiter.check(email, justBefore)).toEqual({ locked: true, retryAfterSeconds: 1 });
    const after = new Date(start.getTime() + ACCOUNT_RULE.windowSeconds * 1000);
    expect(await limiter.check(email, after)).toEqual({ locked: false });
    // A failure after the window starts a new one at 1, and removes the ended window's row.
    await limiter.recordFailure(email, after);
    const rows = await testDb().select().from(schema.signInFailure);
    const mine = rows.filter((r) => r.windowStartedAt.getTime() === after.getTime());
    expect(mine.map((r) => r.failures)).toContain(1);
    expect(rows.every((r) => !r.accountKey.includes("@"))).toBe(true);
  });

  it("forgets the failures after a successful sign-in", async () => {
    const limiter = accountLimiter(testDb(), SECRET);
    const email = `cleared-${randomUUID()}@fixture.example`;
    for (let i = 0; i < ACCOUNT_RULE.maxFailures; i++) await limiter.recordFailure(email);
    expect((await limiter.check(email)).locked).toBe(true);
    await limiter.clear(email);
    expect(await limiter.check(email)).toEqual({ locked: false });
  });
});

const AUTH_URL = "http://127.0.0.1:39999";

/** Reset links the limited instance would have mailed: e-mail → the link's token. */
const resetTokens = new Map<string, string>();

/** better-auth with the app's sign-in limits switched on, and the proxies given. */
function limitedAuth(trustedProxies: string[]) {
  const limits = signInLimitOptions({ enabled: true, trustedProxies, db: testDb(), secret: SECRET });
  return betterAuth({
    baseURL: AUTH_URL,
    secret: SECRET,
    database: drizzleAdapter(testDb(), {
      provider: "pg",
      schema: AUTH_TABLES,
    }),
    emailAndPassword: {
      enabled: true,
      disableSignUp: true,
      sendResetPassword: async ({ user, token }) => {
        resetTokens.set(user.email, token);
      },
      onPasswordReset: ({ user }) => limits.onPasswordReset(user.email),
    },
    advanced: { ipAddress: limits.ipAddress },
    rateLimit: limits.rateLimit,
    hooks: limits.hooks,
    telemetry: { enabled: false },
  });
}

type Auth = ReturnType<typeof limitedAuth>;

async function postVia(auth: Auth, path: string, body: object, forwardedFor?: string) {
  const response = await auth.handler(
    new Request(`${AUTH_URL}/api/auth${path}`, {
      method: "POST",
      headers: {
        "content-type": "application/json",
        origin: AUTH_URL,
        ...(forwardedFor ? { "x-forwarded-for": forwardedFor } : {}),
      },
      body: JSON.stringify(body),
    }),
  );
  const answer = (await response.json()) as { code?: string; message?: string };
  return {
    status: response.status,
    code: answer.code,
    message: answer.message,
    retryAfter: response.headers.get("retry-after"),
  };
}

function signInVia(auth: Auth, email: string, password: string, forwardedFor?: string) {
  return postVia(auth, "/sign-in/email", { email, password }, forwardedFor);
}

describe("the per-account limit in better-auth, whatever the address", () => {
  it("refuses the 11th wrong password for an account even from 40 different addresses, and its right password too", async () => {
    const auth = limitedAuth(["10.9.0.1"]);
    const email = fixture.users.engineer.email;
    const answers = [];
    // A trusted proxy appends each client's own address: 40 distinct clients, one account.
    for (let i = 1; i <= 40; i++) answers.push(await signInVia(auth, email, "wrong-password-1", `192.0.2.${i}`));
    const statuses = answers.map((a) => a.status);
    expect(statuses.slice(0, ACCOUNT_RULE.maxFailures)).toEqual(Array(ACCOUNT_RULE.maxFailures).fill(401));
    expect(new Set(statuses.slice(ACCOUNT_RULE.maxFailures))).toEqual(new Set([429]));
    expect(answers[ACCOUNT_RULE.maxFailures]!.code).toBe("TOO_MANY_FAILED_SIGN_INS");
    expect(Number(answers[ACCOUNT_RULE.maxFailures]!.retryAfter)).toBeGreaterThan(ACCOUNT_RULE.windowSeconds - 60);
    // The right password is refused as well while the account is locked: guessing gains nothing.
    expect((await signInVia(auth, email, PASSWORD, "192.0.2.99")).status).toBe(429);
  });

  it("answers an unknown e-mail exactly as a known one, lock included", async () => {
    const auth = limitedAuth(["10.9.0.1"]);
    const unknown = `nobody-${randomUUID()}@fixture.example`;
    const statuses = [];
    for (let i = 1; i <= ACCOUNT_RULE.maxFailures + 1; i++)
      statuses.push((await signInVia(auth, unknown, "wrong-password-1", `192.0.3.${i}`)).status);
    expect(statuses).toEqual([...Array(ACCOUNT_RULE.maxFailures).fill(401), 429]);
  });

  it("a success clears the count", async () => {
    const auth = limitedAuth(["10.9.0.1"]);
    const email = fixture.users.viewer.email;
    for (let i = 1; i < ACCOUNT_RULE.maxFailures; i++) await signInVia(auth, email, "wrong-password-1", `192.0.4.${i}`);
    expect((await signInVia(auth, email, PASSWORD, "192.0.4.50")).status).toBe(200);
    // Counted from zero again: the limit would have been reached on this attempt otherwise.
    expect((await signInVia(auth, email, "wrong-password-1", "192.0.4.51")).status).toBe(401);
    expect((await signInVia(auth, email, "wrong-password-1", "192.0.4.52")).status).toBe(401);
  });
});

describe("the per-address limit", () => {
  const { perAddress, shared } = ADDRESS_RULES.signIn;

  it("behind a trusted proxy: keyed by the address the proxy saw, a forged X-Forwarded-For changes nothing", async () => {
    const auth = limitedAuth(["10.9.0.1"]);
    const statuses = [];
    // Each attempt another account (the per-account limit stays out of it) and another forged address.
    for (let i = 1; i <= perAddress.max + 1; i++) {
      statuses.push(
        (
          await signInVia(
            auth,
            `spray-${i}-${randomUUID()}@fixture.example`,
            "wrong-password-1",
            `198.51.100.${i}, 203.0.113.7`,
          )
        ).status,
      );
    }
    expect(statuses).toEqual([...Array(perAddress.max).fill(401), 429]);
    // Another client behind the same proxy has its own bucket.
    expect(
      (await signInVia(auth, `other-${randomUUID()}@fixture.example`, "wrong-password-1", "203.0.113.8")).status,
    ).toBe(401);
  });

  it("without a trusted proxy: the header is not read, so forging it gives no fresh bucket", async () => {
    const auth = limitedAuth([]);
    const statuses = [];
    for (let i = 1; i <= shared.max + 1; i++) {
      statuses.push(
        (await signInVia(auth, `forged-${i}-${randomUUID()}@fixture.example`, "wrong-password-1", `198.51.${i}.1`))
          .status,
      );
    }
    expect(statuses).toEqual([...Array(shared.max).fill(401), 429]);
  }, 90_000);
});

describe("reset links", () => {
  it(`are sent at most ${RESET_RULE.maxFailures} times an hour per e-mail, from any address, known or not alike`, async () => {
    const auth = limitedAuth(["10.9.0.1"]);
    const ask = (email: string, i: number) =>
      postVia(auth, "/request-password-reset", { email, redirectTo: "/set-password" }, `192.0.5.${i}`);
    const known = fixture.users["chief-engineer"].email;
    const unknown = `nobody-${randomUUID()}@fixture.example`;
    const knownStatuses = [];
    const unknownStatuses = [];
    for (let i = 1; i <= RESET_RULE.maxFailures + 1; i++) {
      knownStatuses.push((await ask(known, i)).status);
      unknownStatuses.push((await ask(unknown, 100 + i)).status);
    }
    expect(knownStatuses).toEqual([...Array(RESET_RULE.maxFailures).fill(200), 429]);
    expect(unknownStatuses).toEqual(knownStatuses);
    const refused = await ask(known, 99);
    expect(refused.code).toBe("TOO_MANY_RESET_REQUESTS");
    expect(refused.message).toMatch(/^Too many reset links asked for this e-mail address\. Try again in 60 minutes\.$/);
  });

  it("a new password set through a reset link ends the account's sign-in lock", async () => {
    const auth = limitedAuth(["10.9.0.1"]);
    const email = fixture.users.superintendent.email;
    for (let i = 1; i <= ACCOUNT_RULE.maxFailures; i++) await signInVia(auth, email, "wrong-password-1", `192.0.6.${i}`);
    expect((await signInVia(auth, email, PASSWORD, "192.0.6.50")).status).toBe(429);

    expect((await postVia(auth, "/request-password-reset", { email, redirectTo: "/set-password" })).status).toBe(200);
    const token = resetTokens.get(email);
    expect(token).toBeTruthy();
    // The same password again, so the fixture's other tests sign in as before.
    expect((await postVia(auth, "/reset-password", { token, newPassword: PASSWORD })).status).toBe(200);
    expect((await signInVia(auth, email, PASSWORD, "192.0.6.51")).status).toBe(200);
  });
});
