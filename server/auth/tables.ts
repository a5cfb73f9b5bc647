// The tables better-auth's Drizzle adapter writes, named as the adapter expects: one map for the
// app's instance (server/auth/auth.ts) and the ones the tests build with the same options.
import { account, session, user, verification } from "@/db/schema";

export const AUTH_TABLES = { user, session, account, verification };
