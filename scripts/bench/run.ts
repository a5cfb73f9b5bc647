// The Hour log's route handlers on a vessel of 30 counters with a year of daily readings, each
// beside a bare SQL statement that reads or writes the same rows in the same run.
import { writeFileSync } from "node:fs";
import { Pool } from "pg";
import { databaseUrl } from "@/db/client";
import * as s from "@/db/schema";
import { shipClock, shipDay } from "@/server/format/hours";
import { createCompany, PASSWORD, testDb, closeTestDb } from "@/tests/support/fixtures";
import { api, signIn } from "@/tests/support/http";
import { markdown, measure, type Row } from "./measure";

const COUNTERS = 30;
const DAYS = 365;
const RUNS = 50;

const now = new Date();
const start = new Date(now.getTime() - (DAYS + 60) * 86_400_000);
const f = await createCompany("bench", start);
const db = testDb();
const vesselId = f.vesselA.id;
const tz = f.vesselA.timeZone;

const extra = await db
  .insert(s.counter)
  .values(Array.from({ length: COUNTERS - 2 }, (_, i) => ({ companyId: f.companyId, vesselId, name: `Bench counter ${i + 3}`, sortOrder: i + 2 })))
  .returning();
const counters = [f.counters.main, f.counters.gen, ...extra];
const rows: (typeof s.reading.$inferInsert)[] = [];
for (const [ci, c] of counters.entries()) {
  for (let d = 1; d <= DAYS; d++) {
    const value = 1000 * (ci + 1) + d * 20;
    rows.push({ companyId: f.companyId, vesselId, counterId: c.id, readAt: new Date(start.getTime() + d * 86_400_000), segment: 1, meterValue: value, totalHours: value });
  }
}
for (let i = 0; i < rows.length; i += 5000) await db.insert(s.reading).values(rows.slice(i, i + 5000));
const lastAt = new Date(start.getTime() + DAYS * 86_400_000);
console.log(`[bench] vessel with ${COUNTERS} counters and ${rows.length} readings`);

const session = await signIn(f.users.engineer.email, PASSWORD);
const pool = new Pool({ connectionString: databaseUrl(), max: 2 });
const results: Row[] = [];

results.push({
  what: `GET hour-log (${COUNTERS} counters with last reading)`,
  handler: await measure(RUNS, async () => {
    const r = await api(session, "GET", `/api/vessels/${vesselId}/hour-log`);
    if (r.status !== 200) throw new Error(`hour-log ${r.status}`);
  }),
  bare: await measure(RUNS, () =>
    pool.query(
      `select c.id, c.name, l.read_at, l.meter_value from counter c
       left join lateral (select read_at, meter_value from reading r where r.company_id = c.company_id and r.counter_id = c.id
                          order by read_at desc limit 1) l on true
       where c.company_id = $1 and c.vessel_id = $2 order by c.sort_order`,
      [f.companyId, vesselId],
    ),
  ),
});

results.push({
  what: "GET readings history (one counter, 90 days, daily series)",
  handler: await measure(RUNS, async () => {
    const r = await api(session, "GET", `/api/vessels/${vesselId}/readings?counterId=${f.counters.main.id}&days=90`);
    if (r.status !== 200) throw new Error(`history ${r.status}`);
  }),
  bare: await measure(RUNS, () =>
    pool.query(`select read_at, meter_value, total_hours from reading where company_id = $1 and counter_id = $2 and read_at >= now() - interval '91 days' order by read_at`, [
      f.companyId,
      f.counters.main.id,
    ]),
  ),
});

// Each batch an hour after the previous one, all 30 counters advancing 1 h.
let hour = 0;
results.push({
  what: `POST readings (batch of ${COUNTERS}, validated, one transaction)`,
  handler: await measure(RUNS, async () => {
    hour++;
    const at = new Date(lastAt.getTime() + hour * 3_600_000);
    const body = {
      shipDay: shipDay(at, tz),
      time: shipClock(at, tz),
      entries: counters.map((c, ci) => ({ counterId: c.id, value: 1000 * (ci + 1) + DAYS * 20 + hour })),
    };
    const r = await api(session, "POST", `/api/vessels/${vesselId}/readings`, body);
    if (r.status !== 201) throw new Error(`readings ${r.status} ${JSON.stringify(r.body)}`);
  }),
  bare: await measure(RUNS, async (i) => {
    const client = await pool.connect();
    try {
      await client.query("begin");
      const at = new Date(lastAt.getTime() + (1000 + i) * 60_000 + 30_000);
      await client.query(
        `insert into reading (company_id, vessel_id, counter_id, read_at, segment, meter_value, total_hours)
         select $1, $2, unnest($3::uuid[]), $4, 1, 1, 1`,
        [f.companyId, vesselId, counters.map((c) => c.id), at],
      );
      await client.query("rollback");
    } finally {
      client.release();
    }
  }),
});

const table = markdown(results);
console.log(`\n${table}\n`);
writeFileSync("bench-output/results.json", JSON.stringify({ at: now.toISOString(), results }, null, 2));
writeFileSync("bench-output/results.md", `${table}\n`);
await pool.end();
await closeTestDb();
