// The Fleet board against the real database and the running app: who may see it, that it shows
// only the company's own vessels, that its counts are the worker's rows, the stopped-reporting
// flag, the on-time rate, the trend days and the daily snapshot's upsert.
import { and, eq, sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as s from "@/db/schema";
import type { FleetBoard, FleetBoardVessel } from "@/server/fleet/contract";
import { compareForBoard } from "@/server/fleet/figures";
import { takeVesselSnapshot } from "@/server/fleet/snapshot";
import { recomputeVessel } from "@/server/scheduling/recompute";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { api, type Session, signIn } from "../support/http";

const DAY = 86_400_000;
const BOARD = "/api/fleet/board";
let f: Fixture;
let other: Fixture;
const as = {} as Record<"admin" | "superintendent" | "chief" | "engineer" | "viewer" | "outsider", Session>;
let lateOrder: typeof s.workOrder.$inferSelect;

async function board(who: Session = as.superintendent): Promise<FleetBoard> {
  const res = await api<FleetBoard>(who, "GET", BOARD);
  expect(res.status).toBe(200);
  return res.body;
}
const vesselOf = (b: FleetBoard, id: string): FleetBoardVessel => {
  const v = b.vessels.find((x) => x.id === id);
  expect(v, `vessel ${id} on the board`).toBeDefined();
  return v!;
};

/** Open routines on both vessels, some overdue, some critical or class-related. */
async function seedPlan(fx: Fixture) {
  const db = testDb();
  const [me, ae, hull] = await db
    .insert(s.component)
    .values([
      {
        companyId: fx.companyId,
        vesselId: fx.vesselA.id,
        code: "ME",
        name: "Main engine",
        counterId: fx.counters.main.id,
      },
      {
        companyId: fx.companyId,
        vesselId: fx.vesselA.id,
        code: "AE.1",
        name: "Generator 1",
        counterId: fx.counters.gen.id,
      },
      { companyId: fx.companyId, vesselId: fx.vesselB.id, code: "DK", name: "Deck machinery" },
    ])
    .returning();
  const ago = (days: number) => new Date(Date.now() - days * DAY);
  const base = { companyId: fx.companyId, vesselId: fx.vesselA.id };
  await db.insert(s.routine).values([
    // The main engine shows 1,000 h, the generator 500 h (fixtures.ts).
    {
      ...base,
      componentId: me!.id,
      title: "Overdue by hours",
      intervalHours: 100,
      baselineHours: 850,
      baselineAt: ago(20),
    },
    {
      ...base,
      componentId: me!.id,
      title: "Nearly due",
      intervalHours: 100,
      baselineHours: 925,
      baselineAt: ago(5),
      critical: true,
    },
    {
      ...base,
      componentId: ae!.id,
      title: "Class item overdue",
      intervalHours: 250,
      baselineHours: 200,
      baselineAt: ago(40),
      classRelated: true,
    },
    {
      ...base,
      componentId: ae!.id,
      title: "Critical just past",
      intervalHours: 100,
      baselineHours: 395,
      baselineAt: ago(5),
      critical: true,
    },
    {
      ...base,
      componentId: me!.id,
      title: "Monthly, long ago",
      calendarRule: "FREQ=MONTHLY",
      baselineAt: ago(100),
      critical: true,
      classRelated: true,
    },
    { ...base, componentId: me!.id, title: "Yearly, just done", calendarRule: "FREQ=YEARLY", baselineAt: ago(10) },
    {
      ...base,
      vesselId: fx.vesselB.id,
      componentId: hull!.id,
      title: "Winch brake test",
      calendarRule: "FREQ=MONTHLY",
      baselineAt: ago(45),
    },
  ]);
  await recomputeVessel(db, fx.companyId, fx.vesselA.id);
  await recomputeVessel(db, fx.companyId, fx.vesselB.id);
}

/** A work order done and approved `doneDaysAgo`, with the limits given. */
async function doneOrder(
  n: number,
  doneDaysAgo: number,
  limits: Partial<typeof s.workOrder.$inferInsert>,
  counterHours: number | null = null,
) {
  const db = testDb();
  const [component] = await db
    .select({ id: s.component.id })
    .from(s.component)
    .where(and(eq(s.component.companyId, f.companyId), eq(s.component.code, "ME")));
  const doneAt = new Date(Date.now() - doneDaysAgo * DAY);
  const [w] = await db
    .insert(s.workOrder)
    .values({
      companyId: f.companyId,
      vesselId: f.vesselA.id,
      componentId: component!.id,
      number: `WO-ALPHA-H${n}`,
      occurrence: 1,
      title: `Done earlier ${n}`,
      state: "done",
      completedAt: doneAt,
      ...limits,
    })
    .returning();
  await db.insert(s.completion).values({
    companyId: f.companyId,
    vesselId: f.vesselA.id,
    workOrderId: w!.id,
    doneAt,
    counterHours,
    manHours: 2,
    status: "approved",
    decidedAt: new Date(doneAt.getTime() + 3_600_000),
  });
}

beforeAll(async () => {
  [f, other] = await Promise.all([createCompany("fleet"), createCompany("fleet-other")]);
  await Promise.all([seedPlan(f), seedPlan(other)]);
  const db = testDb();
  // Completions of the last 90 days, worked by hand (server/fleet/figures.ts, Keelson's definition):
  //  H1 grace ended 10 days ago, done 12 days ago → on time;
  //  H2 grace ended 20 days ago, done 15 days ago → not on time;
  //  H3 hours grace ends at 900 h, done at 880 h → on time;
  //  H4 done 100 days ago → outside the 90 days, not counted.
  // → 3 completed, 2 on time, rate 2/3 = 0.6667.
  await doneOrder(1, 12, { graceEndsAt: new Date(Date.now() - 10 * DAY) });
  await doneOrder(2, 15, { graceEndsAt: new Date(Date.now() - 20 * DAY) });
  await doneOrder(3, 5, { graceEndsHours: 900, governing: "hours" }, 880);
  await doneOrder(4, 100, { graceEndsAt: new Date(Date.now() - 200 * DAY) });
  await recomputeVessel(db, f.companyId, f.vesselA.id);

  const [found] = await db
    .select()
    .from(s.workOrder)
    .where(and(eq(s.workOrder.companyId, f.companyId), eq(s.workOrder.title, "Class item overdue")));
  lateOrder = found!;
  await db.insert(s.deferral).values({
    companyId: f.companyId,
    vesselId: f.vesselA.id,
    workOrderId: lateOrder!.id,
    reason: "The class surveyor attends at the next port; spares are on board.",
    proposedDueHours: 600,
    needsOffice: true,
    requestedBy: f.users["chief-engineer"].id,
  });

  [as.admin, as.superintendent, as.chief, as.engineer, as.viewer, as.outsider] = await Promise.all([
    signIn(f.users.admin.email, PASSWORD),
    signIn(f.users.superintendent.email, PASSWORD),
    signIn(f.users["chief-engineer"].email, PASSWORD),
    signIn(f.users.engineer.email, PASSWORD),
    signIn(f.users.viewer.email, PASSWORD),
    signIn(other.users.superintendent.email, PASSWORD),
  ]);
});
afterAll(closeTestDb);

describe("who may see the Fleet board", () => {
  it("answers 401 to an anonymous call", async () => {
    const res = await api(null, "GET", BOARD);
    expect(res.status).toBe(401);
    expect(res.contentType).toMatch(/problem\+json/);
  });

  it("answers 403 to the chief engineer, an engineer and a viewer, and shows them no page", async () => {
    for (const who of ["chief", "engineer", "viewer"] as const) {
      const res = await api(as[who], "GET", BOARD);
      expect(res.status, who).toBe(403);
      expect((await api(as[who], "GET", "/fleet")).status, `${who} page`).toBe(404);
    }
  });

  it("answers the administrator and the superintendent, with the page", async () => {
    for (const who of ["admin", "superintendent"] as const) {
      expect((await api(as[who], "GET", BOARD)).status, who).toBe(200);
      expect((await api(as[who], "GET", "/fleet")).status, `${who} page`).toBe(200);
    }
  });
});

describe("the board's figures", () => {
  it("shows the company's own vessels only, and never another company's", async () => {
    const ours = await board();
    expect(ours.vessels.map((v) => v.id).sort()).toEqual([f.vesselA.id, f.vesselB.id].sort());
    const theirs = await board(as.outsider);
    expect(theirs.vessels.map((v) => v.id).sort()).toEqual([other.vesselA.id, other.vesselB.id].sort());
    expect(theirs.pendingDeferrals.map((d) => d.workOrder.id)).not.toContain(lateOrder.id);
    expect(JSON.stringify(theirs)).not.toContain(f.vesselA.id);
  });

  it("counts per state and flag equal a direct count over the worker's work orders", async () => {
    const b = await board();
    const rows = await testDb().execute<{
      vessel_id: string;
      state: string;
      n: number;
      critical: number;
      class_related: number;
    }>(sql`
      select vessel_id, state::text as state, count(*)::int as n,
             count(*) filter (where critical)::int as critical,
             count(*) filter (where class_related)::int as class_related
      from work_order where company_id = ${f.companyId} and state <> 'done'
      group by vessel_id, state`);
    // The scenario must give more than one state, or the comparison would prove little.
    expect(new Set(rows.rows.map((r) => r.state)).size).toBeGreaterThan(1);
    expect(rows.rows.some((r) => r.state === "late" || r.state === "out-of-tolerance")).toBe(true);
    for (const id of [f.vesselA.id, f.vesselB.id]) {
      const of = (state: string) => rows.rows.find((r) => r.vessel_id === id && r.state === state);
      const v = vesselOf(b, id);
      expect(v.day).toBe(b.days.at(-1));
      expect({
        scheduled: v.scheduled,
        windowOpen: v.windowOpen,
        late: v.late,
        outOfTolerance: v.outOfTolerance,
        deferred: v.deferred,
        criticalLate: v.criticalLate,
        criticalOutOfTolerance: v.criticalOutOfTolerance,
        classLate: v.classLate,
        classOutOfTolerance: v.classOutOfTolerance,
      }).toEqual({
        scheduled: of("scheduled")?.n ?? 0,
        windowOpen: of("window-open")?.n ?? 0,
        late: of("late")?.n ?? 0,
        outOfTolerance: of("out-of-tolerance")?.n ?? 0,
        deferred: of("deferred")?.n ?? 0,
        criticalLate: of("late")?.critical ?? 0,
        criticalOutOfTolerance: of("out-of-tolerance")?.critical ?? 0,
        classLate: of("late")?.class_related ?? 0,
        classOutOfTolerance: of("out-of-tolerance")?.class_related ?? 0,
      });
    }
  });

  it("orders the vessels as the board's rule says", async () => {
    const b = await board();
    expect(b.vessels.map((v) => v.id)).toEqual([...b.vessels].sort(compareForBoard).map((v) => v.id));
  });

  it("gives the on-time rate of the last 90 days: 2 on time of the 3 done and the open work out of tolerance", async () => {
    const v = vesselOf(await board(), f.vesselA.id);
    expect(v.completed90).toBe(3);
    // The plan above leaves open work out of tolerance on vessel A; each counts against the rate.
    expect(v.outOfTolerance).toBeGreaterThan(0);
    expect(v.onTimeRate).toBe(Math.round((2 / (3 + v.outOfTolerance)) * 10_000) / 10_000);
    // Vessel B did nothing in the 90 days and its monthly winch brake test, last done 45 days ago, is
    // out of tolerance: 0 on time of 1 judged, 0 % — not "no figure".
    const b = vesselOf(await board(), f.vesselB.id);
    expect(b.outOfTolerance).toBe(1);
    expect(b.onTimeRate).toBe(0);
  });

  it("lists the pending deferral request with its vessel, number, flags and who asked", async () => {
    const b = await board();
    expect(b.pendingDeferrals).toHaveLength(1);
    expect(b.pendingDeferrals[0]).toMatchObject({
      vessel: { id: f.vesselA.id, code: "ALPHA" },
      workOrder: { id: lateOrder.id, number: lateOrder.number, title: "Class item overdue", classRelated: true },
      proposedDueHours: 600,
      needsOffice: true,
      // The fixture names each user after their role (tests/support/fixtures.ts).
      requestedBy: expect.stringMatching(/^chief-engineer /),
      // What the superintendent decides on, and may decide right there.
      reason: "The class surveyor attends at the next port; spares are on board.",
      counter: { name: expect.any(String), basis: expect.stringMatching(/^(measured|planned)$/) },
      mayDecide: true,
    });
    expect(vesselOf(b, f.vesselA.id).pendingDeferrals).toBe(1);
    expect(vesselOf(b, f.vesselB.id).pendingDeferrals).toBe(0);
  });
});

describe("vessels that stopped reporting", () => {
  it("flags a vessel with no reading, or one older than the company's hours, and not one read 24 h ago", async () => {
    let b = await board();
    expect(b.missingReadingsHours).toBe(36);
    expect(vesselOf(b, f.vesselA.id)).toMatchObject({ stoppedReporting: false, daysSinceReading: 1 });
    expect(vesselOf(b, f.vesselB.id)).toMatchObject({
      stoppedReporting: true,
      daysSinceReading: null,
      lastReadingAt: null,
    });

    // Vessel B's last reading 50 h ago: over 36 h → stopped reporting, 2 days since.
    const db = testDb();
    const readAt = new Date(Math.floor(Date.now() / 60_000) * 60_000 - 50 * 3_600_000);
    await db.insert(s.reading).values({
      companyId: f.companyId,
      vesselId: f.vesselB.id,
      counterId: f.counters.otherVessel.id,
      readAt,
      segment: 1,
      meterValue: 10,
      totalHours: 10,
    });
    await takeVesselSnapshot(db, f.companyId, f.vesselB.id);
    b = await board();
    expect(vesselOf(b, f.vesselB.id)).toMatchObject({
      stoppedReporting: true,
      daysSinceReading: 2,
      lastReadingAt: readAt.toISOString(),
    });

    // The company allows 12 h: vessel A, read 24 h ago, has stopped too.
    await db.update(s.company).set({ missingReadingsHours: 12 }).where(eq(s.company.id, f.companyId));
    try {
      b = await board();
      expect(b.missingReadingsHours).toBe(12);
      expect(vesselOf(b, f.vesselA.id).stoppedReporting).toBe(true);
    } finally {
      await db.update(s.company).set({ missingReadingsHours: 36 }).where(eq(s.company.id, f.companyId));
    }
  });
});

describe("snapshots", () => {
  const rowsOf = (vesselId: string) =>
    testDb().select().from(s.vesselSnapshot).where(eq(s.vesselSnapshot.vesselId, vesselId));

  it("upserts one row a vessel a day: a rerun replaces it with the same figures", async () => {
    const db = testDb();
    const now = new Date();
    const first = await takeVesselSnapshot(db, f.companyId, f.vesselA.id, now);
    const again = await takeVesselSnapshot(db, f.companyId, f.vesselA.id, new Date(now.getTime() + 1000));
    expect(again.id).toBe(first.id);
    const { takenAt: _a, ...a } = first;
    const { takenAt: _b, ...b } = again;
    expect(b).toEqual(a);
    const today = (await rowsOf(f.vesselA.id)).filter((r) => r.day === first.day);
    expect(today).toHaveLength(1);
    expect(today[0]!.takenAt.getTime()).toBe(now.getTime() + 1000);
  });

  it("puts earlier days on the trend, and falls back to the latest row when today's is missing", async () => {
    const db = testDb();
    let b = await board();
    const yesterday = b.days.at(-2)!;
    const threeDaysAgo = b.days.at(-4)!;
    await db
      .insert(s.vesselSnapshot)
      .values([
        { companyId: f.companyId, vesselId: f.vesselA.id, day: yesterday, late: 7, outOfTolerance: 3 },
        { companyId: f.companyId, vesselId: f.vesselB.id, day: threeDaysAgo, scheduled: 42, late: 2 },
      ])
      .onConflictDoUpdate({
        target: [s.vesselSnapshot.vesselId, s.vesselSnapshot.day],
        set: {
          late: sql`excluded.late`,
          outOfTolerance: sql`excluded.out_of_tolerance`,
          scheduled: sql`excluded.scheduled`,
        },
      });
    const todayB = b.days.at(-1)!;
    await db
      .delete(s.vesselSnapshot)
      .where(and(eq(s.vesselSnapshot.vesselId, f.vesselB.id), eq(s.vesselSnapshot.day, todayB)));
    try {
      b = await board();
      const a = vesselOf(b, f.vesselA.id);
      expect(a.trend).toHaveLength(90);
      expect(a.trend.at(-2)).toBe(10);
      const bravo = vesselOf(b, f.vesselB.id);
      expect(bravo).toMatchObject({ day: threeDaysAgo, scheduled: 42, late: 2 });
      expect(bravo.trend.at(-4)).toBe(2);
      expect(bravo.trend.at(-1)).toBeNull();
      // The fleet's line sums the vessels of each day: yesterday only vessel A has a row.
      expect(b.fleet.late.at(-2)).toBe(7);
      expect(b.fleet.outOfTolerance.at(-2)).toBe(3);
    } finally {
      await takeVesselSnapshot(db, f.companyId, f.vesselB.id);
    }
  });
});
