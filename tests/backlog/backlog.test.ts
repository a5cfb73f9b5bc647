import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as s from "@/db/schema";
import type { BacklogPage } from "@/server/backlog/contract";
import { shipClock, shipDay } from "@/server/format/hours";
import type { Problem } from "@/server/http/problem";
import { recomputeVessel } from "@/server/scheduling/recompute";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { api, type Session, signIn } from "../support/http";

let f: Fixture;
let other: Fixture;
let engineer: Session;
let pumpId: string;
const backlog = (query = "") => `/api/vessels/${f.vesselA.id}/backlog${query}`;

beforeAll(async () => {
  [f, other] = await Promise.all([createCompany("backlog"), createCompany("backlog-other")]);
  const db = testDb();
  const [me] = await db
    .insert(s.component)
    .values({
      companyId: f.companyId,
      vesselId: f.vesselA.id,
      code: "ME",
      name: "Main engine",
      counterId: f.counters.main.id,
      critical: true,
    })
    .returning();
  const [tc] = await db
    .insert(s.component)
    .values({ companyId: f.companyId, vesselId: f.vesselA.id, code: "ME.TC", name: "Turbocharger", parentId: me!.id })
    .returning();
  const [pump] = await db
    .insert(s.component)
    .values({ companyId: f.companyId, vesselId: f.vesselA.id, code: "FP", name: "Fire pump" })
    .returning();
  pumpId = pump!.id;
  // Worked example: the counter stands at 1,000 h. Every 100 h from 925 h → due at 1,025 h; the
  // hours preset's window is 10 % = 10 h, so it opens at 1,015 h (PRODUCT.md's example rule).
  await db.insert(s.routine).values([
    {
      companyId: f.companyId,
      vesselId: f.vesselA.id,
      componentId: tc!.id,
      title: "Turbocharger wash",
      intervalHours: 100,
      baselineHours: 925,
      baselineAt: new Date(Date.now() - 5 * 86_400_000),
      critical: true,
      rank: "motorman",
    },
    {
      companyId: f.companyId,
      vesselId: f.vesselA.id,
      componentId: pump!.id,
      title: "Fire pump monthly run",
      calendarRule: "FREQ=MONTHLY",
      baselineAt: new Date(Date.now() - 45 * 86_400_000),
      rank: "third-engineer",
    },
  ]);
  await recomputeVessel(testDb(), f.companyId, f.vesselA.id);
  engineer = await signIn(f.users.engineer.email, PASSWORD);
});
afterAll(closeTestDb);

describe("GET /api/vessels/[vesselId]/backlog", () => {
  it("lists the worker's work orders, most urgent first, with counts per state", async () => {
    const res = await api<BacklogPage>(engineer, "GET", backlog());
    expect(res.status).toBe(200);
    expect(res.body.total).toBe(2);
    // The monthly run was last done 45 days ago: 15 days past due, past the monthly preset's grace.
    expect(res.body.items.map((i) => [i.title, i.state])).toEqual([
      ["Fire pump monthly run", "out-of-tolerance"],
      ["Turbocharger wash", "scheduled"],
    ]);
    const wash = res.body.items[1]!;
    expect(wash).toMatchObject({ dueHours: 1025, remainingHours: 25, windowOpensHours: 1015, governing: "hours" });
    expect(wash.number).toMatch(/^WO-ALPHA-\d{5}$/);
    expect(res.body.counts).toMatchObject({ scheduled: 1, "out-of-tolerance": 1, late: 0 });
  });

  it("filters by state, component subtree, flags and text", async () => {
    const only = async (q: string) =>
      (await api<BacklogPage>(engineer, "GET", backlog(q))).body.items.map((i) => i.title);
    expect(await only("?state=scheduled")).toEqual(["Turbocharger wash"]);
    const [me] = await testDb()
      .select()
      .from(s.component)
      .where(and(eq(s.component.vesselId, f.vesselA.id), eq(s.component.code, "ME")));
    expect(await only(`?component=${me!.id}`)).toEqual(["Turbocharger wash"]);
    expect(await only(`?component=${pumpId}`)).toEqual(["Fire pump monthly run"]);
    expect(await only("?critical=true")).toEqual(["Turbocharger wash"]);
    expect(await only("?rank=third-engineer")).toEqual(["Fire pump monthly run"]);
    expect(await only("?q=wash")).toEqual(["Turbocharger wash"]);
    expect(await only("?sort=number&pageSize=1&page=2")).toHaveLength(1);
  });

  it("answers 422 naming the query field for bad filters", async () => {
    const res = await api<Problem>(engineer, "GET", backlog("?state=overdue&pageSize=0&engineStop=maybe"));
    expect(res.status).toBe(422);
    expect(res.body.errors?.map((e) => e.field).sort()).toEqual(["query.engineStop", "query.pageSize", "query.state"]);
    expect(res.body.errors?.find((e) => e.field === "query.state")?.message).toMatch(/Unknown state overdue/);
  });

  it("refuses anonymous calls and hides another company's vessel", async () => {
    expect((await api(null, "GET", backlog())).status).toBe(401);
    expect((await api(engineer, "GET", `/api/vessels/${other.vesselA.id}/backlog`)).status).toBe(404);
  });
});

describe("the worker keeps the Backlog current", () => {
  it("a reading entered in the Hour log changes the Backlog within seconds", async () => {
    const now = new Date();
    const post = await api(engineer, "POST", `/api/vessels/${f.vesselA.id}/readings`, {
      shipDay: shipDay(now, f.vesselA.timeZone),
      time: shipClock(now, f.vesselA.timeZone),
      entries: [{ counterId: f.counters.main.id, value: 1018 }],
    });
    expect(post.status).toBe(201);
    let state: string | undefined;
    for (let i = 0; i < 40 && state !== "window-open"; i++) {
      const res = await api<BacklogPage>(engineer, "GET", backlog("?q=wash"));
      state = res.body.items[0]?.state;
      if (state !== "window-open") await new Promise((r) => setTimeout(r, 250));
    }
    // 1,018 h is past the window's opening at 1,015 h and short of the due point at 1,025 h.
    expect(state).toBe("window-open");
    const changes = await testDb()
      .select()
      .from(s.workOrderStateChange)
      .where(eq(s.workOrderStateChange.companyId, f.companyId));
    expect(changes.some((c) => c.fromState === "scheduled" && c.toState === "window-open")).toBe(true);
  });

  it("rerunning changes nothing, and two runs at once never duplicate a work order", async () => {
    const again = await recomputeVessel(testDb(), f.companyId, f.vesselA.id);
    expect(again).toMatchObject({ created: 0, updated: 0, stateChanges: 0 });
    // A new routine, then two workers at once.
    await testDb()
      .insert(s.routine)
      .values({
        companyId: f.companyId,
        vesselId: f.vesselA.id,
        componentId: pumpId,
        title: "Fire pump flow test",
        calendarRule: "FREQ=YEARLY",
        baselineAt: new Date(),
      });
    const [a, b] = await Promise.all([
      recomputeVessel(testDb(), f.companyId, f.vesselA.id),
      recomputeVessel(testDb(), f.companyId, f.vesselA.id),
    ]);
    expect(a.created + b.created).toBe(1);
    const rows = await testDb().select().from(s.workOrder).where(eq(s.workOrder.vesselId, f.vesselA.id));
    expect(rows).toHaveLength(3);
    expect(new Set(rows.map((r) => r.number)).size).toBe(3);
  });
});
