// Importing a vessel's plan (issue 12): the bench vessel's register, counters, 3,000 routines, a
// last-done row per routine and a year of daily readings of every counter, as five CSV files and as
// one workbook, previewed and applied over HTTP
// into empty vessels, beside a floor measured in the same run: one INSERT … SELECT FROM unnest of
// the same component, routine and reading rows into temporary tables (what the database needs at least).
import { writeFileSync } from "node:fs";
import { performance } from "node:perf_hooks";
import ExcelJS from "exceljs";
import * as s from "@/db/schema";
import { closeTestDb, createCompany, PASSWORD, testDb } from "@/tests/support/fixtures";
import { BASE_URL, signIn } from "@/tests/support/http";
import { seededRandom } from "@/server/seeded-random";

const COUNTERS = 30;
const COMPONENTS = 612;
const ROUTINES = 3_000;
const RUNS = 3;
const rnd = seededRandom(12);

const counters = Array.from({ length: COUNTERS }, (_, i) => ({ counter: `Counter ${i + 1}`, planned_hours_per_day: String(6 + (i % 18)) }));
const components = Array.from({ length: COMPONENTS }, (_, i) => {
  const system = i % COUNTERS;
  const top = i < COUNTERS;
  return {
    code: top ? `SYS${system + 1}` : `SYS${system + 1}.P${Math.floor(i / COUNTERS)}`,
    name: top ? `System ${system + 1}` : `Part ${Math.floor(i / COUNTERS)} of system ${system + 1}`,
    parent: top ? "" : `SYS${system + 1}`,
    critical: i % 7 === 0 ? "yes" : "no",
    counter: top ? `Counter ${system + 1}` : "",
  };
});
const teams = ["second engineer", "third engineer; motorman", "second engineer; motorman x2", "fourth engineer", "electro-technical officer"];
const routines = Array.from({ length: ROUTINES }, (_, i) => {
  const c = components[i % COMPONENTS]!;
  const kind = i % 5; // 0,1 hours; 2,3 calendar; 4 both
  return {
    code: `${c.code}/R${i + 1}`,
    component: c.code,
    title: `Routine ${i + 1} on ${c.name}`,
    every_hours: kind < 2 || kind === 4 ? String([500, 1000, 2000, 4000, 8000][i % 5]) : "",
    every: kind >= 2 ? ["every month", "every 3 months", "every 6 months", "every year", "every 2 weeks on Monday"][i % 5]! : "",
    team: teams[i % teams.length]!,
    elapsed_hours: String(1 + (i % 8)),
    engine_stop: i % 11 === 0 ? "yes" : "no",
    critical: i % 9 === 0 ? "yes" : "no",
    checklist: "Isolate | Inspect | Record",
  };
});
const lastDone = routines.map((r, i) => ({
  routine: r.code,
  done_on: `2026-${String(1 + (i % 10)).padStart(2, "0")}-${String(1 + Math.floor(rnd() * 27)).padStart(2, "0")}`,
  counter_hours: r.every_hours ? String(1000 + (i % 500)) : "",
}));
// A year of daily readings at 09:00 UTC (the bench vessels keep UTC), the last one yesterday.
const DAYS = 365;
const firstDay = Date.UTC(new Date().getUTCFullYear(), new Date().getUTCMonth(), new Date().getUTCDate()) - DAYS * 86_400_000;
const readings = counters.flatMap((c, i) => {
  let meter = 1000 + i * 250;
  return Array.from({ length: DAYS }, (_, d) => {
    if (d > 0) meter += Math.round(Number(c.planned_hours_per_day) * (0.5 + rnd() * 0.5) * 10) / 10;
    const day = new Date(firstDay + d * 86_400_000).toISOString().slice(0, 10);
    return { counter: c.counter, read_at: `${day} 09:00`, value: meter.toFixed(1) };
  });
});
const kinds = { components, counters, routines, "last-done": lastDone, readings } as const;

const csvOf = (rows: Record<string, string>[]) => {
  const head = Object.keys(rows[0]!);
  const q = (v: string) => (/[",\n]/.test(v) ? `"${v.replaceAll('"', '""')}"` : v);
  return [head.join(","), ...rows.map((r) => head.map((h) => q(r[h] ?? "")).join(","))].join("\n");
};
const csvFiles = Object.entries(kinds).map(([kind, rows]) => ({ name: `${kind}.csv`, bytes: new TextEncoder().encode(csvOf(rows as Record<string, string>[])) }));
const book = new ExcelJS.Workbook();
for (const [kind, rows] of Object.entries(kinds)) {
  const head = Object.keys((rows as Record<string, string>[])[0]!);
  const ws = book.addWorksheet(kind);
  ws.addRow(head);
  for (const r of rows as Record<string, string>[]) ws.addRow(head.map((h) => r[h] ?? ""));
}
const xlsx = [{ name: "bench-plan.xlsx", bytes: new Uint8Array(await book.xlsx.writeBuffer()) }];

const f = await createCompany("bench-import");
const admin = await signIn(f.users.admin.email, PASSWORD);
const db = testDb();
let n = 0;
/** A valid IMO number: six digits and their check digit (7·d1 + 6·d2 + … + 2·d6, last digit). */
function imo(seed: number): string {
  const six = String(300000 + ((seed * 7919 + Math.floor(rnd() * 1000)) % 600000)).slice(0, 6);
  const sum = [7, 6, 5, 4, 3, 2].reduce((acc, w, i) => acc + w * Number(six[i]), 0);
  return `${six}${sum % 10}`;
}
async function emptyVessel(): Promise<string> {
  n += 1;
  const [v] = await db
    .insert(s.vessel)
    .values({ companyId: f.companyId, name: `Import bench ${n}`, code: `IB${n}`, imoNumber: imo(n), timeZone: "UTC" })
    .returning();
  return v!.id;
}

async function post(vesselId: string, path: string, files: { name: string; bytes: Uint8Array }[]) {
  const form = new FormData();
  for (const x of files) form.append("file", new Blob([x.bytes as Uint8Array<ArrayBuffer>]), x.name);
  const start = performance.now();
  const res = await fetch(`${BASE_URL}/api/vessels/${vesselId}/import${path}`, { method: "POST", headers: { origin: BASE_URL, cookie: admin.cookie }, body: form });
  const body = (await res.json()) as { problems?: unknown[]; counts?: unknown; detail?: string };
  const ms = performance.now() - start;
  if (res.status >= 300 || (body.problems && body.problems.length)) throw new Error(`${path || "apply"} ${res.status}: ${JSON.stringify(body).slice(0, 400)}`);
  return { ms, body };
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
const secs = (ms: number) => (ms / 1000).toFixed(2);

async function timeFormat(label: string, files: { name: string; bytes: Uint8Array }[]) {
  const previews: number[] = [];
  const applies: number[] = [];
  const again: number[] = [];
  for (let i = 0; i < RUNS; i += 1) {
    const vesselId = await emptyVessel();
    const preview = await post(vesselId, "/preview", files);
    const applied = await post(vesselId, "", files);
    const repeat = await post(vesselId, "", files);
    // What was timed did the whole job: every routine created once, nothing the second time.
    type Counts = Record<"routines" | "readings", { created: number; changed: number }>;
    const created = (x: typeof applied) => (x.body.counts as Counts).routines;
    const added = (x: typeof applied) => (x.body.counts as Counts).readings.created;
    if (created(applied).created !== ROUTINES || created(repeat).created + created(repeat).changed !== 0 || added(applied) !== readings.length || added(repeat) !== 0) {
      throw new Error(`${label}: ${JSON.stringify(applied.body.counts)} then ${JSON.stringify(repeat.body.counts)}`);
    }
    previews.push(preview.ms);
    applies.push(applied.ms);
    again.push(repeat.ms);
  }
  return { label, preview: median(previews), apply: median(applies), again: median(again) };
}

async function floor(): Promise<number> {
  const times: number[] = [];
  const client = await (db.$client as import("pg").Pool).connect();
  try {
    for (let i = 0; i < RUNS; i += 1) {
      const start = performance.now();
      await client.query("begin");
      await client.query("create temporary table bench_component (code text, name text, parent text) on commit drop");
      await client.query("create temporary table bench_routine (code text, component text, title text, team text) on commit drop");
      await client.query("insert into bench_component select * from unnest($1::text[], $2::text[], $3::text[])", [
        components.map((c) => c.code),
        components.map((c) => c.name),
        components.map((c) => c.parent),
      ]);
      await client.query("insert into bench_routine select * from unnest($1::text[], $2::text[], $3::text[], $4::text[])", [
        routines.map((r) => r.code),
        routines.map((r) => r.component),
        routines.map((r) => r.title),
        routines.map((r) => r.team),
      ]);
      await client.query("create temporary table bench_reading (counter text, read_at timestamptz, value numeric) on commit drop");
      await client.query("insert into bench_reading select * from unnest($1::text[], $2::timestamptz[], $3::numeric[])", [
        readings.map((r) => r.counter),
        readings.map((r) => `${r.read_at}Z`),
        readings.map((r) => r.value),
      ]);
      await client.query("commit");
      times.push(performance.now() - start);
    }
  } finally {
    client.release();
  }
  return median(times);
}

await post(await emptyVessel(), "/preview", csvFiles); // warm-up: compiled routes, pool connections
const bare = await floor();
const results = [await timeFormat("five CSV files", csvFiles), await timeFormat("one workbook (.xlsx)", xlsx)];
await closeTestDb();

const size = (files: { bytes: Uint8Array }[]) => `${Math.round(files.reduce((t, x) => t + x.bytes.byteLength, 0) / 1024)} kB`;
const md = [
  `| import of ${COMPONENTS} components, ${COUNTERS} counters, ${ROUTINES.toLocaleString("en")} routines, ${ROUTINES.toLocaleString("en")} last-done rows and ${readings.length.toLocaleString("en")} readings (median of ${RUNS}) | preview (s) | apply into an empty vessel (s) | the same files again (s) | apply ÷ floor |`,
  "| --- | --- | --- | --- | --- |",
  ...results.map((r) => `| ${r.label} (${size(r.label.startsWith("five") ? csvFiles : xlsx)}) | ${secs(r.preview)} | ${secs(r.apply)} | ${secs(r.again)} | ${(r.apply / bare).toFixed(0)}× |`),
  `| floor: one INSERT … SELECT FROM unnest of the same component, routine and reading rows into temporary tables | — | ${secs(bare)} | — | 1× |`,
].join("\n");
writeFileSync("bench-output/import.md", md + "\n");
writeFileSync("bench-output/import.json", JSON.stringify({ bare, results }, null, 2));
console.log(md);
