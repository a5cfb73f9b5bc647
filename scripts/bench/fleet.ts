// The worker and the Backlog at fleet scale: one vessel of 3,000 routines on 30 counters, and a
// fleet of 50 such vessels. Times the worker's recompute (first run, a rerun that changes nothing,
// a day later) one vessel and the whole fleet at a time, as one worker does, and the Backlog route
// handler beside a bare SELECT of the same rows in the same run. Appends to run.ts's results.
import { existsSync, readFileSync, writeFileSync } from "node:fs";
import { performance } from "node:perf_hooks";
import { sql } from "drizzle-orm";
import { Pool } from "pg";
import { databaseUrl } from "@/db/client";
import * as s from "@/db/schema";
import type { BacklogPage } from "@/server/backlog/contract";
import { recomputeVessel } from "@/server/scheduling/recompute";
import { seedSnapshots } from "@/db/seed/snapshots";
import { closeTestDb, createCompany, PASSWORD, testDb } from "@/tests/support/fixtures";
import { api, signIn } from "@/tests/support/http";
import { DAY, day, generateFleet, leaveFleet, ROUTINES, seconds } from "./fleet-data";
import { measure, type Timing } from "./measure";
import { openWorkOrders, timeSetBasedWrite } from "./set-based";

const RUNS = 100;

const now = new Date();
const db = testDb();
const f = await createCompany("fleet", now);
const companyId = f.companyId;

const { measured: one, fleet, generation } = await generateFleet(db, companyId, now);
const { components, readings: readingRows } = generation;


type Run = { what: string; seconds: number; created: number; updated: number; stateChanges: number; skipped: number };
const recompute: Run[] = [];
async function timeRecompute(what: string, ids: string[], at: Date): Promise<Run> {
  const run: Run = { what, seconds: 0, created: 0, updated: 0, stateChanges: 0, skipped: 0 };
  const start = performance.now();
  for (const id of ids) {
    const r = await recomputeVessel(db, companyId, id, at);
    run.created += r.created;
    run.updated += r.updated;
    run.stateChanges += r.stateChanges;
    run.skipped += r.skipped.length;
  }
  run.seconds = seconds(performance.now() - start);
  console.log(`[bench] ${what}: ${run.seconds} s (${run.created} created, ${run.updated} updated, ${run.stateChanges} state changes, ${run.skipped} skipped)`);
  recompute.push(run);
  return run;
}

const first = await timeRecompute("recompute one vessel, first run", [one], now);
if (first.created !== ROUTINES) throw new Error(`first run created ${first.created} work orders, not ${ROUTINES}`);
const again = await timeRecompute("recompute one vessel, rerun that changes nothing", [one], now);
if (again.created + again.updated + again.stateChanges !== 0) throw new Error("a rerun changed work orders");
const tomorrow = new Date(now.getTime() + DAY);
await timeRecompute("recompute one vessel, a day later", [one], tomorrow);
// The nightly fleet run is the day-later case; the first run is a fleet taken on.
await timeRecompute(`recompute the fleet of ${fleet.length}, sequential, first run`, fleet, now);
const today = await openWorkOrders(db, { companyId, vessels: fleet });
const nightly = await timeRecompute(`recompute the fleet of ${fleet.length}, sequential, a day later`, fleet, tomorrow);
const setBased = await timeSetBasedWrite(db, { companyId, vessels: fleet }, today, now, tomorrow);
// The same night again writes nothing: what is left is reading and planning, vessel by vessel.
const floor = await timeRecompute(`recompute the fleet of ${fleet.length}, a day later again (reads and plans, writes nothing)`, fleet, tomorrow);
if (floor.created + floor.updated + floor.stateChanges !== 0) throw new Error("the set-based write left work for the worker");
// Put the measured vessel back to today's figures for the Backlog.
await recomputeVessel(db, companyId, one, now);

const states = await db.execute<{ state: string; n: number }>(
  sql`select state, count(*)::int as n from work_order where vessel_id = ${one} group by state order by state`,
);
const stateCounts = Object.fromEntries(states.rows.map((r) => [r.state, r.n]));
console.log(`[bench] states of the measured vessel: ${JSON.stringify(stateCounts)}`);

// The Backlog, over HTTP as the engineer of the measured vessel, on statistics that know the
// 153,000 work orders just written.
await db.execute(sql`analyze`);
await db.insert(s.vesselAssignment).values({ companyId, userId: f.users.engineer.id, vesselId: one });
const session = await signIn(f.users.engineer.email, PASSWORD);
const pool = new Pool({ connectionString: databaseUrl(), max: 2 });

// The route handler's page query written out by hand: same filters, order and limit.
const PAGE_SQL = (extra: string) => `
  select w.*, c.code as component_code, c.name as component_name,
         exists (select 1 from completion k where k.company_id = w.company_id and k.work_order_id = w.id
                 and k.status = 'awaiting-approval') as awaiting_approval
  from work_order w join component c on c.id = w.component_id
  where w.company_id = $1 and w.vessel_id = $2 and w.state = any($3::work_order_state[]) ${extra}
  order by case w.state when 'out-of-tolerance' then 0 when 'late' then 1 when 'window-open' then 2
                        when 'deferred' then 3 when 'scheduled' then 4 else 5 end,
           w.due_date asc nulls last, w.number asc
  limit 50 offset 0`;

type Backlog = { what: string; handler: Timing; bare: Timing; rows: number };
const backlog: Backlog[] = [];
async function timeBacklog(what: string, query: string, states: string[], extra: string) {
  let rows = 0;
  const handler = await measure(RUNS, async () => {
    const r = await api<BacklogPage>(session, "GET", `/api/vessels/${one}/backlog${query}`);
    if (r.status !== 200) throw new Error(`backlog ${r.status}`);
    rows = r.body.items.length;
  });
  let bareRows = 0;
  const bare = await measure(RUNS, async () => {
    bareRows = (await pool.query(PAGE_SQL(extra), [companyId, one, states])).rowCount ?? 0;
  });
  if (rows !== bareRows) throw new Error(`${what}: handler gave ${rows} rows, bare SELECT ${bareRows}`);
  backlog.push({ what, handler, bare, rows });
}
await timeBacklog(
  "GET backlog, default (open states, most urgent first, page of 50)",
  "",
  ["out-of-tolerance", "late", "window-open", "deferred", "scheduled"],
  "",
);
await timeBacklog(
  "GET backlog, state=out-of-tolerance,late&critical=true",
  "?state=out-of-tolerance,late&critical=true",
  ["out-of-tolerance", "late"],
  "and w.critical = true",
);

// The chief engineer's planning on the measured vessel: the Calendar of its busiest month, and the
// proposed work package for a port stay, each beside a bare SELECT of the rows it reads.
await db.insert(s.vesselAssignment).values({ companyId, userId: f.users["chief-engineer"].id, vesselId: one });
const chief = await signIn(f.users["chief-engineer"].email, PASSWORD);
const busiest = await pool.query<{ month: string }>(
  `select to_char(date_trunc('month', due_date at time zone 'UTC'), 'YYYY-MM-DD') as month
   from work_order where company_id = $1 and vessel_id = $2 and due_date is not null
   group by 1 order by count(*) desc limit 1`,
  [companyId, one],
);
const monthStart = busiest.rows[0]!.month;
const monthEnd = day(new Date(new Date(`${monthStart}T00:00:00Z`).getTime() + 41 * DAY));
const CALENDAR_SQL = `
  select w.id, w.number, w.title, w.state, w.due_date, w.projected_date, w.planned_date, w.governing,
         w.plan_from, w.plan_until, w.critical, w.class_related, w.needs_engine_stop
  from work_order w
  where w.company_id = $1 and w.vessel_id = $2
    and coalesce(w.planned_date, (coalesce(w.deferred_due_date, w.due_date) at time zone 'UTC')::date) between $3 and $4`;
let calendarRows = 0;
const calendarTiming = {
  handler: await measure(RUNS, async () => {
    const r = await api<{ workOrders?: unknown[]; events?: unknown[] }>(
      chief,
      "GET",
      `/api/vessels/${one}/calendar?start=${monthStart}&end=${monthEnd}`,
    );
    if (r.status !== 200) throw new Error(`calendar ${r.status} ${JSON.stringify(r.body)}`);
  }),
  bare: await measure(RUNS, async () => {
    calendarRows = (await pool.query(CALENDAR_SQL, [companyId, one, monthStart, monthEnd])).rowCount ?? 0;
  }),
};
backlog.push({
  what: `GET calendar, the busiest 6 weeks (from ${monthStart})`,
  ...calendarTiming,
  rows: calendarRows,
});

const stayStart = new Date(now.getTime() + 5 * DAY);
const [stay] = await db
  .insert(s.portStay)
  .values({
    companyId,
    vesselId: one,
    port: "Bench harbour",
    arrivesAt: stayStart,
    departsAt: new Date(stayStart.getTime() + 2.5 * DAY),
    workdayFrom: 8 * 60,
    workdayTo: 18 * 60,
    engineStopFrom: stayStart,
    engineStopTo: new Date(stayStart.getTime() + DAY),
    crew: [
      { rank: "chief-engineer", count: 1 },
      { rank: "second-engineer", count: 1 },
      { rank: "third-engineer", count: 1 },
      { rank: "motorman", count: 2 },
      { rank: "electro-technical-officer", count: 1 },
    ],
  })
  .returning();
const CANDIDATES_SQL = `
  select id, number, title, state, rank, estimated_man_hours, needs_engine_stop, critical, class_related,
         due_date, deferred_due_date, out_of_tolerance_at, plan_from, plan_until
  from work_order where company_id = $1 and vessel_id = $2 and state <> 'done'`;
let candidates = 0;
backlog.push({
  what: `POST port-stay proposal (3-day stay, ${ROUTINES.toLocaleString("en")} open work orders considered)`,
  handler: await measure(RUNS, async () => {
    const r = await api(chief, "POST", `/api/vessels/${one}/port-stays/${stay!.id}/proposal`);
    if (r.status !== 200) throw new Error(`proposal ${r.status} ${JSON.stringify(r.body)}`);
  }),
  bare: await measure(RUNS, async () => {
    candidates = (await pool.query(CANDIDATES_SQL, [companyId, one])).rowCount ?? 0;
  }),
  rows: candidates,
});

// The Fleet board for the superintendent: every vessel's figures and a 90-day trend, read from the
// worker's snapshots (recompute wrote today's; 89 earlier days are generated as the demo does).
await seedSnapshots(db, companyId, now);
await db.execute(sql`analyze vessel_snapshot`);
const office = await signIn(f.users.superintendent.email, PASSWORD);
const trendFrom = day(new Date(now.getTime() - 89 * DAY));
let boardVessels = 0;
backlog.push({
  what: "GET fleet board (every vessel of the company with its 90-day trend)",
  handler: await measure(RUNS, async () => {
    const r = await api<{ vessels: unknown[] }>(office, "GET", "/api/fleet/board");
    if (r.status !== 200) throw new Error(`board ${r.status} ${JSON.stringify(r.body)}`);
    boardVessels = r.body.vessels.length;
  }),
  bare: await measure(RUNS, () =>
    Promise.all([
      pool.query(
        `select v.id, v.name, v.code, co.missing_readings_hours, s.*
         from vessel v join company co on co.id = v.company_id
         left join lateral (select * from vessel_snapshot vs where vs.company_id = v.company_id and vs.vessel_id = v.id
                            order by vs.day desc limit 1) s on true
         where v.company_id = $1 and v.retired_at is null`,
        [companyId],
      ),
      pool.query(
        `select vessel_id, day, late, out_of_tolerance, completed90, on_time_rate
         from vessel_snapshot where company_id = $1 and day >= $2::date order by day`,
        [companyId, trendFrom],
      ),
      pool.query(
        `select d.*, w.number, w.title, w.state, w.critical, w.class_related, v.name, v.code
         from deferral d join work_order w on w.id = d.work_order_id join vessel v on v.id = d.vessel_id
         where d.company_id = $1 and w.company_id = $1 and d.status = 'pending' order by d.requested_at desc`,
        [companyId],
      ),
    ]),
  ),
  get rows() {
    return boardVessels; // vessels on the board
  },
});

// The office's overdue list: every late or out-of-tolerance work order of the 50 vessels, the
// worst first, beside the bare SELECT of the same rows in the same order.
let overdueRows = 0;
backlog.push({
  what: "GET fleet overdue list (every late or out-of-tolerance work order of the fleet)",
  handler: await measure(RUNS, async () => {
    const r = await api<{ items: unknown[] }>(office, "GET", "/api/fleet/overdue");
    if (r.status !== 200) throw new Error(`overdue ${r.status} ${JSON.stringify(r.body)}`);
    overdueRows = r.body.items.length;
  }),
  bare: await measure(RUNS, () =>
    pool.query(
      `select w.*, v.name, v.code, c.code as component_code, c.name as component_name
       from work_order w join vessel v on v.id = w.vessel_id join component c on c.id = w.component_id
       where w.company_id = $1 and v.company_id = $1 and v.retired_at is null
         and w.state in ('out-of-tolerance', 'late')
       order by case w.state when 'out-of-tolerance' then 0 else 1 end, (w.critical or w.class_related) desc,
                coalesce(w.deferred_due_date, w.due_date) asc nulls last, w.state_changed_at, w.number
       limit 2001`,
      [companyId],
    ),
  ),
  get rows() {
    return overdueRows;
  },
});

const ms = (x: Timing) => `${x.p50} / ${x.p95}`;
const table = [
  `| what (vessels of ${ROUTINES.toLocaleString("en")} routines on 30 counters) | time, or route handler p50 / p95 (ms) | bare SQL p50 / p95 (ms) | ratio (p50) |`,
  "| --- | --- | --- | --- |",
  ...recompute.map((r) => {
    const per = r.what.includes("fleet") ? `, ${seconds((r.seconds * 1000) / fleet.length)} s a vessel` : "";
    return `| ${r.what}: ${r.created} created, ${r.updated} updated, ${r.stateChanges} state changes | ${r.seconds} s${per} | — | — |`;
  }),
  `| the same writes for the fleet of ${fleet.length} set-based (one UPDATE … FROM unnest, one INSERT of the state changes): ${setBased.rows} updated, ${setBased.stateChanges} state changes | ${setBased.seconds} s | — | sequential ${(nightly.seconds / setBased.seconds).toFixed(1)}× |`,
  ...backlog.map((b) => `| ${b.what}: ${b.rows} rows | ${ms(b.handler)} | ${ms(b.bare)} | ${(b.handler.p50 / b.bare.p50).toFixed(1)}× |`),
].join("\n");
const note = `Generated ${generation.vessels} vessels (${generation.routines.toLocaleString("en")} routines, ${components.toLocaleString("en")} components, ${readingRows.toLocaleString("en")} readings) in ${generation.seconds} s, not counted above. States of the measured vessel: ${Object.entries(stateCounts).map(([k, v]) => `${k} ${v}`).join(", ")}.`;
console.log(`\n${table}\n\n${note}\n`);

// run.ts writes the files first; this run adds to them.
const jsonPath = "bench-output/results.json";
const earlier: Record<string, unknown> = existsSync(jsonPath) ? JSON.parse(readFileSync(jsonPath, "utf8")) : {};
writeFileSync(jsonPath, JSON.stringify({ ...earlier, fleet: { at: now.toISOString(), generation, recompute, setBased, backlog, states: stateCounts } }, null, 2));
const mdPath = "bench-output/results.md";
writeFileSync(mdPath, `${existsSync(mdPath) ? readFileSync(mdPath, "utf8") : ""}\n${table}\n\n${note}\n`);
leaveFleet({
  companyId,
  measured: one,
  emails: { engineer: f.users.engineer.email, chiefEngineer: f.users["chief-engineer"].email, superintendent: f.users.superintendent.email },
});
await pool.end();
await closeTestDb();
