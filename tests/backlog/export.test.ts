// The Backlog's CSV against the running app: the same rows as the JSON under the same filters and
// sort, every page at once, ship's days in the vessel's zone, and the access door's answers.
import Papa from "papaparse";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as s from "@/db/schema";
import type { BacklogPage } from "@/server/backlog/contract";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { api, type Session, signIn } from "../support/http";

const BASE_URL = process.env.KEELSON_TEST_URL ?? "http://127.0.0.1:3000";
let f: Fixture;
let other: Fixture;
let viewer: Session;

beforeAll(async () => {
  [f, other] = await Promise.all([createCompany("backlog-export"), createCompany("backlog-export-other")]);
  const db = testDb();
  const [me] = await db
    .insert(s.component)
    .values({ companyId: f.companyId, vesselId: f.vesselA.id, code: "ME", name: "Main engine" })
    .returning();
  // 60 open work orders, more than one page of the page's 50; one title in a Norwegian port's name.
  await db.insert(s.workOrder).values(
    Array.from({ length: 60 }, (_, n) => ({
      companyId: f.companyId,
      vesselId: f.vesselA.id,
      componentId: me!.id,
      number: `WO-EX-${String(n + 1).padStart(3, "0")}`,
      occurrence: 1,
      title: n === 0 ? "Ålesund: bunker sample, check" : `Job ${n + 1}`,
      state: n % 3 === 0 ? ("late" as const) : ("scheduled" as const),
      // 23:30 UTC: already the next day in vessel A's zone (Asia/Singapore, UTC+8).
      dueDate: new Date(Date.UTC(2027, 0, 1 + n, 23, 30)),
      critical: n % 5 === 0,
    })),
  );
  viewer = await signIn(f.users.viewer.email, PASSWORD);
});
afterAll(closeTestDb);

async function csv(session: Session | null, path: string) {
  const response = await fetch(`${BASE_URL}${path}`, { headers: session ? { cookie: session.cookie } : {} });
  return { status: response.status, headers: response.headers, text: (await response.text()).replace(/^\uFEFF/, "") };
}

describe("GET /api/vessels/[vesselId]/backlog/export", () => {
  it("holds every row the Backlog lists under the same filters and sort, all pages at once", async () => {
    const path = `/api/vessels/${f.vesselA.id}/backlog`;
    const json = await api<BacklogPage>(viewer, "GET", `${path}?sort=-due&pageSize=200`);
    expect(json.body.total).toBe(60);
    const res = await csv(viewer, `${path}/export?sort=-due&page=2&pageSize=10`);
    expect(res.status).toBe(200);
    expect(res.headers.get("content-disposition")).toMatch(new RegExp(`filename="${f.vesselA.code}-backlog-\\d{4}-\\d{2}-\\d{2}\\.csv"`));
    const lines = res.text.trim().split("\r\n");
    expect(lines[0]!.startsWith("Work order,Title,Component,Kind,State,Due day (ship's),")).toBe(true);
    expect(lines.slice(1).map((l) => l.slice(0, l.indexOf(",")))).toEqual(json.body.items.map((i) => i.number));
    expect(res.text).toContain('"Ålesund: bunker sample, check"');
    // Due 1 Jan 2027 23:30 UTC is 2 Jan 07:30 in Singapore, the vessel's zone: the ship's day is 2 Jan.
    const rows = Papa.parse<Record<string, string>>(res.text.trim(), { header: true }).data;
    expect(rows.find((r) => r["Work order"] === "WO-EX-001")).toMatchObject({
      Title: "Ålesund: bunker sample, check",
      "Due day (ship's)": "2027-01-02",
      State: "late",
      Critical: "yes",
    });

    const late = await csv(viewer, `${path}/export?state=late&critical=true`);
    const lateJson = await api<BacklogPage>(viewer, "GET", `${path}?state=late&critical=true&pageSize=200`);
    expect(late.text.trim().split("\r\n")).toHaveLength(lateJson.body.total + 1);
    expect(late.text.trim().split("\r\n").slice(1).every((l) => l.includes(",late,"))).toBe(true);
  });

  it("answers like the Backlog: 401 signed out, 404 for another company's vessel, 422 naming a bad filter", async () => {
    expect((await csv(null, `/api/vessels/${f.vesselA.id}/backlog/export`)).status).toBe(401);
    expect((await csv(viewer, `/api/vessels/${other.vesselA.id}/backlog/export`)).status).toBe(404);
    const bad = await csv(viewer, `/api/vessels/${f.vesselA.id}/backlog/export?sort=colour`);
    expect(bad.status).toBe(422);
    expect(JSON.parse(bad.text).errors[0].field).toBe("query.sort");
  });
});
