// A vessel's maintenance history as CSV against the running app: every recorded job with who did it,
// who answered for it, what was measured and the decision, in the vessel's time; a component's
// history holds its parts' and no one else's; the access door's answers.
import Papa from "papaparse";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as s from "@/db/schema";
import type { Problem } from "@/server/http/problem";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { BASE_URL, type Session, signIn } from "../support/http";

let f: Fixture;
let other: Fixture;
let viewer: Session;

beforeAll(async () => {
  [f, other] = await Promise.all([createCompany("history-csv"), createCompany("history-csv-other")]);
  const db = testDb();
  const [me] = await db.insert(s.component).values({ companyId: f.companyId, vesselId: f.vesselA.id, code: "ME", name: "Main engine" }).returning();
  const [cyl] = await db
    .insert(s.component)
    .values({ companyId: f.companyId, vesselId: f.vesselA.id, code: "ME.CYL.1", name: "Cylinder unit 1", parentId: me!.id })
    .returning();
  const [pump] = await db.insert(s.component).values({ companyId: f.companyId, vesselId: f.vesselA.id, code: "PMP.SW1", name: "Sea water pump 1" }).returning();
  const [overhaul] = await db
    .insert(s.routine)
    .values({ companyId: f.companyId, vesselId: f.vesselA.id, componentId: cyl!.id, code: "ME.CYL.1/OVH", title: "Piston overhaul", intervalHours: 16000, rank: "second-engineer", estimatedManHours: 12 })
    .returning();
  const jobs = [
    { component: cyl!.id, routine: overhaul!.id, number: "WO-HX-001", title: "Piston overhaul", at: "2026-10-01T02:00:00Z", status: "approved" as const },
    { component: pump!.id, routine: null, number: "WO-HX-002", title: "Sea water pump 1: seal renewed", at: "2026-11-15T23:30:00Z", status: "awaiting-approval" as const },
    { component: me!.id, routine: null, number: "WO-HX-003", title: "Crankcase inspection", at: "2026-09-01T04:00:00Z", status: "returned" as const },
  ];
  for (const j of jobs) {
    const [wo] = await db
      .insert(s.workOrder)
      .values({ companyId: f.companyId, vesselId: f.vesselA.id, componentId: j.component, routineId: j.routine, number: j.number, occurrence: 1, title: j.title, state: "done", kind: j.routine ? "planned" : "corrective" })
      .returning();
    await db.insert(s.completion).values({
      companyId: f.companyId,
      vesselId: f.vesselA.id,
      workOrderId: wo!.id,
      doneAt: new Date(j.at),
      counterHours: j.routine ? 61250 : null,
      manHours: 12,
      measurements: j.routine ? [{ name: "Liner wear", unit: "mm", value: 1.7, lower: 0, upper: 1.6, outOfLimits: true }] : [],
      remarks: j.routine ? "Rings renewed; =liner gauged" : "",
      doneBy: f.users.engineer.id,
      responsibleId: f.users["chief-engineer"].id,
      workedBy: [{ rank: "second-engineer", name: "A. Berg" }, { rank: "motorman", name: "T. Ruiz" }],
      status: j.status,
      decidedBy: j.status === "awaiting-approval" ? null : f.users["chief-engineer"].id,
      decisionNote: j.status === "returned" ? "Deflections missing" : null,
    });
  }
  viewer = await signIn(f.users.viewer.email, PASSWORD);
});
afterAll(closeTestDb);

async function get(session: Session | null, query = "", vesselId = f.vesselA.id) {
  const res = await fetch(`${BASE_URL}/api/vessels/${vesselId}/export/history${query}`, { headers: session ? { cookie: session.cookie } : {} });
  const text = (await res.text()).replace(/^\uFEFF/, "");
  return { status: res.status, headers: res.headers, text, rows: res.status === 200 ? Papa.parse<Record<string, string>>(text.trim(), { header: true }).data : [] };
}

describe("GET /api/vessels/[vesselId]/export/history", () => {
  it("lists every recorded job, newest first, in the vessel's time, for a viewer of the vessel", async () => {
    const res = await get(viewer);
    expect(res.status).toBe(200);
    expect(res.headers.get("content-disposition")).toMatch(/filename="ALPHA-history-\d{4}-\d{2}-\d{2}\.csv"/);
    expect(res.rows.map((r) => r.work_order)).toEqual(["WO-HX-002", "WO-HX-001", "WO-HX-003"]);
    // 23:30 UTC on 15 Nov is 07:30 on 16 Nov in Singapore, vessel A's zone.
    expect(res.rows[0]).toMatchObject({ done_on: "2026-11-16", done_at: "2026-11-16 07:30", status: "awaiting approval", component: "PMP.SW1", routine: "" });
    expect(res.rows[1]).toMatchObject({
      routine: "ME.CYL.1/OVH",
      component: "ME.CYL.1",
      component_name: "Cylinder unit 1",
      counter_hours: "61250",
      status: "approved",
      worked_by: "A. Berg (second engineer); T. Ruiz (motorman)",
      measurements: "Liner wear = 1.7 mm (outside limits)",
      remarks: "Rings renewed; =liner gauged",
    });
    expect(res.rows[1]!.recorded_by).toMatch(/^engineer /);
    expect(res.rows[1]!.responsible).toMatch(/^chief-engineer /);
    expect(res.rows[2]).toMatchObject({ status: "returned", decision_note: "Deflections missing" });
  });

  it("gives a component's history with its parts', and nobody else's", async () => {
    const me = await get(viewer, "?component=ME");
    expect(me.rows.map((r) => r.work_order)).toEqual(["WO-HX-001", "WO-HX-003"]);
    expect(me.headers.get("content-disposition")).toMatch(/filename="ALPHA-history-ME-/);
    const cyl = await get(viewer, "?component=me.cyl.1");
    expect(cyl.rows.map((r) => r.work_order)).toEqual(["WO-HX-001"]);
  });

  it("names the field when the component is not there or not a code, and refuses other companies", async () => {
    const missing = await get(viewer, "?component=ME.CYL.9");
    expect(missing.status).toBe(422);
    expect((JSON.parse(missing.text) as Problem).errors).toEqual([{ field: "component", message: expect.stringMatching(/^ME\.CYL\.9: there is no such component on /) }]);
    expect((await get(viewer, `?component=${encodeURIComponent("bad code!")}`)).status).toBe(422);
    expect((await get(null)).status).toBe(401);
    const outsider = await signIn(other.users.admin.email, PASSWORD);
    expect((await get(outsider)).status).toBe(404);
    // Another company's vessel, for our viewer: the door answers as if it did not exist.
    expect((await get(viewer, "", other.vesselA.id)).status).toBe(404);
  });
});
