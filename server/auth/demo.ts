import "server-only";
import { and, asc, eq, isNull, not } from "drizzle-orm";
import { getDb } from "@/db/client";
import { company, membership, user } from "@/db/schema";
import { env } from "@/server/env";
import { DEMO_COMPANY_SLUG } from "./demo-company";
import { ROLE_LABEL } from "./roles";

export type DemoSignIns = { password: string; users: { email: string; label: string }[] };

/**
 * The demo sign-ins, shown on the sign-in page only when the demo is switched on: the demo
 * company's people as the database has them, and the password from KEELSON_DEMO_PASSWORD
 * (scripts/lib.sh `demo_env`), so neither the seed nor its password is part of the server build.
 */
export async function demoSignIns(): Promise<DemoSignIns | null> {
  const { KEELSON_DEMO, KEELSON_DEMO_PASSWORD } = env();
  if (!KEELSON_DEMO || !KEELSON_DEMO_PASSWORD) return null;
  const people = await getDb()
    .select({ email: user.email, role: membership.role, rank: membership.rank })
    .from(membership)
    .innerJoin(company, eq(company.id, membership.companyId))
    .innerJoin(user, eq(user.id, membership.userId))
    .where(and(eq(company.slug, DEMO_COMPANY_SLUG), isNull(membership.invitedAt), not(eq(user.banned, true))))
    .orderBy(asc(membership.role), asc(user.email));
  if (people.length === 0) return null;
  return {
    password: KEELSON_DEMO_PASSWORD,
    users: people.map((p) => ({ email: p.email, label: p.rank ?? ROLE_LABEL[p.role] })),
  };
}
