// The stores on board at a real fleet's size (issue 13): a catalogue of 5,000 parts, three store
// locations and a year of movements on one vessel (deliveries, weekly use, quarterly counts, moves:
// about 100,000 rows), then `GET /api/vessels/[id]/stores` — every part's quantity as the sum of its
// movements, per location, with the minimums — timed over HTTP beside the bare SQL that sums the same
// movements (`select part, location, sum(quantity) … group by`) in the same run.
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
await closeTestDb();

const md = [
  `| stores of one vessel: ${PARTS.toLocaleString("en")} parts, ${rows.length.toLocaleString("en")} movements over a year (median of ${RUNS}) | ms | ÷ floor |`,
  "| --- | --- | --- |",
  `| GET /api/vessels/[id]/stores (every part's quantity per location, minimums, the JSON) | ${route.toFixed(0)} | ${(route / bare).toFixed(1)}× |`,
  `| floor: the bare SELECT … SUM(quantity) GROUP BY part, location | ${bare.toFixed(0)} | 1× |`,
].join("\n");
writeFileSync("bench-output/parts.md", md + "\n");
writeFileSync("bench-output/parts.json", JSON.stringify({ parts: PARTS, movements: rows.length, route, bare }, null, 2));
console.log(md);
