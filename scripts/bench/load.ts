// The routes a ship and the office use most, under load: autocannon at 20 connections from this
// process against the production build, each route for 10 s, on the measured vessel of 3,000
// routines and the company's fleet of 50. Every figure is also given as a ratio to GET /api/health
// (no session, one database round trip: the floor) measured in the same run, so runs on a busier or
// quieter machine compare. Runs on the fleet fleet.ts left in the database, or generates it.
import { writeFileSync } from "node:fs";
import { and, eq, sql } from "drizzle-orm";
import type { Db } from "@/db/client";
import * as s from "@/db/schema";
import { seedSnapshots } from "@/db/seed/snapshots";
import { shipClock, shipDay } from "@/server/format/hours";
import { recomputeVessel } from "@/server/scheduling/recompute";
import { closeTestDb, createCompany, PASSWORD, testDb } from "@/tests/support/fixtures";
import { BASE_URL, signIn } from "@/tests/support/http";
import { drive, type LoadFigures } from "./drive";
import { DAY, day, findFleet, type FleetHandoff, generateFleet, leaveFleet } from "./fleet-data";

const CONNECTIONS = 20;
const SECONDS = 10;
/** Requests of the warm-up: two per connection. */
const WARM_UP = 2 * CONNECTIONS;
const MAX_REQUESTS = 5_000;

/** Alone (BENCH_ONLY=load), the fleet as fleet.ts leaves it: recomputed today, snapshots, people. */
async function prepareFleet(db: Db): Promise<FleetHandoff> {
  const now = new Date();
  const f = await createCompany("load", now);
  const { measured, fleet } = await generateFleet(db, f.companyId, now);
  for (const id of [measured, ...fleet]) await recomputeVessel(db, f.companyId, id, now);
  await seedSnapshots(db, f.companyId, now);
  for (const user of [f.users.engineer, f.users["chief-engineer"]]) {
    await db.insert(s.vesselAssignment).values({ companyId: f.companyId, userId: user.id, vesselId: measured });
  }
  await db.execute(sql`analyze`);
  const handoff = {
    companyId: f.companyId,
    measured,
    emails: {
      engineer: f.users.engineer.email,
      chiefEngineer: f.users["chief-engineer"].email,
      superintendent: f.users.superintendent.email,
    },
  };
  leaveFleet(handoff);
  return handoff;
}

const db = testDb();
const fleet = (await findFleet(db)) ?? (await prepareFleet(db));
const { companyId, measured } = fleet;
const engineer = await signIn(fleet.emails.engineer, PASSWORD);
const chief = await signIn(fleet.emails.chiefEngineer, PASSWORD);
const office = await signIn(fleet.emails.superintendent, PASSWORD);

// The Calendar's busiest six weeks, as fleet.ts times it.
const busiest = await db.execute<{ month: string }>(sql`
  select to_char(date_trunc('month', due_date at time zone 'UTC'), 'YYYY-MM-DD') as month
  from work_order where company_id = ${companyId} and vessel_id = ${measured} and due_date is not null
  group by 1 order by count(*) desc limit 1`);
const monthStart = busiest.rows[0]!.month;
const monthEnd = day(new Date(new Date(`${monthStart}T00:00:00Z`).getTime() + 41 * DAY));

// Readings under load must all be accepted: each batch is a minute earlier than the one before,
// before the counters' first readings, every meter at its first value (the engine stopped then),
// which the domain accepts as back-filled readings however the requests overtake each other.
const first = await db.execute<{ counter_id: string; read_at: Date; meter_value: number }>(sql`
  select distinct on (counter_id) counter_id, read_at, meter_value from reading
  where company_id = ${companyId} and vessel_id = ${measured} order by counter_id, read_at`);
const [v] = await db
  .select({ timeZone: s.vessel.timeZone })
  .from(s.vessel)
  .where(and(eq(s.vessel.companyId, companyId), eq(s.vessel.id, measured)));
const earliest = Math.min(...first.rows.map((r) => new Date(r.read_at).getTime()));
const entries = first.rows.map((r) => ({ counterId: r.counter_id, value: Number(r.meter_value) }));
let minutesBack = 0;
function readingBatch(): string {
  const at = new Date(earliest - ++minutesBack * 60_000);
  return JSON.stringify({ shipDay: shipDay(at, v!.timeZone), time: shipClock(at, v!.timeZone), entries });
}

type Route = { what: string; path: string; cookie?: string; expect?: number; body?: () => string };
const vesselPath = `/api/vessels/${measured}`;
const routes: Route[] = [
  { what: "GET /api/health (no session: the floor)", path: "/api/health" },
  { what: "GET /api/account/me (session only)", path: "/api/account/me", cookie: engineer.cookie },
  { what: "GET hour-log (30 counters)", path: `${vesselPath}/hour-log`, cookie: engineer.cookie },
  { what: "GET backlog (default page of 50)", path: `${vesselPath}/backlog`, cookie: engineer.cookie },
  {
    what: `GET calendar (busiest 6 weeks from ${monthStart})`,
    path: `${vesselPath}/calendar?start=${monthStart}&end=${monthEnd}`,
    cookie: chief.cookie,
  },
  { what: "GET fleet board (53 vessels, 90-day trend)", path: "/api/fleet/board", cookie: office.cookie },
  { what: "GET fleet overdue list (first 2,000 rows)", path: "/api/fleet/overdue", cookie: office.cookie },
  // Last: every batch asks the worker to recompute the vessel, which it then does in the background.
  {
    what: "POST readings (batch of 30, back-filled)",
    path: `${vesselPath}/readings`,
    cookie: engineer.cookie,
    expect: 201,
    body: readingBatch,
  },
];

function run(r: Route, amount: number): Promise<LoadFigures> {
  return drive({
    path: r.path,
    method: r.body ? "POST" : "GET",
    headers: {
      origin: BASE_URL,
      ...(r.cookie ? { cookie: r.cookie } : {}),
      ...(r.body ? { "content-type": "application/json" } : {}),
    },
    body: r.body,
    connections: CONNECTIONS,
    amount,
    expect: r.expect ?? 200,
  });
}

// A fixed number of requests, every answer awaited: a run cut at a time would leave its slow
// requests running on the server into the next route's run. The warm-up's rate sets the number
// so that each route runs about SECONDS.
async function measureRoute(r: Route): Promise<LoadFigures> {
  const warm = await run(r, WARM_UP);
  const amount = Math.min(MAX_REQUESTS, Math.max(WARM_UP, Math.round(warm.requestsPerSecond * SECONDS)));
  return run(r, amount);
}

const measuredRows: { what: string; figures: LoadFigures }[] = [];
for (const r of routes) {
  const figures = await measureRoute(r);
  // Kept and shown rather than thrown, so the other routes are still measured.
  if (figures.unexpected > 0 || figures.errors > 0)
    console.error(`[bench] ${r.what} FAILED: ${JSON.stringify(figures)}`);
  console.log(
    `[bench] ${r.what}: ${figures.requestsPerSecond} req/s, p50 ${figures.p50} ms, p95 ${figures.p95} ms, p99 ${figures.p99} ms`,
  );
  measuredRows.push({ what: r.what, figures });
}
// The floor again once the worker has recomputed what the readings asked for: how far the
// machine's other load moved it during the run.
for (let waited = 0; waited < 60; waited++) {
  const busy = await db.execute<{ n: number }>(sql`
    select count(*)::int as n from pgboss.job where name = 'vessel-recompute' and state in ('created', 'retry', 'active')`);
  if (busy.rows[0]!.n === 0) break;
  await new Promise((r) => setTimeout(r, 1000));
}
const floorAgain = await measureRoute(routes[0]!);
measuredRows.push({ what: "GET /api/health again, at the end (the floor's drift)", figures: floorAgain });

const stored = await db.execute<{ n: number }>(sql`
  select count(*)::int as n from reading where company_id = ${companyId} and vessel_id = ${measured} and read_at < ${new Date(earliest)}::timestamptz`);
const posted = measuredRows.at(-2)!.figures;
const failed = measuredRows.filter((m) => m.figures.unexpected > 0 || m.figures.errors > 0);
console.log(`[bench] ${stored.rows[0]!.n} back-filled readings stored`);

const floor = measuredRows[0]!.figures;
const times = (x: number, f: number) => `${x} (${(x / f).toFixed(1)}×)`;
const md = [
  `| route (${CONNECTIONS} connections) | answers | req/s (share of floor) | p50 ms (× floor) | p95 ms (× floor) | p99 ms (× floor) |`,
  "| --- | --- | --- | --- | --- | --- |",
  ...measuredRows.map(
    ({ what, figures: x }) =>
      `| ${what} | ${x.requests} | ${x.requestsPerSecond} (${(x.requestsPerSecond / floor.requestsPerSecond).toFixed(2)}) | ${times(x.p50, floor.p50)} | ${times(x.p95, floor.p95)} | ${times(x.p99, floor.p99)} |`,
  ),
  "",
  ...failed.map(
    ({ what, figures: x }) =>
      `FAILED: ${what}: ${x.unexpected} answers not as expected, ${x.errors} errors; first: ${x.firstUnexpected ?? "—"}`,
  ),
  `POST readings: ${posted.requests} batches answered in the measured run; ${stored.rows[0]!.n / entries.length} back-filled batches of ${entries.length} stored in all, warm-up included (${minutesBack} sent).`,
].join("\n");
writeFileSync("bench-output/load.md", md + "\n");
writeFileSync(
  "bench-output/load.json",
  JSON.stringify(
    {
      at: new Date().toISOString(),
      connections: CONNECTIONS,
      seconds: SECONDS,
      routes: measuredRows,
      backFilledReadings: stored.rows[0]!.n,
    },
    null,
    2,
  ),
);
console.log(`\n${md}\n`);
await closeTestDb();
