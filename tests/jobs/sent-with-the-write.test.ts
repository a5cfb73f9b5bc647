// A job caused by a write is inserted in the write's own transaction (pg-boss 10's `db` option):
// a committed reading always has its recompute queued, a refused or rolled-back one never does.
import { randomUUID } from "node:crypto";
import { sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { shipClock, shipDay } from "@/server/format/hours";
import { recomputeVesselJob, requestRecompute } from "@/server/jobs/recompute-vessel";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { api, type Session, signIn } from "../support/http";

let f: Fixture;
let engineer: Session;
let now: Date;

/** Recompute jobs for a vessel created since `since` (database clock), whatever their state now. */
async function recomputesSince(vesselId: string, since: Date): Promise<number> {
  const result = await testDb().execute<{ n: number }>(
    sql`select count(*)::int as n from pgboss.job
        where name = ${recomputeVesselJob.name} and singleton_key = ${vesselId} and created_on >= ${since}`,
  );
  return result.rows[0]!.n;
}

async function databaseNow(): Promise<Date> {
  const result = await testDb().execute<{ now: Date }>(sql`select now() as now`);
  return new Date(result.rows[0]!.now);
}

beforeAll(async () => {
  now = new Date();
  f = await createCompany("jobs-in-tx", now);
  engineer = await signIn(f.users.engineer.email, PASSWORD);
});
afterAll(closeTestDb);

describe("requestRecompute inside a transaction", () => {
  it("queues nothing when the transaction rolls back, and one job when it commits", async () => {
    const vesselId = randomUUID();
    const since = await databaseNow();
    await expect(
      testDb().transaction(async (tx) => {
        await requestRecompute(tx, f.companyId, vesselId);
        throw new Error("the write failed after asking");
      }),
    ).rejects.toThrow("the write failed");
    expect(await recomputesSince(vesselId, since)).toBe(0);

    await testDb().transaction(async (tx) => {
      await requestRecompute(tx, f.companyId, vesselId);
    });
    expect(await recomputesSince(vesselId, since)).toBe(1);
  });
});

describe("POST /api/vessels/[vesselId]/readings", () => {
  const path = () => `/api/vessels/${f.vesselA.id}/readings`;
  const at = () => ({ shipDay: shipDay(now, f.vesselA.timeZone), time: shipClock(now, f.vesselA.timeZone) });

  it("a refused batch queues no recompute; a stored one queues it with the readings", async () => {
    const since = await databaseNow();
    const refused = await api(engineer, "POST", path(), { ...at(), entries: [{ counterId: f.counters.main.id, value: 1 }] });
    expect(refused.status).toBe(422);
    expect(await recomputesSince(f.vesselA.id, since)).toBe(0);

    const stored = await api(engineer, "POST", path(), { ...at(), entries: [{ counterId: f.counters.main.id, value: 1010 }] });
    expect(stored.status).toBe(201);
    // Inserted before the answer left (in the readings' transaction), not on a later tick.
    expect(await recomputesSince(f.vesselA.id, since)).toBe(1);
  });
});
