// A company of its own for each test file: tests never depend on each other or on the demo data.
import { randomUUID } from "node:crypto";
import { hashPassword } from "better-auth/crypto";
import { Pool } from "pg";
import { createDb, type Db } from "@/db/client";
import * as s from "@/db/schema";
import type { Role } from "@/server/auth/roles";

export const PASSWORD = "fixture-password-1";

let pool: Pool | null = null;
export function testDb(): Db {
  pool ??= new Pool({ connectionString: process.env.DATABASE_URL, max: 4 });
  return createDb(pool);
}
export async function closeTestDb() {
  await pool?.end();
  pool = null;
}

let passwordHash: Promise<string> | null = null;

export type Fixture = Awaited<ReturnType<typeof createCompany>>;

/**
 * A company with two vessels (A assigned to the seagoing users, B to nobody), two counters on A
 * with a reading 24 h ago, and one user per role.
 */
export async function createCompany(label: string, now = new Date()) {
  const db = testDb();
  passwordHash ??= hashPassword(PASSWORD);
  const hash = await passwordHash;
  const tag = `${label}-${randomUUID().slice(0, 8)}`;
  const [company] = await db.insert(s.company).values({ name: `Test ${tag}`, slug: tag }).returning();
  const companyId = company!.id;
  const imo = (seed: number) => {
    const six = String(100000 + ((seed * 7919) % 899999)).slice(0, 6);
    const sum = [7, 6, 5, 4, 3, 2].reduce((acc, w, i) => acc + w * Number(six[i]), 0);
    return `${six}${sum % 10}`;
  };
  const seed = Math.floor(Math.random() * 100000);
  const [vesselA] = await db
    .insert(s.vessel)
    .values({ companyId, name: `Alpha ${tag}`, code: "ALPHA", imoNumber: imo(seed), timeZone: "Asia/Singapore" })
    .returning();
  const [vesselB] = await db
    .insert(s.vessel)
    .values({ companyId, name: `Bravo ${tag}`, code: "BRAVO", imoNumber: imo(seed + 1), timeZone: "UTC" })
    .returning();
  const [main] = await db
    .insert(s.counter)
    .values({ companyId, vesselId: vesselA!.id, name: "Main engine", sortOrder: 0 })
    .returning();
  const [gen] = await db
    .insert(s.counter)
    .values({ companyId, vesselId: vesselA!.id, name: "Generator 1", sortOrder: 1 })
    .returning();
  const [otherCounter] = await db
    .insert(s.counter)
    .values({ companyId, vesselId: vesselB!.id, name: "Main engine", sortOrder: 0 })
    .returning();
  const lastReadAt = new Date(Math.floor(now.getTime() / 60_000) * 60_000 - 24 * 3_600_000);
  await db.insert(s.reading).values([
    { companyId, vesselId: vesselA!.id, counterId: main!.id, readAt: lastReadAt, segment: 1, meterValue: 1000, totalHours: 1000 },
    { companyId, vesselId: vesselA!.id, counterId: gen!.id, readAt: lastReadAt, segment: 1, meterValue: 500, totalHours: 500 },
  ]);

  const roles: Role[] = ["admin", "superintendent", "chief-engineer", "engineer", "viewer"];
  const users = {} as Record<Role, { id: string; email: string }>;
  for (const role of roles) {
    const id = randomUUID();
    const email = `${role}.${tag}@fixture.example`;
    await db.insert(s.user).values({ id, name: `${role} ${tag}`, email, emailVerified: true });
    await db.insert(s.account).values({ id: randomUUID(), accountId: id, providerId: "credential", userId: id, password: hash });
    await db.insert(s.membership).values({ companyId, userId: id, role });
    if (role === "chief-engineer" || role === "engineer" || role === "viewer") {
      await db.insert(s.vesselAssignment).values({ companyId, userId: id, vesselId: vesselA!.id });
    }
    users[role] = { id, email };
  }
  return {
    companyId,
    vesselA: vesselA!,
    vesselB: vesselB!,
    counters: { main: main!, gen: gen!, otherVessel: otherCounter! },
    lastReadAt,
    users,
  };
}
