// Importing a vessel's plan over HTTP against the real database and the S3 fake: a file with bad
// rows is refused whole with each row's message and nothing written; a good plan applied once and
// again gives the same database; a changed file changes what changed and says so; retiring what the
// file no longer lists only when asked; roles and company isolation.
import { and, eq, isNull } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as s from "@/db/schema";
import type { Problem } from "@/server/http/problem";
import type { ImportRecord } from "@/server/import/history";
import type { ImportPreview, ImportResult } from "@/server/import/service";
import { shipDay } from "@/server/format/hours";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { BASE_URL, type Session, signIn } from "../support/http";

let f: Fixture;
let other: Fixture;
let chief: Session;

const COMPONENTS = [
  "code,name,parent,critical,class_item,counter",
  "ME,Main engine,,yes,ME-1,Main engine",
  "ME.CYL.1,Cylinder unit 1,ME,yes,,",
  "ME.CYL.2,Cylinder unit 2,ME,yes,,",
  "AE.1,Generator set 1,,no,,Generator 1",
].join("\n");
const COUNTERS = "counter,planned_hours_per_day\nMain engine,18\nGenerator 1,12\nEmergency generator,0.5\n";
const ROUTINES = [
  "code,component,title,every_hours,every,team,elapsed_hours,engine_stop,critical,checklist",
  'ME.CYL.1/OVH,ME.CYL.1,Piston overhaul,16000,,"second engineer; motorman x2",12,yes,yes,Isolate | Open doors',
  'ME.CYL.2/OVH,ME.CYL.2,Piston overhaul,16000,,"second engineer; motorman x2",12,yes,yes,Isolate | Open doors',
  "AE.1/OIL,AE.1,Lube oil change,1000,,fourth engineer,3,no,no,",
  "ME/CRANK,ME,Crankcase inspection,,every 6 months,second engineer,2,yes,yes,",
].join("\n");
const CHANGED_ROUTINES = ROUTINES.replace("AE.1/OIL,AE.1,Lube oil change,1000,", "AE.1/OIL,AE.1,Lube oil and filter change,1500,");
const LAST_DONE = "routine,done_on,counter_hours\nME.CYL.1/OVH,2025-11-20,900\nME.CYL.2/OVH,2025-11-20,900\nAE.1/OIL,2026-10-01,450\nME/CRANK,2026-09-01,\n";

type Named = { name: string; text: string };
const files = (...list: Named[]) => list;
const plan = (routines = ROUTINES) =>
  files({ name: "components.csv", text: COMPONENTS }, { name: "counters.csv", text: COUNTERS }, { name: "routines.csv", text: routines }, { name: "last-done.csv", text: LAST_DONE });

async function send<T>(session: Session | null, path: string, list: Named[], retire = false, vesselId = f.vesselA.id) {
  const form = new FormData();
  for (const x of list) form.append("file", new Blob([x.text], { type: "text/csv" }), x.name);
  if (retire) form.append("retire", "on");
  const response = await fetch(`${BASE_URL}/api/vessels/${vesselId}/import${path}`, {
    method: "POST",
    headers: { origin: BASE_URL, ...(session ? { cookie: session.cookie } : {}) },
    body: form,
  });
  const text = await response.text();
  return { status: response.status, body: (text ? JSON.parse(text) : null) as T };
}
const preview = (list: Named[], retire = false) => send<ImportPreview & Problem>(chief, "/preview", list, retire);
const apply = (list: Named[], retire = false) => send<ImportResult & Problem>(chief, "", list, retire);

/** The vessel's register and plan as rows without ids or times, for comparing two states. */
async function vesselState(vesselId = f.vesselA.id) {
  const db = testDb();
  const components = await db
    .select({ code: s.component.code, name: s.component.name, parent: s.component.parentId, critical: s.component.critical, counter: s.component.counterId })
    .from(s.component)
    .where(eq(s.component.vesselId, vesselId))
    .orderBy(s.component.code);
  const counters = await db.select({ name: s.counter.name, rate: s.counter.plannedHoursPerDay }).from(s.counter).where(eq(s.counter.vesselId, vesselId)).orderBy(s.counter.name);
  const routines = await db
    .select({ code: s.routine.code, title: s.routine.title, hours: s.routine.intervalHours, rule: s.routine.calendarRule, team: s.routine.team, revision: s.routine.revision, retired: s.routine.retiredAt, baselineHours: s.routine.baselineHours })
    .from(s.routine)
    .where(eq(s.routine.vesselId, vesselId))
    .orderBy(s.routine.code);
  return { components, counters, routines };
}

beforeAll(async () => {
  [f, other] = await Promise.all([createCompany("import"), createCompany("import-other")]);
  chief = await signIn(f.users["chief-engineer"].email, PASSWORD);
});
afterAll(closeTestDb);

describe("a plan with bad rows", () => {
  it("is previewed with each problem by file, row and column", async () => {
    const bad = ROUTINES.replace("every 6 months", "every 6 mnths").replace("AE.1/OIL,AE.1,", "AE.1/OIL,AE.9,");
    const res = await preview(files({ name: "components.csv", text: COMPONENTS }, { name: "counters.csv", text: COUNTERS }, { name: "routines.csv", text: bad }, { name: "last-done.csv", text: LAST_DONE }));
    expect(res.status).toBe(200);
    expect(res.body.problems).toEqual([
      { file: "routines.csv", row: 4, column: "component", message: "AE.9: no such component in the components file or on the vessel." },
      { file: "routines.csv", row: 5, column: "every", message: "“every 6 mnths” is not a rule Keelson reads — try “every 6 months”." },
    ]);
  });

  it("is refused whole when applied, naming the rows, and nothing is written", async () => {
    const before = await vesselState();
    const bad = ROUTINES.replace("every 6 months", "every 6 mnths");
    const res = await apply(files({ name: "components.csv", text: COMPONENTS }, { name: "counters.csv", text: COUNTERS }, { name: "routines.csv", text: bad }, { name: "last-done.csv", text: LAST_DONE }));
    expect(res.status).toBe(422);
    expect(res.body.detail).toMatch(/^The import was refused: 1 problem in the files\. Nothing was written\.$/);
    expect(res.body.errors?.map((e) => e.message)).toContain("routines.csv, row 5, every: “every 6 mnths” is not a rule Keelson reads — try “every 6 months”.");
    expect(await vesselState()).toEqual(before);
    expect(await testDb().select().from(s.vesselImport).where(eq(s.vesselImport.vesselId, f.vesselA.id))).toEqual([]);
  });
});

describe("a good plan", () => {
  it("is previewed as what it would create, and the known counters as the same", async () => {
    const res = await preview(plan());
    expect(res.status).toBe(200);
    expect(res.body.problems).toEqual([]);
    expect(res.body.counts).toEqual({
      counters: { create: 1, change: 1, same: 1, retire: 0 },
      components: { create: 4, change: 0, same: 0, retire: 0 },
      routines: { create: 4, change: 0, same: 0, retire: 0 },
      readings: { create: 0, change: 0, same: 0, retire: 0 },
    });
    // The fixture's main engine is planned at 12 h a day; the file says 18.
    expect(res.body.changes).toContainEqual({ kind: "counters", key: "Main engine", action: "change", fields: ["planned_hours_per_day"] });
  });

  it("is applied in one step, its files kept with the record, and applying it again changes nothing", async () => {
    const res = await apply(plan());
    expect(res.status).toBe(201);
    expect(res.body.counts.routines).toEqual({ created: 4, changed: 0, retired: 0 });
    const first = await vesselState();
    expect(first.components.map((c) => c.code)).toEqual(["AE.1", "ME", "ME.CYL.1", "ME.CYL.2"]);
    const me = first.components.find((c) => c.code === "ME")!;
    const meId = (await testDb().select({ id: s.component.id }).from(s.component).where(and(eq(s.component.vesselId, f.vesselA.id), eq(s.component.code, "ME"))))[0]!.id;
    expect(first.components.filter((c) => c.parent === meId).map((c) => c.code)).toEqual(["ME.CYL.1", "ME.CYL.2"]);
    expect(me.counter).toBe(f.counters.main.id);
    expect(first.counters).toEqual([
      { name: "Emergency generator", rate: 0.5 },
      { name: "Generator 1", rate: 12 },
      { name: "Main engine", rate: 18 },
    ]);
    expect(first.routines.find((r) => r.code === "ME/CRANK")).toMatchObject({ rule: "FREQ=MONTHLY;INTERVAL=6", hours: null });
    expect(first.routines.find((r) => r.code === "ME.CYL.1/OVH")).toMatchObject({ hours: 16000, baselineHours: 900 });

    const history = await fetch(`${BASE_URL}/api/vessels/${f.vesselA.id}/import`, { headers: { cookie: chief.cookie } });
    const { imports } = (await history.json()) as { imports: ImportRecord[] };
    expect(imports[0]).toMatchObject({ files: ["components.csv", "counters.csv", "routines.csv", "last-done.csv"], importedBy: expect.stringMatching(/^chief-engineer /) });
    const [record] = await testDb().select().from(s.vesselImport).where(eq(s.vesselImport.id, res.body.importId));
    expect(record!.objectKeys).toHaveLength(4);

    const again = await preview(plan());
    expect(again.body.counts.routines).toEqual({ create: 0, change: 0, same: 4, retire: 0 });
    expect(again.body.changes).toEqual([]);
    expect((await apply(plan())).status).toBe(201);
    expect(await vesselState()).toEqual(first);
  });

  it("updates what a changed file changed, and says so in the preview", async () => {
    const changed = CHANGED_ROUTINES;
    const res = await preview(plan(changed));
    expect(res.body.changes).toEqual([{ kind: "routines", key: "AE.1/OIL", action: "change", fields: ["title", "every_hours"] }]);
    expect((await apply(plan(changed))).status).toBe(201);
    const oil = (await vesselState()).routines.find((r) => r.code === "AE.1/OIL")!;
    expect(oil).toMatchObject({ title: "Lube oil and filter change", hours: 1500, revision: 2 });
  });

  it("retires the routines the file no longer lists only when asked", async () => {
    const fewer = CHANGED_ROUTINES.split("\n").filter((l) => !l.startsWith("ME/CRANK")).join("\n");
    const lastDone = LAST_DONE.split("\n").filter((l) => !l.startsWith("ME/CRANK")).join("\n");
    const list = files({ name: "routines.csv", text: fewer }, { name: "last-done.csv", text: lastDone });
    const kept = await preview(list);
    expect(kept.body.counts.routines).toMatchObject({ retire: 0 });
    const asked = await preview(list, true);
    expect(asked.body.changes).toEqual([{ kind: "routines", key: "ME/CRANK", action: "retire", fields: [] }]);
    expect((await apply(list, true)).status).toBe(201);
    const open = await testDb()
      .select({ code: s.routine.code })
      .from(s.routine)
      .where(and(eq(s.routine.vesselId, f.vesselA.id), isNull(s.routine.retiredAt)));
    expect(open.map((r) => r.code).sort()).toEqual(["AE.1/OIL", "ME.CYL.1/OVH", "ME.CYL.2/OVH"]);
  });
});

describe("retiring counters", () => {
  it("retires a counter the counters file no longer lists, only when asked and when no component still counts its hours", async () => {
    const without = (name: string) => files({ name: "counters.csv", text: COUNTERS.split("\n").filter((l) => !l.startsWith(name)).join("\n") });
    const refused = await preview(without("Generator 1"), true);
    expect(refused.body.problems).toEqual([
      {
        file: "counters.csv",
        row: null,
        column: "counter",
        message: "“Generator 1” is not in the counters file, but AE.1 still counts its hours: give it another counter in the components file, or keep “Generator 1” in the counters file.",
      },
    ]);
    expect((await preview(without("Emergency generator"))).body.counts.counters.retire).toBe(0);
    const applied = await apply(without("Emergency generator"), true);
    expect(applied.status).toBe(201);
    expect(applied.body.counts.counters).toEqual({ created: 0, changed: 0, retired: 1 });
    const [emergency] = await testDb().select().from(s.counter).where(and(eq(s.counter.vesselId, f.vesselA.id), eq(s.counter.name, "Emergency generator")));
    expect(emergency!.retiredAt).not.toBeNull();
  });
});

describe("a readings history", () => {
  /** The fixture read the main engine at 1,000 h a day ago; these instants are counted back from it, written in UTC. */
  const lastRead = async () =>
    (await testDb().select().from(s.reading).where(eq(s.reading.counterId, f.counters.main.id)).orderBy(s.reading.readAt)).at(-1)!.readAt;
  const utc = (d: Date) => `${d.toISOString().slice(0, 16)}Z`;
  const readingsFile = (rows: [Date, number][]) =>
    files({ name: "readings.csv", text: ["counter,read_at,value", ...rows.map(([at, v]) => `Main engine,${utc(at)},${v}`)].join("\n") });
  const mainReadings = async () =>
    (await testDb().select({ at: s.reading.readAt, value: s.reading.meterValue, total: s.reading.totalHours }).from(s.reading).where(eq(s.reading.counterId, f.counters.main.id)).orderBy(s.reading.readAt)).map(
      (r) => [r.at.toISOString(), r.value, r.total],
    );

  it("adds the days before the vessel's first reading, leaves the one it has, and adds nothing the second time", async () => {
    const last = await lastRead();
    const hoursBefore = (h: number) => new Date(last.getTime() - h * 3_600_000);
    const list = readingsFile([[hoursBefore(72), 950], [hoursBefore(48), 968.5], [last, 1000]]);
    const res = await preview(list);
    expect(res.body.problems).toEqual([]);
    expect(res.body.counts.readings).toEqual({ create: 2, change: 0, same: 1, retire: 0 });
    expect(res.body.changes).toEqual([{ kind: "readings", key: "Main engine", action: "create", fields: [expect.stringMatching(/^2 readings, \d{4}-\d{2}-\d{2} to \d{4}-\d{2}-\d{2}$/)] }]);
    const applied = await apply(list);
    expect(applied.status).toBe(201);
    expect(applied.body.counts.readings).toEqual({ created: 2, changed: 0, retired: 0 });
    const stored = await mainReadings();
    expect(stored).toEqual([
      [hoursBefore(72).toISOString(), 950, 950],
      [hoursBefore(48).toISOString(), 968.5, 968.5],
      [last.toISOString(), 1000, 1000],
    ]);
    expect((await preview(list)).body.counts.readings).toEqual({ create: 0, change: 0, same: 3, retire: 0 });
    expect((await apply(list)).status).toBe(201);
    expect(await mainReadings()).toEqual(stored);
  });

  it("refuses a reading that breaks the rules against the vessel's own readings, and writes nothing", async () => {
    const last = await lastRead();
    const before = await mainReadings();
    const hoursBefore = (h: number) => new Date(last.getTime() - h * 3_600_000);
    const res = await apply(readingsFile([[hoursBefore(100), 930], [hoursBefore(12), 1001]]));
    expect(res.status).toBe(422);
    expect(res.body.errors?.map((e) => e.message)).toEqual([expect.stringMatching(/^readings\.csv, row 3, value: Reading is higher than the next one \(1,000 h on /)]);
    expect(await mainReadings()).toEqual(before);
  });
});

describe("who may import", () => {
  it("is the chief engineer of the vessel and the administrator; others are refused and nothing is written", async () => {
    const admin = await signIn(f.users.admin.email, PASSWORD);
    expect((await send(admin, "/preview", plan(), false, f.vesselB.id)).status).toBe(200);
    for (const role of ["superintendent", "engineer", "viewer"] as const) {
      const session = await signIn(f.users[role].email, PASSWORD);
      expect((await send(session, "", plan())).status).toBe(403);
    }
    expect((await send(null, "", plan())).status).toBe(401);
    // Another company's chief engineer, and our chief on a vessel he is not assigned to.
    const outsider = await signIn(other.users["chief-engineer"].email, PASSWORD);
    expect((await send(outsider, "", plan())).status).toBe(404);
    expect((await send(chief, "", plan(), false, f.vesselB.id)).status).toBe(404);
    expect(await vesselState(f.vesselB.id)).toMatchObject({ components: [], routines: [] });
  });

  it("refuses a request without files, or not a form, with the field named", async () => {
    const empty = await send<Problem>(chief, "/preview", []);
    expect(empty.status).toBe(422);
    expect(empty.body.errors).toEqual([{ field: "file", message: "Choose the plan's files: CSV files or an Excel workbook." }]);
    const json = await fetch(`${BASE_URL}/api/vessels/${f.vesselA.id}/import/preview`, {
      method: "POST",
      headers: { origin: BASE_URL, cookie: chief.cookie, "content-type": "application/json" },
      body: "{}",
    });
    expect(json.status).toBe(422);
  });
});

/** The plan as a chief engineer reads it, without ids, times or the vessel's zone. */
async function planOf(vesselId: string, timeZone: string) {
  const db = testDb();
  const components = await db.select().from(s.component).where(eq(s.component.vesselId, vesselId));
  const counters = await db.select().from(s.counter).where(and(eq(s.counter.vesselId, vesselId), isNull(s.counter.retiredAt)));
  const routines = await db.select().from(s.routine).where(and(eq(s.routine.vesselId, vesselId), isNull(s.routine.retiredAt)));
  const code = new Map(components.map((c) => [c.id, c.code]));
  const counter = new Map(counters.map((c) => [c.id, c.name]));
  return {
    components: components
      .map((c) => ({ code: c.code, name: c.name, parent: c.parentId ? code.get(c.parentId) : null, critical: c.critical, counter: c.counterId ? counter.get(c.counterId) : null }))
      .sort((a, b) => a.code.localeCompare(b.code)),
    counters: counters.map((c) => ({ name: c.name, rate: c.plannedHoursPerDay })).sort((a, b) => a.name.localeCompare(b.name)),
    routines: routines
      .map((r) => ({
        code: r.code,
        component: code.get(r.componentId),
        title: r.title,
        hours: r.intervalHours,
        rule: r.calendarRule,
        team: r.team,
        elapsed: r.elapsedHours,
        checklist: r.checklist,
        flags: [r.critical, r.classRelated, r.needsEngineStop, r.needsPort],
        baselineDay: r.baselineAt ? shipDay(r.baselineAt, timeZone) : null,
        baselineHours: r.baselineHours,
      }))
      .sort((a, b) => (a.code ?? "").localeCompare(b.code ?? "")),
  };
}


describe("export and import again", () => {
  it("exports the plan as one workbook and as CSV per kind, and the workbook imported into an empty vessel reproduces it", async () => {
    const csv = await fetch(`${BASE_URL}/api/vessels/${f.vesselA.id}/export?kind=routines`, { headers: { cookie: chief.cookie } });
    expect(csv.status).toBe(200);
    // fetch drops the byte-order mark as it decodes; the header row follows it.
    expect((await csv.text()).split("\r\n")[0]).toBe("code,component,title,every_hours,every,rrule,anniversary,tolerance_rule,team,elapsed_hours,engine_stop,needs_port,port_event,port_event_hours,critical,class_related,class_item,checklist,measurements,spare_parts,cautions,description");

    const book = await fetch(`${BASE_URL}/api/vessels/${f.vesselA.id}/export`, { headers: { cookie: chief.cookie } });
    expect(book.status).toBe(200);
    const bytes = new Uint8Array(await book.arrayBuffer());
    const admin = await signIn(f.users.admin.email, PASSWORD);
    const form = new FormData();
    form.append("file", new Blob([bytes]), "alpha-plan.xlsx");
    const res = await fetch(`${BASE_URL}/api/vessels/${f.vesselB.id}/import`, { method: "POST", headers: { origin: BASE_URL, cookie: admin.cookie }, body: form });
    expect(res.status).toBe(201);

    const a = await planOf(f.vesselA.id, f.vesselA.timeZone);
    const b = await planOf(f.vesselB.id, f.vesselB.timeZone);
    expect(a.routines).toHaveLength(3);
    expect(b).toEqual(a);
    // The readings history came along: every reading of A's counters on B's counters of the same name.
    const readingsOf = async (vesselId: string) =>
      (
        await testDb()
          .select({ counter: s.counter.name, at: s.reading.readAt, value: s.reading.meterValue, total: s.reading.totalHours })
          .from(s.reading)
          .innerJoin(s.counter, eq(s.counter.id, s.reading.counterId))
          .where(eq(s.reading.vesselId, vesselId))
      )
        .map((r) => `${r.counter} ${r.at.toISOString()} ${r.value} ${r.total}`)
        .sort();
    const readingsA = await readingsOf(f.vesselA.id);
    expect(readingsA.length).toBeGreaterThanOrEqual(4);
    expect(await readingsOf(f.vesselB.id)).toEqual(readingsA);
  });
});

describe("the plan as a zip of CSV files", () => {
  it("is exported and, checked against the vessel it came from, changes nothing", async () => {
    const res = await fetch(`${BASE_URL}/api/vessels/${f.vesselA.id}/export?format=zip`, { headers: { cookie: chief.cookie } });
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("application/zip");
    const form = new FormData();
    form.append("file", new Blob([new Uint8Array(await res.arrayBuffer())]), "alpha.zip");
    const check = await fetch(`${BASE_URL}/api/vessels/${f.vesselA.id}/import/preview`, { method: "POST", headers: { origin: BASE_URL, cookie: chief.cookie }, body: form });
    const preview = (await check.json()) as ImportPreview;
    expect(preview.problems).toEqual([]);
    expect(preview.files).toEqual(["alpha.zip"]);
    expect(preview.changes).toEqual([]);
    expect(preview.counts.routines.same).toBe(3);
    expect(preview.counts.readings.same).toBeGreaterThanOrEqual(4);
  });
});

describe("copy the plan to a sister ship", () => {
  it("previews and copies register, counters and routines; the routines count from today at 0 h", async () => {
    const admin = await signIn(f.users.admin.email, PASSWORD);
    const [sister] = await testDb()
      .insert(s.vessel)
      .values({ companyId: f.companyId, name: "Charlie sister", code: "CHAR", imoNumber: "9074729", timeZone: "UTC" })
      .returning();
    const copy = (apply: boolean, onlyMissing = false, fromVesselId = f.vesselA.id, session = admin, to = sister!.id) =>
      fetch(`${BASE_URL}/api/vessels/${to}/import/copy`, {
        method: "POST",
        headers: { origin: BASE_URL, cookie: session.cookie, "content-type": "application/json" },
        body: JSON.stringify({ fromVesselId, apply, onlyMissing }),
      });
    const preview = (await (await copy(false)).json()) as ImportPreview;
    expect(preview.problems).toEqual([]);
    expect(preview.counts.routines).toEqual({ create: 3, change: 0, same: 0, retire: 0 });
    expect(await vesselState(sister!.id)).toMatchObject({ components: [], counters: [], routines: [] });

    expect((await copy(true)).status).toBe(201);
    const a = await planOf(f.vesselA.id, f.vesselA.timeZone);
    const c = await planOf(sister!.id, "UTC");
    const today = shipDay(new Date(), "UTC");
    expect(c.components).toEqual(a.components);
    expect(c.counters.map((x) => x.name)).toEqual(a.counters.map((x) => x.name));
    expect(c.routines).toEqual(
      a.routines.map((r) => ({ ...r, baselineDay: today, baselineHours: r.hours === null ? null : 0 })),
    );
    // Copied again, nothing changes: the routines the ship already has keep their own baselines.
    const again = (await (await copy(false)).json()) as ImportPreview;
    expect(again.counts.routines).toEqual({ create: 0, change: 0, same: 3, retire: 0 });

    // The sister ship's own change to a routine stays when only what she lacks is added; a routine she
    // retired comes back (with its history) either way.
    const sisterRoutine = async (code: string) =>
      (await testDb().select().from(s.routine).where(and(eq(s.routine.vesselId, sister!.id), eq(s.routine.code, code))))[0]!;
    await testDb().update(s.routine).set({ title: "Lube oil change (her own wording)" }).where(eq(s.routine.id, (await sisterRoutine("AE.1/OIL")).id));
    await testDb().update(s.routine).set({ retiredAt: new Date() }).where(eq(s.routine.id, (await sisterRoutine("ME.CYL.1/OVH")).id));
    const back = { kind: "routines", key: "ME.CYL.1/OVH", action: "change", fields: expect.arrayContaining(["back in use"]) };
    const whole = (await (await copy(false)).json()) as ImportPreview;
    expect(whole.changes).toHaveLength(2);
    expect(whole.changes).toEqual(expect.arrayContaining([{ kind: "routines", key: "AE.1/OIL", action: "change", fields: ["title"] }, back]));
    const missing = (await (await copy(false, true)).json()) as ImportPreview;
    expect(missing.changes).toEqual([back]);
    expect((await copy(true, true)).status).toBe(201);
    expect((await sisterRoutine("ME.CYL.1/OVH")).retiredAt).toBeNull();
    const kept = await sisterRoutine("AE.1/OIL");
    expect(kept.title).toBe("Lube oil change (her own wording)");
  });

  it("refuses a vessel the user may not open, and the vessel itself, naming the field", async () => {
    const res = await fetch(`${BASE_URL}/api/vessels/${f.vesselA.id}/import/copy`, {
      method: "POST",
      headers: { origin: BASE_URL, cookie: chief.cookie, "content-type": "application/json" },
      body: JSON.stringify({ fromVesselId: f.vesselB.id }),
    });
    expect(res.status).toBe(422);
    expect(((await res.json()) as Problem).errors).toEqual([{ field: "fromVesselId", message: "There is no such vessel of yours to copy from." }]);
    const self = await fetch(`${BASE_URL}/api/vessels/${f.vesselA.id}/import/copy`, {
      method: "POST",
      headers: { origin: BASE_URL, cookie: chief.cookie, "content-type": "application/json" },
      body: JSON.stringify({ fromVesselId: f.vesselA.id }),
    });
    expect(((await self.json()) as Problem).errors?.[0]?.field).toBe("fromVesselId");
  });
});
