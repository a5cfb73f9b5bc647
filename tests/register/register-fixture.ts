// What the register tests share: a small register on vessel A (and one component on vessel B),
// and a count of every register row of the company, to show that a refused write left no trace.
import { count, eq } from "drizzle-orm";
import * as s from "@/db/schema";
import type { Fixture } from "../support/fixtures";
import { testDb } from "../support/fixtures";

export type Register = Awaited<ReturnType<typeof seedRegister>>;

/**
 *   ME       Main engine      own counter "Main engine"
 *   └ ME.CYL Cylinder units   (uses Main engine of ME)
 *     └ ME.CYL.3 Cylinder unit 3
 *   AE.1     Generator set 1  own counter "Generator 1"
 *   spare counter "Spare meter", used by no component
 * and on vessel B: B.ME, to prove ids of another vessel are not accepted on A.
 */
export async function seedRegister(f: Fixture) {
  const db = testDb();
  const base = { companyId: f.companyId, vesselId: f.vesselA.id };
  const [spare] = await db
    .insert(s.counter)
    .values({ ...base, name: "Spare meter", sortOrder: 2 })
    .returning();
  const [me] = await db
    .insert(s.component)
    .values({ ...base, code: "ME", name: "Main engine", counterId: f.counters.main.id, critical: true })
    .returning();
  const [cyl] = await db
    .insert(s.component)
    .values({ ...base, code: "ME.CYL", name: "Cylinder units", parentId: me!.id, sortOrder: 1 })
    .returning();
  const [cyl3] = await db
    .insert(s.component)
    .values({ ...base, code: "ME.CYL.3", name: "Cylinder unit 3", parentId: cyl!.id, sortOrder: 2 })
    .returning();
  const [ae1] = await db
    .insert(s.component)
    .values({ ...base, code: "AE.1", name: "Generator set 1", counterId: f.counters.gen.id, sortOrder: 3 })
    .returning();
  const [otherVessel] = await db
    .insert(s.component)
    .values({
      companyId: f.companyId,
      vesselId: f.vesselB.id,
      code: "B.ME",
      name: "Main engine of B",
      counterId: f.counters.otherVessel.id,
    })
    .returning();
  return { me: me!, cyl: cyl!, cyl3: cyl3!, ae1: ae1!, otherVessel: otherVessel!, spare: spare! };
}

/** Rows of every table the register writes, for the whole company. */
export async function registerRows(companyId: string) {
  const db = testDb();
  const n = async (table: typeof s.component | typeof s.counter | typeof s.counterSegment | typeof s.reading) => {
    const [row] = await db.select({ n: count() }).from(table).where(eq(table.companyId, companyId));
    return row?.n ?? 0;
  };
  return {
    components: await n(s.component),
    counters: await n(s.counter),
    segments: await n(s.counterSegment),
    readings: await n(s.reading),
  };
}

export async function componentById(id: string) {
  const [row] = await testDb().select().from(s.component).where(eq(s.component.id, id));
  return row;
}

export async function counterById(id: string) {
  const [row] = await testDb().select().from(s.counter).where(eq(s.counter.id, id));
  return row;
}
