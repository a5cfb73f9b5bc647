// Failed sign-ins per account (the e-mail typed, known or not), for the per-account limit in
// server/auth/sign-in-limit.ts. Not tenant data: no company is known before a sign-in succeeds.
import { index, integer, pgTable, text } from "drizzle-orm/pg-core";
import { instant } from "./refs";

export const signInFailure = pgTable(
  "sign_in_failure",
  {
    /** HMAC of the lower-cased e-mail: a password typed into the e-mail field is never kept. */
    accountKey: text().primaryKey(),
    failures: integer().notNull(),
    windowStartedAt: instant().notNull(),
  },
  // Expired windows are deleted by their start.
  (t) => [index().on(t.windowStartedAt)],
);
