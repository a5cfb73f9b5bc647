import "server-only";
import { betterAuth } from "better-auth";
import { drizzleAdapter } from "better-auth/adapters/drizzle";
import { nextCookies } from "better-auth/next-js";
import { admin } from "better-auth/plugins";
import { getDb } from "@/db/client";
import { markPasswordSet, RESET_LINK_HOURS, sendAccountMail } from "@/server/accounts/account-mail";
import { env } from "@/server/env";
import { signInLimitOptions } from "./sign-in-limit";
import { AUTH_TABLES } from "./tables";

const { BETTER_AUTH_URL: baseURL, BETTER_AUTH_SECRET, KEELSON_AUTH_RATE_LIMIT, KEELSON_TRUSTED_PROXY } = env();

// Per address and per account (server/auth/sign-in-limit.ts); the test suite, which signs in dozens
// of users from one address within seconds, switches both off.
const signInLimits = signInLimitOptions({
  enabled: KEELSON_AUTH_RATE_LIMIT === "on",
  trustedProxies: KEELSON_TRUSTED_PROXY,
  db: getDb(),
  secret: BETTER_AUTH_SECRET,
});

/** The origins of Keelson's own pages: a state-changing request from anywhere else is refused. */
export const TRUSTED_ORIGINS: readonly string[] = [
  new URL(baseURL).origin,
  new URL(baseURL.replace("127.0.0.1", "localhost")).origin,
];

export const auth = betterAuth({
  baseURL,
  secret: BETTER_AUTH_SECRET,
  trustedOrigins: [...TRUSTED_ORIGINS],
  database: drizzleAdapter(getDb(), {
    provider: "pg",
    schema: AUTH_TABLES,
  }),
  emailAndPassword: {
    enabled: true,
    // Accounts are created by the company administrator, never by self sign-up.
    disableSignUp: true,
    minPasswordLength: 10,
    // Invitations and password resets: a one-time link by e-mail (server/accounts/account-mail.ts).
    sendResetPassword: (data) => sendAccountMail(data),
    resetPasswordTokenExpiresIn: RESET_LINK_HOURS * 3600,
    onPasswordReset: async ({ user }) => {
      await markPasswordSet(user.id);
      // The owner proved the account is theirs: a lock left by someone else's guesses ends here.
      await signInLimits.onPasswordReset(user.email);
    },
    // A new password ends every session of the account, as a disabled account's do.
    revokeSessionsOnPasswordReset: true,
  },
  session: {
    expiresIn: 60 * 60 * 24 * 14,
    updateAge: 60 * 60 * 24,
    // No cookie cache: a disabled user or an ended session must stop working on the next call,
    // so every request looks the session up (one indexed query).
    cookieCache: { enabled: false },
  },
  advanced: {
    useSecureCookies: baseURL.startsWith("https://"),
    ipAddress: signInLimits.ipAddress,
  },
  rateLimit: signInLimits.rateLimit,
  hooks: signInLimits.hooks,
  telemetry: { enabled: false },
  plugins: [admin(), nextCookies()],
});
