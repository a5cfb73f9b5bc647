// Work by running hours on a counter never read has no due date; the digest names it to the chief
// engineer until the meter is read (issue 14). Real PostgreSQL and the worker's own recompute.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as s from "@/db/schema";
import { awaitingFirstReading } from "@/server/readings/first-reading";
import { recomputeVessel } from "@/server/scheduling/recompute";
import { closeTestDb, createCompany, type Fixture, testDb } from "../support/fixtures";

let f: Fixture;
let counterId: string;

beforeAll(async () => {
  f = await createCompany("first-reading");
  const db = testDb();
  const [eg] = await db
    .insert(s.counter)
    .values({ companyId: f.companyId, vesselId: f.vesselA.id, name: "Emergency generator", sortOrder: 5 })
    .returning();
  counterId = eg!.id;
  const [c] = await db
    .insert(s.component)
    .values({ companyId: f.companyId, vesselId: f.vesselA.id, code: "EG", name: "Emergency generator", counterId })
    .returning();
  await db.insert(s.routine).values({
    companyId: f.companyId,
    vesselId: f.vesselA.id,
    componentId: c!.id,
    title: "Emergency generator 500 h service",
    intervalHours: 500,
    baselineHours: 0,
    baselineAt: new Date(Date.now() - 10 * 86_400_000),
  });
  await recomputeVessel(db, f.companyId, f.vesselA.id);
});
afterAll(closeTestDb);

describe("work waiting for a first reading", () => {
  it("is found while its counter has no reading", async () => {
    const waiting = await awaitingFirstReading(testDb(), f.companyId, f.vesselA.id);
    expect(waiting.map((w) => [w.title, w.counter])).toEqual([["Emergency generator 500 h service", "Emergency generator"]]);
    // The other vessel of the company has none.
    expect(await awaitingFirstReading(testDb(), f.companyId, f.vesselB.id)).toEqual([]);
  });

  it("is no longer once the meter is read and the work has a due date", async () => {
    await testDb().insert(s.reading).values({
      companyId: f.companyId,
      vesselId: f.vesselA.id,
      counterId,
      readAt: new Date(Date.now() - 3_600_000),
      segment: 1,
      meterValue: 12,
      totalHours: 12,
    });
    await recomputeVessel(testDb(), f.companyId, f.vesselA.id);
    expect(await awaitingFirstReading(testDb(), f.companyId, f.vesselA.id)).toEqual([]);
  });
});
