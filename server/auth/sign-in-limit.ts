// Sign-in limits, per address and per account.
//
// Per address: better-auth's own rate limiter, keyed by the client's IP. Next hands a route handler
// no socket address, and `next start` keeps an X-Forwarded-For the client sent (it only fills the
// header with the socket's address when it is missing), so the header is trusted only when
// KEELSON_TRUSTED_PROXY names the reverse proxy in front: the chain is then read from the right and
// the first address that is not one of the proxies is the client (a forged left part changes
// nothing). Without it no header is read and every request falls in one shared bucket per path,
// given a higher ceiling (scripts/start.sh listens on 127.0.0.1 only, so without a proxy every
// connection comes from the same address anyway).
//
// Per account: failed sign-ins counted per e-mail typed, whatever the address, in the database so
// that a restart does not forget them: after MAX failures within WINDOW the account is refused (429,
// the password is not even checked) until the window that began with the first failure ends. An
// unknown e-mail is counted the same way, so the answers never tell which e-mails exist. A success
// clears the count. The price, as for any account lockout: anyone can keep one account locked by
// typing wrong passwords for it; it frees itself at the end of the window, or when its owner sets a
// new password through a reset link (only the mailbox's owner can).
//
// Reset links: asked for per e-mail typed, known or not, at most RESET_RULE.maxFailures times a
// window, so nobody can fill a person's mailbox with reset mail from many addresses. The refusal is
// the same for a known and an unknown e-mail.
import "server-only";
import { createHmac } from "node:crypto";
import type { BetterAuthOptions } from "better-auth";
import { APIError, createAuthMiddleware, isAPIError } from "better-auth/api";
import { eq, lte, sql } from "drizzle-orm";
import { z } from "zod";
import type { Db } from "@/db/client";
import { signInFailure } from "@/db/schema";

export const ACCOUNT_RULE = { maxFailures: 10, windowSeconds: 15 * 60 } as const;
/** Reset-link requests per e-mail typed (counted as "failures" in the same table, another key). */
export const RESET_RULE = { maxFailures: 5, windowSeconds: 60 * 60 } as const;

/** Per-address ceilings (better-auth's window in seconds); "shared" when no proxy is trusted. */
export const ADDRESS_RULES = {
  signIn: { perAddress: { window: 60, max: 10 }, shared: { window: 60, max: 60 } },
  passwordReset: { perAddress: { window: 300, max: 5 }, shared: { window: 300, max: 30 } },
} as const;

const SIGN_IN_PATH = "/sign-in/email";
const RESET_PATH = "/request-password-reset";

export type AccountState = { locked: false } | { locked: true; retryAfterSeconds: number };

export function accountLimiter(
  db: Db,
  secret: string,
  rule: { maxFailures: number; windowSeconds: number } = ACCOUNT_RULE,
  /** Another count for the same e-mails (reset requests); none for sign-in failures. */
  scope?: string,
) {
  const keyOf = (email: string) =>
    createHmac("sha256", secret)
      .update(`${scope ? `${scope}\0` : ""}${email.trim().toLowerCase()}`)
      .digest("hex");
  const windowMs = rule.windowSeconds * 1000;

  return {
    async check(email: string, now = new Date()): Promise<AccountState> {
      const [row] = await db
        .select()
        .from(signInFailure)
        .where(eq(signInFailure.accountKey, keyOf(email)));
      if (!row) return { locked: false };
      const endsAt = row.windowStartedAt.getTime() + windowMs;
      if (row.failures < rule.maxFailures || endsAt <= now.getTime()) return { locked: false };
      return { locked: true, retryAfterSeconds: Math.ceil((endsAt - now.getTime()) / 1000) };
    },

    async recordFailure(email: string, now = new Date()): Promise<void> {
      const expired = new Date(now.getTime() - windowMs);
      const windowOver = sql`${signInFailure.windowStartedAt} <= ${expired.toISOString()}::timestamptz`;
      // One statement: two wrong passwords at the same moment both count.
      await db
        .insert(signInFailure)
        .values({ accountKey: keyOf(email), failures: 1, windowStartedAt: now })
        .onConflictDoUpdate({
          target: signInFailure.accountKey,
          set: {
            failures: sql`case when ${windowOver} then 1 else ${signInFailure.failures} + 1 end`,
            windowStartedAt: sql`case when ${windowOver} then ${now.toISOString()}::timestamptz else ${signInFailure.windowStartedAt} end`,
          },
        });
      // The table keeps only windows still running: e-mails tried at random do not pile up.
      await db.delete(signInFailure).where(lte(signInFailure.windowStartedAt, expired));
    },

    async clear(email: string): Promise<void> {
      await db.delete(signInFailure).where(eq(signInFailure.accountKey, keyOf(email)));
    },
  };
}

const SignInBody = z.object({ email: z.string().min(1) });

type IpAddressOptions = NonNullable<NonNullable<BetterAuthOptions["advanced"]>["ipAddress"]>;

export type SignInLimitSettings = {
  enabled: boolean;
  /** Addresses or CIDR ranges of the reverse proxies (KEELSON_TRUSTED_PROXY); empty: none. */
  trustedProxies: readonly string[];
  db: Db;
  /** Keys the e-mails in the failure table (BETTER_AUTH_SECRET). */
  secret: string;
};

/** The parts of better-auth's options that limit sign-ins: spread them into betterAuth({ … }). */
export function signInLimitOptions(settings: SignInLimitSettings): {
  ipAddress: IpAddressOptions;
  rateLimit: NonNullable<BetterAuthOptions["rateLimit"]>;
  hooks: NonNullable<BetterAuthOptions["hooks"]>;
  /** For emailAndPassword.onPasswordReset: the account's sign-in lock ends. */
  onPasswordReset: (email: string) => Promise<void>;
} {
  const { enabled, trustedProxies, db, secret } = settings;
  const trusted = trustedProxies.length > 0;
  const limiter = accountLimiter(db, secret);
  const resetLimiter = accountLimiter(db, secret, RESET_RULE, "reset");
  const emailOf = (body: unknown) => SignInBody.safeParse(body).data?.email;

  return {
    // An empty header list: better-auth reads no header at all (its default is X-Forwarded-For).
    ipAddress: trusted
      ? { ipAddressHeaders: ["x-forwarded-for"], trustedProxies: [...trustedProxies] }
      : { ipAddressHeaders: [] },
    // In memory: one web process (next start); a restart forgets the per-address counts only.
    rateLimit: {
      enabled,
      window: 60,
      max: 100,
      customRules: {
        [SIGN_IN_PATH]: trusted ? ADDRESS_RULES.signIn.perAddress : ADDRESS_RULES.signIn.shared,
        [RESET_PATH]: trusted
          ? ADDRESS_RULES.passwordReset.perAddress
          : ADDRESS_RULES.passwordReset.shared,
      },
    },
    hooks: {
      before: createAuthMiddleware(async (ctx) => {
        if (!enabled || (ctx.path !== SIGN_IN_PATH && ctx.path !== RESET_PATH)) return;
        const email = emailOf(ctx.body);
        if (!email) return;
        if (ctx.path === RESET_PATH) {
          const state = await resetLimiter.check(email);
          if (state.locked) throw tooMany("TOO_MANY_RESET_REQUESTS", "Too many reset links asked for", state);
          await resetLimiter.recordFailure(email);
          return;
        }
        const state = await limiter.check(email);
        if (state.locked) throw tooMany("TOO_MANY_FAILED_SIGN_INS", "Too many wrong passwords for", state);
      }),
      after: createAuthMiddleware(async (ctx) => {
        if (!enabled || ctx.path !== SIGN_IN_PATH) return;
        const email = emailOf(ctx.body);
        if (!email) return;
        const returned = ctx.context.returned;
        if (!isAPIError(returned)) await limiter.clear(email);
        else if (returned.statusCode === 401) await limiter.recordFailure(email);
      }),
    },
    onPasswordReset: (email) => limiter.clear(email),
  };
}

function tooMany(code: string, what: string, state: { retryAfterSeconds: number }): APIError {
  const minutes = Math.ceil(state.retryAfterSeconds / 60);
  return new APIError(
    "TOO_MANY_REQUESTS",
    { code, message: `${what} this e-mail address. Try again in ${minutes} minute${minutes === 1 ? "" : "s"}.` },
    { "Retry-After": String(state.retryAfterSeconds) },
  );
}
