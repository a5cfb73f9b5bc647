// A due point the counter has passed is dated by the readings and stays put (issue 14: an hours
// work order past its due point showed 25 Aug, then 26 Aug after one more reading). Real
// PostgreSQL, the worker's own recompute; the figures are hand-worked.
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as s from "@/db/schema";
import { recomputeVessel } from "@/server/scheduling/recompute";
import { closeTestDb, createCompany, type Fixture, testDb } from "../support/fixtures";

const HOUR = 3_600_000;
let f: Fixture;
let routineId: string;
/** The fixture's reading: 1,000 h on the main engine, 24 h before the fixture's "now". */
let L: Date;

async function openWorkOrder() {
  const [w] = await testDb()
    .select()
    .from(s.workOrder)
    .where(and(eq(s.workOrder.routineId, routineId), eq(s.workOrder.companyId, f.companyId)));
  return w!;
}

async function read(at: Date, hours: number) {
  await testDb().insert(s.reading).values({
    companyId: f.companyId,
    vesselId: f.vesselA.id,
    counterId: f.counters.main.id,
    readAt: at,
    segment: 1,
    meterValue: hours,
    totalHours: hours,
  });
}

beforeAll(async () => {
  // "Now" is three days after the fixture's reading, so that the readings below are all in the past.
  f = await createCompany("passed-due", new Date(Date.now() - 3 * 24 * HOUR));
  L = f.lastReadAt;
  const db = testDb();
  const [me] = await db
    .insert(s.component)
    .values({ companyId: f.companyId, vesselId: f.vesselA.id, code: "ME", name: "Main engine", counterId: f.counters.main.id })
    .returning();
  // Every 500 h from 510 h: due at 1,010 h. The counter read 1,000 h at L and reads 1,024 h a day later,
  // so it passed 1,010 h 10 h after L (24 h run evenly in 24 h).
  const [r] = await db
    .insert(s.routine)
    .values({
      companyId: f.companyId,
      vesselId: f.vesselA.id,
      componentId: me!.id,
      title: "Fuel valve overhaul",
      intervalHours: 500,
      baselineHours: 510,
      baselineAt: new Date(L.getTime() - 30 * 24 * HOUR),
    })
    .returning();
  routineId = r!.id;
  await read(new Date(L.getTime() + 24 * HOUR), 1024);
});
afterAll(closeTestDb);

describe("an hours due point already passed", () => {
  it("is the instant the counter passed it, from the readings around it", async () => {
    await recomputeVessel(testDb(), f.companyId, f.vesselA.id, new Date(L.getTime() + 25 * HOUR));
    const w = await openWorkOrder();
    expect(w.dueHours).toBe(1010);
    expect(w.dueDate).toEqual(new Date(L.getTime() + 10 * HOUR));
    expect(w.projectedDate).toEqual(new Date(L.getTime() + 10 * HOUR));
  });

  it("stays there when the next day's reading arrives at another rate", async () => {
    // 1,040 h a day later: the rate changes, the day the counter passed 1,010 h does not.
    await read(new Date(L.getTime() + 48 * HOUR), 1040);
    await recomputeVessel(testDb(), f.companyId, f.vesselA.id, new Date(L.getTime() + 49 * HOUR));
    const w = await openWorkOrder();
    expect(w.dueDate).toEqual(new Date(L.getTime() + 10 * HOUR));
    expect(w.remainingHours).toBe(-30);
  });
});
