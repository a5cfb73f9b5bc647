import { and, eq, isNull } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as s from "@/db/schema";
import type { BacklogPage } from "@/server/backlog/contract";
import type { CompletionResult, WorkOrderDetail } from "@/server/completions/contract";
import { shipClock, shipDay } from "@/server/format/hours";
import type { Problem } from "@/server/http/problem";
import { recomputeVessel } from "@/server/scheduling/recompute";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { api, type Session, signIn } from "../support/http";

let f: Fixture;
let other: Fixture;
let engineer: Session;
let chief: Session;
const STEPS = ["Isolate and lock out", "Open up", "Measure and renew rings", "Box up and test run"];
const routineIds = { overhaul: "", injector: "" };
const workOrders = { overhaul: { id: "", number: "" }, injector: { id: "", number: "" } };

const path = (workOrderId: string, tail = "", vesselId = f.vesselA.id) =>
  `/api/vessels/${vesselId}/work-orders/${workOrderId}${tail}`;

/** A completion done now (ship's time), every step ticked, values inside the limits. */
function completionBody(over: Record<string, unknown> = {}) {
  const now = new Date();
  return {
    doneOn: shipDay(now, f.vesselA.timeZone),
    time: shipClock(now, f.vesselA.timeZone),
    counterHours: 1010,
    manHours: 14.5,
    checklist: STEPS.map((step) => ({ step, done: true })),
    measurements: [{ name: "Liner wear", value: 0.42 }],
    remarks: "Rings renewed; liner within limits.",
    ...over,
  };
}

async function writtenRows() {
  const db = testDb();
  const completions = await db.select().from(s.completion).where(eq(s.completion.companyId, f.companyId));
  const orders = await db.select().from(s.workOrder).where(eq(s.workOrder.companyId, f.companyId));
  const seq = await db.select({ seq: s.vessel.workOrderSeq }).from(s.vessel).where(eq(s.vessel.id, f.vesselA.id));
  return { completions: completions.length, workOrders: orders.length, seq: seq[0]?.seq };
}

beforeAll(async () => {
  [f, other] = await Promise.all([createCompany("completions"), createCompany("completions-other")]);
  const db = testDb();
  const [me] = await db
    .insert(s.component)
    .values({
      companyId: f.companyId,
      vesselId: f.vesselA.id,
      code: "ME.CYL.1",
      name: "Cylinder unit 1",
      counterId: f.counters.main.id,
    })
    .returning();
  const [ae] = await db
    .insert(s.component)
    .values({
      companyId: f.companyId,
      vesselId: f.vesselA.id,
      code: "AE.1",
      name: "Generator set 1",
      counterId: f.counters.gen.id,
    })
    .returning();
  const baselineAt = new Date(Date.now() - 5 * 86_400_000);
  const [overhaul, injector] = await db
    .insert(s.routine)
    .values([
      {
        companyId: f.companyId,
        vesselId: f.vesselA.id,
        componentId: me!.id,
        title: "Cylinder unit 1: piston overhaul",
        intervalHours: 100,
        baselineHours: 925,
        baselineAt,
        checklist: STEPS,
        measurements: [{ name: "Liner wear", unit: "mm", lower: null, upper: 0.8 }],
        cautions: ["isolation", "turning-gear"],
        critical: true,
      },
      {
        companyId: f.companyId,
        vesselId: f.vesselA.id,
        componentId: ae!.id,
        title: "Generator set 1: injector pressure test",
        intervalHours: 250,
        baselineHours: 400,
        baselineAt,
        checklist: ["Remove injectors", "Test on the bench"],
        measurements: [{ name: "Opening pressure", unit: "bar", lower: 380, upper: 400 }],
      },
    ])
    .returning();
  routineIds.overhaul = overhaul!.id;
  routineIds.injector = injector!.id;
  await recomputeVessel(db, f.companyId, f.vesselA.id);
  const orders = await db.select().from(s.workOrder).where(eq(s.workOrder.companyId, f.companyId));
  const byRoutine = (id: string) => orders.find((o) => o.routineId === id)!;
  workOrders.overhaul = byRoutine(overhaul!.id);
  workOrders.injector = byRoutine(injector!.id);
  [engineer, chief] = await Promise.all([
    signIn(f.users.engineer.email, PASSWORD),
    signIn(f.users["chief-engineer"].email, PASSWORD),
  ]);
});
afterAll(closeTestDb);

describe("access to a work order and its completion", () => {
  it("refuses anonymous calls", async () => {
    expect((await api(null, "GET", path(workOrders.overhaul.id))).status).toBe(401);
    expect((await api(null, "POST", path(workOrders.overhaul.id, "/completion"), completionBody())).status).toBe(401);
    expect(
      (await api(null, "POST", path(workOrders.overhaul.id, "/completion/decision"), { decision: "approve" })).status,
    ).toBe(401);
  });

  it("answers 404 for another company's vessel and for a work order not on this vessel", async () => {
    const outsider = await signIn(other.users.engineer.email, PASSWORD);
    expect((await api(outsider, "GET", path(workOrders.overhaul.id))).status).toBe(404);
    expect((await api(outsider, "POST", path(workOrders.overhaul.id, "/completion"), completionBody())).status).toBe(
      404,
    );
    expect((await api(engineer, "GET", path(workOrders.overhaul.id, "", other.vesselA.id))).status).toBe(404);
    // The work order is on vessel A: asked for under vessel B (whole-fleet role) it is not found.
    const superintendent = await signIn(f.users.superintendent.email, PASSWORD);
    expect((await api(superintendent, "GET", path(workOrders.overhaul.id, "", f.vesselB.id))).status).toBe(404);
    expect((await api(engineer, "GET", path("not-a-uuid"))).status).toBe(404);
  });

  it("answers 403 to a viewer or superintendent recording and to an engineer deciding", async () => {
    for (const role of ["viewer", "superintendent"] as const) {
      const session = await signIn(f.users[role].email, PASSWORD);
      expect((await api(session, "GET", path(workOrders.overhaul.id))).status).toBe(200);
      expect((await api(session, "POST", path(workOrders.overhaul.id, "/completion"), completionBody())).status).toBe(
        403,
      );
    }
    const decided = await api(engineer, "POST", path(workOrders.overhaul.id, "/completion/decision"), {
      decision: "approve",
    });
    expect(decided.status).toBe(403);
  });

  it("shows the work order with its routine, counter and the latest reading", async () => {
    const res = await api<WorkOrderDetail>(engineer, "GET", path(workOrders.overhaul.id));
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({
      workOrder: { number: workOrders.overhaul.number, dueHours: 1025 },
      component: { code: "ME.CYL.1" },
      routine: { checklist: STEPS, cautions: ["isolation", "turning-gear"] },
      counter: { name: "Main engine", latest: { totalHours: 1000 } },
      counterRequired: true,
      completion: null,
      may: { record: true, approve: false },
    });
  });
});

describe("bad input gets 422 naming the field, and writes nothing", () => {
  const tomorrow = () => shipDay(new Date(Date.now() + 2 * 86_400_000), f.vesselA.timeZone);
  const cases: [string, () => Record<string, unknown>, string, RegExp][] = [
    ["a date in the future", () => completionBody({ doneOn: tomorrow() }), "doneOn", /in the future/],
    [
      "a counter value below the last reading",
      () => completionBody({ counterHours: 990 }),
      "counterHours",
      /lower than the previous/,
    ],
    ["more hours than elapsed", () => completionBody({ counterHours: 1030 }), "counterHours", /only 24 h passed/],
    [
      "no counter value on an hours routine",
      () => completionBody({ counterHours: null }),
      "counterHours",
      /falls due by running hours/,
    ],
    [
      "an unticked step without a remark",
      () => completionBody({ checklist: STEPS.map((step, i) => ({ step, done: i !== 2 })) }),
      "checklist.2.remark",
      /Step 3 is not ticked/,
    ],
    [
      "an unknown measurement",
      () =>
        completionBody({
          measurements: [
            { name: "Liner wear", value: 0.4 },
            { name: "Bore", value: 600 },
          ],
        }),
      "measurements.1.name",
      /not a measurement of this routine/,
    ],
    [
      "a viewer as the person responsible",
      () => completionBody({ responsibleId: f.users.viewer.id }),
      "responsibleId",
      /chief engineer or engineer of this company assigned to this vessel/,
    ],
    [
      "a rank Keelson does not know among who did the work",
      () => completionBody({ workedBy: [{ rank: "second-engineer", name: "Lim" }, { rank: "cook", name: "" }] }),
      "workedBy.1.rank",
      /Choose the rank/,
    ],
  ];
  for (const [what, body, field, message] of cases) {
    it(`refuses ${what}`, async () => {
      const before = await writtenRows();
      const res = await api<Problem>(engineer, "POST", path(workOrders.overhaul.id, "/completion"), body());
      expect(res.status).toBe(422);
      expect(res.contentType).toContain("application/problem+json");
      const error = res.body.errors?.find((e) => e.field === field);
      expect(error?.message).toMatch(message);
      expect(await writtenRows()).toEqual(before);
    });
  }
});

describe("a completion from record to the next occurrence", () => {
  it("is recorded as awaiting approval and marked so in the Backlog", async () => {
    const res = await api<CompletionResult>(
      engineer,
      "POST",
      path(workOrders.overhaul.id, "/completion"),
      completionBody({
        responsibleId: f.users["chief-engineer"].id,
        workedBy: [
          { rank: "second-engineer", name: "Lim" },
          { rank: "motorman", name: "Aziz" },
        ],
      }),
    );
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ status: "awaiting-approval", followUpNumber: null });
    // The engineer recorded it; the chief answers for it; two others did the work.
    const detail = await api<WorkOrderDetail>(engineer, "GET", path(workOrders.overhaul.id));
    expect(detail.body.completion).toMatchObject({
      doneBy: expect.stringMatching(/^engineer /),
      responsibleId: f.users["chief-engineer"].id,
      responsible: expect.stringMatching(/^chief-engineer /),
      workedBy: [
        { rank: "second-engineer", name: "Lim" },
        { rank: "motorman", name: "Aziz" },
      ],
    });
    expect(detail.body.responsibleChoices.map((c) => c.role).sort()).toEqual(["chief-engineer", "engineer"]);
    const backlog = await api<BacklogPage>(
      engineer,
      "GET",
      `/api/vessels/${f.vesselA.id}/backlog?q=${workOrders.overhaul.number}`,
    );
    expect(backlog.body.items).toHaveLength(1);
    expect(backlog.body.items[0]?.awaitingApproval).toBe(true);
  });

  it("cannot be recorded twice while it awaits approval (409)", async () => {
    const res = await api<Problem>(engineer, "POST", path(workOrders.overhaul.id, "/completion"), completionBody());
    expect(res.status).toBe(409);
    expect(res.body.detail).toMatch(/awaiting approval/);
  });

  it("approved by the chief, the work order is done and the worker schedules occurrence 2", async () => {
    const res = await api(chief, "POST", path(workOrders.overhaul.id, "/completion/decision"), { decision: "approve" });
    expect(res.status).toBe(200);
    const detail = await api<WorkOrderDetail>(chief, "GET", path(workOrders.overhaul.id));
    expect(detail.body.workOrder.state).toBe("done");
    expect(detail.body.completion).toMatchObject({
      status: "approved",
      counterHours: 1010,
      decidedBy: expect.any(String),
    });
    const changes = await testDb()
      .select()
      .from(s.workOrderStateChange)
      .where(
        and(eq(s.workOrderStateChange.workOrderId, workOrders.overhaul.id), eq(s.workOrderStateChange.toState, "done")),
      );
    expect(changes).toHaveLength(1);

    let next: typeof s.workOrder.$inferSelect | undefined;
    for (let i = 0; i < 40 && !next; i++) {
      [next] = await testDb()
        .select()
        .from(s.workOrder)
        .where(and(eq(s.workOrder.routineId, routineIds.overhaul), eq(s.workOrder.occurrence, 2)));
      if (!next) await new Promise((r) => setTimeout(r, 250));
    }
    // Counted from the completion: 1,010 h at completion + 100 h interval.
    expect(next).toMatchObject({ occurrence: 2, dueHours: 1110 });
    expect(next?.number).toMatch(/^WO-ALPHA-\d{5}$/);
    // The next occurrence shows this job as earlier work on the component.
    const following = await api<WorkOrderDetail>(engineer, "GET", path(next!.id));
    expect(following.body.history.map((h) => [h.number, h.counterHours])).toEqual([[workOrders.overhaul.number, 1010]]);
  });

  it("a done work order takes no second completion (409)", async () => {
    const res = await api<Problem>(engineer, "POST", path(workOrders.overhaul.id, "/completion"), completionBody());
    expect(res.status).toBe(409);
    expect(res.body.detail).toMatch(/already done/);
  });
});

describe("a measurement out of limits", () => {
  const injectorBody = (value: number) =>
    completionBody({
      counterHours: 510,
      checklist: [
        { step: "Remove injectors", done: true },
        { step: "Test on the bench", done: true },
      ],
      measurements: [{ name: "Opening pressure", value }],
    });
  const correctives = () =>
    testDb()
      .select()
      .from(s.workOrder)
      .where(
        and(eq(s.workOrder.companyId, f.companyId), eq(s.workOrder.kind, "corrective"), isNull(s.workOrder.routineId)),
      );

  it("creates exactly one corrective work order with a work-order number", async () => {
    const res = await api<CompletionResult>(
      engineer,
      "POST",
      path(workOrders.injector.id, "/completion"),
      injectorBody(360),
    );
    expect(res.status).toBe(201);
    const rows = await correctives();
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({
      title: "Follow-up: Opening pressure out of limits on AE.1",
      state: "window-open",
      occurrence: 1,
      number: res.body.followUpNumber,
    });
    expect(rows[0]?.number).toMatch(/^WO-ALPHA-\d{5}$/);
    const all = await testDb().select().from(s.workOrder).where(eq(s.workOrder.companyId, f.companyId));
    expect(new Set(all.map((w) => w.number)).size).toBe(all.length);
    const detail = await api<WorkOrderDetail>(engineer, "GET", path(workOrders.injector.id));
    expect(detail.body.completion?.measurements[0]).toMatchObject({ value: 360, outOfLimits: true });
  });

  it("returned with a note, corrected and resubmitted: the same completion, no second follow-up", async () => {
    const returned = await api(chief, "POST", path(workOrders.injector.id, "/completion/decision"), {
      decision: "return",
      note: "Write down which nozzle was renewed.",
    });
    expect(returned.status).toBe(200);
    const again = await api<CompletionResult>(
      engineer,
      "PUT",
      path(workOrders.injector.id, "/completion"),
      injectorBody(360),
    );
    expect(again.status).toBe(200);
    expect(again.body).toMatchObject({ status: "awaiting-approval", followUpNumber: null });
    const rows = await testDb().select().from(s.completion).where(eq(s.completion.workOrderId, workOrders.injector.id));
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({
      status: "awaiting-approval",
      decisionNote: "Write down which nozzle was renewed.",
    });
    expect(await correctives()).toHaveLength(1);
  });
});
