// The fleet's overdue list against the real database and the running app: who may read it, that
// it holds only this company's late and out-of-tolerance work in the stated order, its filters,
// bad filters refused by name, and the CSV carrying the same rows.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import * as s from "@/db/schema";
import type { FleetOverdue } from "@/server/fleet/overdue-contract";
import { instantOfShipTime, shipDay } from "@/server/format/hours";
import type { Problem } from "@/server/http/problem";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { api, type Session, signIn } from "../support/http";

const DAY = 86_400_000;
const LIST = "/api/fleet/overdue";
let f: Fixture;
let other: Fixture;
const as = {} as Record<"admin" | "superintendent" | "chief" | "engineer" | "viewer", Session>;

type Row = {
  number: string;
  vessel: "A" | "B";
  state: (typeof s.workOrderState.enumValues)[number];
  dueDaysAgo: number | null;
  critical?: boolean;
  classRelated?: boolean;
  title?: string;
};

async function insert(fx: Fixture, rows: Row[]) {
  const db = testDb();
  const [a, b] = await db
    .insert(s.component)
    .values([
      { companyId: fx.companyId, vesselId: fx.vesselA.id, code: "ME", name: "Main engine" },
      { companyId: fx.companyId, vesselId: fx.vesselB.id, code: "SG", name: "Steering gear" },
    ])
    .returning();
  for (const r of rows) {
    const v = r.vessel === "A" ? fx.vesselA : fx.vesselB;
    await db.insert(s.workOrder).values({
      companyId: fx.companyId,
      vesselId: v.id,
      componentId: (r.vessel === "A" ? a : b)!.id,
      number: r.number,
      occurrence: 1,
      title: r.title ?? `Job ${r.number}`,
      state: r.state,
      dueDate: r.dueDaysAgo === null ? null : new Date(Date.now() - r.dueDaysAgo * DAY),
      critical: r.critical ?? false,
      classRelated: r.classRelated ?? false,
    });
  }
}

beforeAll(async () => {
  [f, other] = await Promise.all([createCompany("overdue"), createCompany("overdue-other")]);
  await insert(f, [
    { number: "WO-A-1", vessel: "A", state: "late", dueDaysAgo: 3 },
    { number: "WO-A-2", vessel: "A", state: "out-of-tolerance", dueDaysAgo: 40 },
    { number: "WO-A-3", vessel: "A", state: "late", dueDaysAgo: 10, critical: true, title: '=SUM(A1:A9), "quoted"' },
    { number: "WO-A-4", vessel: "A", state: "window-open", dueDaysAgo: -2 },
    { number: "WO-B-1", vessel: "B", state: "out-of-tolerance", dueDaysAgo: 20, classRelated: true },
    { number: "WO-B-2", vessel: "B", state: "late", dueDaysAgo: 30 },
    { number: "WO-B-3", vessel: "B", state: "done", dueDaysAgo: 50 },
    { number: "WO-B-4", vessel: "B", state: "scheduled", dueDaysAgo: -30 },
  ]);
  await insert(other, [{ number: "WO-X-1", vessel: "A", state: "out-of-tolerance", dueDaysAgo: 90, critical: true }]);
  as.admin = await signIn(f.users.admin.email, PASSWORD);
  as.superintendent = await signIn(f.users.superintendent.email, PASSWORD);
  as.chief = await signIn(f.users["chief-engineer"].email, PASSWORD);
  as.engineer = await signIn(f.users.engineer.email, PASSWORD);
  as.viewer = await signIn(f.users.viewer.email, PASSWORD);
});
afterAll(closeTestDb);

const numbers = (list: FleetOverdue) => list.items.map((i) => i.number);

describe("GET /api/fleet/overdue", () => {
  it("is for the office: 401 without a session, 403 for the ship's roles", async () => {
    expect((await api(null, "GET", LIST)).status).toBe(401);
    expect((await api(null, "GET", `${LIST}/export`)).status).toBe(401);
    for (const who of [as.chief, as.engineer, as.viewer]) {
      expect((await api(who, "GET", LIST)).status).toBe(403);
      expect((await api(who, "GET", `${LIST}/export`)).status).toBe(403);
    }
  });

  it("lists late and out-of-tolerance work only, the worst first, and none of another company's", async () => {
    const res = await api<FleetOverdue>(as.superintendent, "GET", LIST);
    expect(res.status).toBe(200);
    // Out of tolerance first (flagged B-1 before A-2), then late (critical A-3, then by due day: B-2 30 days, A-1 3 days).
    expect(numbers(res.body)).toEqual(["WO-B-1", "WO-A-2", "WO-A-3", "WO-B-2", "WO-A-1"]);
    expect(res.body.vessels.map((v) => v.id).sort()).toEqual([f.vesselA.id, f.vesselB.id].sort());
    const a2 = res.body.items.find((i) => i.number === "WO-A-2")!;
    expect(a2).toMatchObject({ state: "out-of-tolerance", daysOverdue: 40, vessel: { id: f.vesselA.id } });
    expect(res.body.truncated).toBe(false);
    const admin = await api<FleetOverdue>(as.admin, "GET", LIST);
    expect(numbers(admin.body)).toEqual(numbers(res.body));
  });

  it("narrows by state, by vessel and to critical or class-related work", async () => {
    const byState = await api<FleetOverdue>(as.superintendent, "GET", `${LIST}?state=late`);
    expect(numbers(byState.body)).toEqual(["WO-A-3", "WO-B-2", "WO-A-1"]);
    const byVessel = await api<FleetOverdue>(as.superintendent, "GET", `${LIST}?vesselId=${f.vesselB.id}`);
    expect(numbers(byVessel.body)).toEqual(["WO-B-1", "WO-B-2"]);
    const flagged = await api<FleetOverdue>(as.superintendent, "GET", `${LIST}?flagged=true`);
    expect(numbers(flagged.body)).toEqual(["WO-B-1", "WO-A-3"]);
    // Another company's vessel id finds nothing here.
    const foreign = await api<FleetOverdue>(as.superintendent, "GET", `${LIST}?vesselId=${other.vesselA.id}`);
    expect(foreign.body.items).toEqual([]);
  });

  it("gives each limit's ship's day in its vessel's zone, and marks asked deferrals and completions awaiting approval", async () => {
    const db = testDb();
    const rows = await db.select().from(s.workOrder).where(eq(s.workOrder.companyId, f.companyId));
    const byNumber = (n: string) => rows.find((r) => r.number === n)!;
    // Vessel A keeps Asia/Singapore time (UTC+8): 00:10 on its day is 16:10 UTC the day before.
    const singapore = shipDay(new Date(Date.now() - 3 * DAY), "Asia/Singapore");
    const a1 = byNumber("WO-A-1");
    await db
      .update(s.workOrder)
      .set({ dueDate: instantOfShipTime(singapore, "00:10", "Asia/Singapore") })
      .where(eq(s.workOrder.id, a1.id));
    const b2 = byNumber("WO-B-2");
    await db.insert(s.deferral).values({
      companyId: f.companyId,
      vesselId: b2.vesselId,
      workOrderId: b2.id,
      reason: "Spares on order",
      proposedDueHours: 500,
      needsOffice: true,
    });
    await db.insert(s.completion).values({
      companyId: f.companyId,
      vesselId: a1.vesselId,
      workOrderId: a1.id,
      doneAt: new Date(),
      manHours: 2,
      status: "awaiting-approval",
    });
    const res = await api<FleetOverdue>(as.superintendent, "GET", LIST);
    const item = (n: string) => res.body.items.find((i) => i.number === n)!;
    expect(item("WO-A-1")).toMatchObject({ dueDay: singapore, pendingDeferral: false, awaitingApproval: true });
    // Vessel B keeps UTC.
    expect(item("WO-B-2")).toMatchObject({
      dueDay: b2.dueDate!.toISOString().slice(0, 10),
      pendingDeferral: true,
      awaitingApproval: false,
    });
    expect(item("WO-A-3")).toMatchObject({ pendingDeferral: false, awaitingApproval: false });
    expect(numbers(res.body)).toEqual(["WO-B-1", "WO-A-2", "WO-A-3", "WO-B-2", "WO-A-1"]);
  });

  it("refuses a filter it does not know, naming it", async () => {
    const res = await api<Problem>(as.superintendent, "GET", `${LIST}?state=overdue&vesselId=AG`);
    expect(res.status).toBe(422);
    expect(res.body.errors?.map((e) => e.field).sort()).toEqual(["query.state", "query.vesselId"]);
    expect(res.body.errors?.find((e) => e.field === "query.state")?.message).toMatch(/out-of-tolerance or late/);
  });
});

describe("GET /api/fleet/overdue/export", () => {
  it("is the same list as CSV, one row per work order, titles made safe for spreadsheets", async () => {
    const response = await fetch(
      `${process.env.KEELSON_TEST_URL ?? "http://127.0.0.1:3000"}${LIST}/export?state=late`,
      {
        headers: { cookie: as.superintendent.cookie },
      },
    );
    expect(response.status).toBe(200);
    expect(response.headers.get("content-type")).toBe("text/csv; charset=utf-8");
    expect(response.headers.get("content-disposition")).toMatch(
      /^attachment; filename="overdue-\d{4}-\d{2}-\d{2}\.csv"$/,
    );
    const text = (await response.text()).replace(/^\uFEFF/, "");
    const lines = text.trim().split("\r\n");
    expect(lines[0]).toBe(
      "Vessel,Work order,Title,Component,State,Since (UTC),Due day (ship's),Due hours,Days overdue,Hours overdue,Rank,Critical,Class item,Planned day,Deferral asked,Awaiting approval",
    );
    expect(lines.slice(1).map((l) => l.split(",")[1])).toEqual(["WO-A-3", "WO-B-2", "WO-A-1"]);
    // The formula-looking title is escaped with a leading apostrophe and quoted (it holds a comma and quotes).
    expect(lines[1]).toContain(`"'=SUM(A1:A9), ""quoted"""`);
    expect(lines[1]).toContain(",late,");
  });
});
