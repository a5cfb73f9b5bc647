// The stores on board at a real fleet's size (issue 13): a catalogue of 5,000 parts, three store
// locations and a year of movements on one vessel (deliveries, weekly use, quarterly counts, moves:
// about 100,000 rows), then `GET /api/vessels/[id]/stores` — every part's quantity as the sum of its
// movements, per location, with the minimums — timed over HTTP beside the bare SQL that sums the same
// movements (`select part, location, sum(quantity) … group by`) in the same run. Then a 3-day port
// stay whose accepted package holds 300 jobs needing 3 parts each: `GET …/port-stays/[id]/parts`
// (the package's needs against the stores and the open requisitions, back to the minimums) beside
// the bare SQL that adds up the package's needs and the stock.
import { writeFileSync } from "node:fs";
import { performance } from "node:perf_hooks";
import { sql } from "drizzle-orm";
import * as s from "@/db/schema";
import { seededRandom } from "@/server/seeded-random";
import { closeTestDb, createCompany, PASSWORD, testDb } from "@/tests/support/fixtures";
import { api, signIn } from "@/tests/support/http";

const PARTS = 5_000;
const RUNS = 9;
const rnd = seededRandom(13);
const f = await createCompany("bench-parts");
const db = testDb();
const companyId = f.companyId;
const vesselId = f.vesselA.id;

const parts = await db
  .insert(s.part)
  .values(Array.from({ length: PARTS }, (_, i) => ({ companyId, number: `BP-${String(i + 1).padStart(5, "0")}`, description: `Bench part ${i + 1}`, unit: i % 10 === 0 ? ("litre" as const) : ("piece" as const), critical: i % 7 === 0, minimumOnBoard: i % 7 === 0 ? 4 : 0 })))
  .returning({ id: s.part.id });
const locations = await db
  .insert(s.storeLocation)
  .values([{ companyId, vesselId, store: "Engine store", rack: "1" }, { companyId, vesselId, store: "Engine store", rack: "2" }, { companyId, vesselId, store: "Workshop" }])
  .returning({ id: s.storeLocation.id });

// A year: each part received twice, used most weeks a little, counted each quarter, sometimes moved.
const year = Date.now() - 365 * 86_400_000;
const rows: (typeof s.stockMovement.$inferInsert)[] = [];
for (const [i, p] of parts.entries()) {
  const home = locations[i % 2]!.id;
  const at = (day: number) => new Date(year + day * 86_400_000);
  rows.push({ companyId, vesselId, partId: p.id, locationId: home, kind: "received", quantity: 20, movedAt: at(1) });
  rows.push({ companyId, vesselId, partId: p.id, locationId: home, kind: "received", quantity: 20, movedAt: at(180) });
  for (let week = 1; week < 52; week += 1 + Math.floor(rnd() * 4)) rows.push({ companyId, vesselId, partId: p.id, locationId: home, kind: "used", quantity: -1, movedAt: at(week * 7) });
  for (const q of [90, 270]) rows.push({ companyId, vesselId, partId: p.id, locationId: home, kind: "counted", quantity: rnd() < 0.5 ? 1 : -1, reason: "Quarterly count", movedAt: at(q) });
  if (i % 5 === 0) {
    rows.push({ companyId, vesselId, partId: p.id, locationId: home, kind: "moved-out", quantity: -2, movedAt: at(300) });
    rows.push({ companyId, vesselId, partId: p.id, locationId: locations[2]!.id, kind: "moved-in", quantity: 2, movedAt: at(300) });
  }
}
for (let i = 0; i < rows.length; i += 5_000) await db.insert(s.stockMovement).values(rows.slice(i, i + 5_000));
await db.execute(sql`analyze stock_movement`);

// A port stay whose accepted package holds 300 jobs, each needing 3 of the catalogue's parts.
const JOBS = 300;
const [unit] = await db.insert(s.component).values({ companyId, vesselId, code: "BENCH", name: "Bench machinery" }).returning({ id: s.component.id });
const routines = await db
  .insert(s.routine)
  .values(Array.from({ length: JOBS }, (_, i) => ({ companyId, vesselId, componentId: unit!.id, title: `Bench job ${i + 1}`, calendarRule: "FREQ=YEARLY" })))
  .returning({ id: s.routine.id });
await db.insert(s.routinePart).values(
  routines.flatMap((r, i) => [0, 1, 2].map((k) => ({ companyId, routineId: r.id, partId: parts[(i * 7 + k * 1_231) % PARTS]!.id, quantity: 1 + k }))),
);
const now = new Date();
const jobs = await db
  .insert(s.workOrder)
  .values(
    routines.map((r, i) => ({
      companyId,
      vesselId,
      routineId: r.id,
      componentId: unit!.id,
      number: `WO-ALPHA-${String(i + 1).padStart(5, "0")}`,
      occurrence: 1,
      title: `Bench job ${i + 1}`,
      state: "window-open" as const,
      stateChangedAt: now,
      governing: "calendar" as const,
      rank: "motorman",
      computedAt: now,
    })),
  )
  .returning({ id: s.workOrder.id });
const [stay] = await db
  .insert(s.portStay)
  .values({ companyId, vesselId, port: "Bench port", arrivesAt: new Date(now.getTime() + 5 * 86_400_000), departsAt: new Date(now.getTime() + 8 * 86_400_000) })
  .returning({ id: s.portStay.id });
await db.insert(s.workPackageItem).values(jobs.map((w) => ({ companyId, vesselId, portStayId: stay!.id, workOrderId: w.id, plannedDate: "2030-01-01", reason: "Bench" })));
await db.execute(sql`analyze`);

const session = await signIn(f.users.viewer.email, PASSWORD);
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
async function time(run: () => Promise<unknown>): Promise<number> {
  await run(); // warm-up
  const ms: number[] = [];
  for (let i = 0; i < RUNS; i += 1) {
    const start = performance.now();
    await run();
    ms.push(performance.now() - start);
  }
  return median(ms);
}
const route = await time(async () => {
  const res = await api<{ lines: unknown[] }>(session, "GET", `/api/vessels/${vesselId}/stores`);
  if (res.status !== 200 || res.body.lines.length !== PARTS) throw new Error(`stores answered ${res.status} with ${res.body.lines?.length} lines`);
});
const bare = await time(() =>
  db.execute(sql`select part_id, location_id, sum(quantity) from stock_movement where company_id = ${companyId} and vessel_id = ${vesselId} group by part_id, location_id`),
);
const stayRoute = await time(async () => {
  const res = await api<{ jobs: number; lines: unknown[] }>(session, "GET", `/api/vessels/${vesselId}/port-stays/${stay!.id}/parts`);
  if (res.status !== 200 || res.body.jobs !== JOBS) throw new Error(`stay parts answered ${res.status} with ${res.body.jobs} jobs`);
});
const stayBare = await time(() =>
  Promise.all([
    db.execute(sql`select rp.part_id, sum(rp.quantity) from work_package_item i join work_order w on w.id = i.work_order_id
      join routine_part rp on rp.routine_id = w.routine_id where i.company_id = ${companyId} and i.port_stay_id = ${stay!.id} group by rp.part_id`),
    db.execute(sql`select part_id, sum(quantity) from stock_movement where company_id = ${companyId} and vessel_id = ${vesselId} group by part_id`),
  ]),
);
await closeTestDb();

const md = [
  `| stores of one vessel: ${PARTS.toLocaleString("en")} parts, ${rows.length.toLocaleString("en")} movements over a year (median of ${RUNS}) | ms | ÷ floor |`,
  "| --- | --- | --- |",
  `| GET /api/vessels/[id]/stores (every part's quantity per location, minimums, the JSON) | ${route.toFixed(0)} | ${(route / bare).toFixed(1)}× |`,
  `| floor: the bare SELECT … SUM(quantity) GROUP BY part, location | ${bare.toFixed(0)} | 1× |`,
  `| GET …/port-stays/[id]/parts: a package of ${JOBS} jobs × 3 parts against the stores, the open requisitions and the minimums | ${stayRoute.toFixed(0)} | ${(stayRoute / stayBare).toFixed(1)}× |`,
  `| floor: the bare SELECTs of the package's needs (SUM … GROUP BY part) and the stock per part | ${stayBare.toFixed(0)} | 1× |`,
].join("\n");
writeFileSync("bench-output/parts.md", md + "\n");
writeFileSync("bench-output/parts.json", JSON.stringify({ parts: PARTS, movements: rows.length, route, bare, jobs: JOBS, stayRoute, stayBare }, null, 2));
console.log(md);
