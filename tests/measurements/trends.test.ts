// The trends route on the running app and the digest's line, on a fixture company: a piston
// overhaul by running hours with four approved completions (and a fifth awaiting approval, which
// does not count), its counter read daily at 20 h/day. Every expected figure is worked by hand
// with the ordinary least-squares formula (NIST/SEMATECH e-Handbook of Statistical Methods,
// §4.1.4.1; SOURCES.md, "Trends", common practice).
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as s from "@/db/schema";
import { formatShipDate, shipDay } from "@/server/format/hours";
import type { RoutineTrends } from "@/server/measurements/contract";
import { runReminders } from "@/server/reminders/run";
import { digestCutOff } from "@/server/reminders/schedule";
import { recomputeVessel } from "@/server/scheduling/recompute";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { api, type Session, signIn } from "../support/http";

const DAY = 86_400_000;
let f: Fixture;
let other: Fixture;
let engineer: Session;
const ids = { overhaul: "", weekly: "", otherRoutine: "", vesselBRoutine: "", open: "", openNumber: "" };

// Liner wear at 200, 400, 600, 800 h: 0.20, 0.30, 0.34, 0.48 mm (upper limit 0.8).
// x̄ = 500, ȳ = 0.33; x − x̄ = −300, −100, 100, 300; y − ȳ = −0.13, −0.03, 0.01, 0.15.
// Σ(x−x̄)(y−ȳ) = 39 + 3 + 1 + 45 = 88; Σ(x−x̄)² = 90,000 + 10,000 + 10,000 + 90,000 = 200,000.
// slope = 88 / 200,000 = 0.00044 mm/h; intercept = 0.33 − 0.00044 × 500 = 0.11;
// 0.8 is met at (0.8 − 0.11) / 0.00044 = 1,568.18 h — before the next overhaul at 800 + 1,000 = 1,800 h.
// The counter reads 1,000 h, at 20 h/day: (1,568.18 − 1,000) / 20 = 28.409 days after that reading.
// Ring groove clearance 0.30, 0.30, 0.31, 0.30 (limits 0.2–0.5): ȳ = 0.3025, Σ(x−x̄)(y−ȳ) =
// 0.75 + 0.25 + 0.75 − 0.75 = 1.0, slope 5e-6 mm/h, intercept 0.3; 0.5 is met at 40,000 h: no warning.
const SERIES = [
  { hours: 200, wear: 0.2, groove: 0.3 },
  { hours: 400, wear: 0.3, groove: 0.3 },
  { hours: 600, wear: 0.34, groove: 0.31 },
  { hours: 800, wear: 0.48, groove: 0.3 },
];
const MEASUREMENTS = [
  { name: "Liner wear", unit: "mm", lower: 0, upper: 0.8 },
  { name: "Ring groove clearance", unit: "mm", lower: 0.2, upper: 0.5 },
];

const trendsPath = (routineId: string, vesselId = f.vesselA.id) => `/api/vessels/${vesselId}/routines/${routineId}/trends`;

beforeAll(async () => {
  [f, other] = await Promise.all([createCompany("trends"), createCompany("trends-other")]);
  const db = testDb();
  const companyId = f.companyId;
  const vesselId = f.vesselA.id;
  // Ten more daily readings before the fixture's 1,000 h: 20 h a day, so the worker measures the rate.
  await db.insert(s.reading).values(
    Array.from({ length: 10 }, (_, i) => ({
      companyId,
      vesselId,
      counterId: f.counters.main.id,
      readAt: new Date(f.lastReadAt.getTime() - (i + 1) * DAY),
      segment: 1,
      meterValue: 1000 - (i + 1) * 20,
      totalHours: 1000 - (i + 1) * 20,
    })),
  );
  const [cylinder] = await db
    .insert(s.component)
    .values({ companyId, vesselId, code: "ME.CYL.1", name: "Cylinder unit 1", counterId: f.counters.main.id })
    .returning();
  const [pump] = await db.insert(s.component).values({ companyId, vesselId, code: "FF.EFP", name: "Emergency fire pump" }).returning();
  const [overhaul, weekly] = await db
    .insert(s.routine)
    .values([
      {
        companyId,
        vesselId,
        componentId: cylinder!.id,
        title: "Cylinder unit 1: piston overhaul and liner gauging",
        intervalHours: 1000,
        baselineHours: 0,
        baselineAt: new Date(f.lastReadAt.getTime() - 60 * DAY),
        measurements: MEASUREMENTS,
      },
      {
        // Falls due within the digest's 7 days, so the digest is sent at all.
        companyId,
        vesselId,
        componentId: pump!.id,
        title: "Emergency fire pump: run and check delivery pressure",
        calendarRule: "FREQ=WEEKLY",
        baselineAt: new Date(Date.now() - 4 * DAY),
        measurements: [{ name: "Delivery pressure", unit: "bar", lower: 2.7, upper: null }],
      },
    ])
    .returning();
  ids.overhaul = overhaul!.id;
  ids.weekly = weekly!.id;
  // The four approved overhauls, done a month apart before the last reading.
  for (const [i, o] of SERIES.entries()) {
    const doneAt = new Date(f.lastReadAt.getTime() - (50 - i * 10) * DAY);
    const [w] = await db
      .insert(s.workOrder)
      .values({
        companyId,
        vesselId,
        routineId: overhaul!.id,
        componentId: cylinder!.id,
        counterId: f.counters.main.id,
        number: `WO-ALPHA-9000${i + 1}`,
        occurrence: i + 1,
        title: overhaul!.title,
        state: "done",
        dueHours: o.hours,
        completedAt: doneAt,
      })
      .returning();
    await db.insert(s.completion).values({
      companyId,
      vesselId,
      workOrderId: w!.id,
      doneAt,
      counterHours: o.hours,
      manHours: 30,
      measurements: [
        { ...MEASUREMENTS[0]!, value: o.wear, outOfLimits: false },
        { ...MEASUREMENTS[1]!, value: o.groove, outOfLimits: false },
      ],
      status: "approved",
    });
  }
  await recomputeVessel(db, companyId, vesselId);
  const openRow = (await db.select().from(s.workOrder).where(eq(s.workOrder.routineId, overhaul!.id))).find((w) => w.state !== "done")!;
  ids.open = openRow.id;
  ids.openNumber = openRow.number;
  // A fifth completion, recorded on the open work order but not yet approved: not part of the series.
  await db.insert(s.completion).values({
    companyId,
    vesselId,
    workOrderId: openRow.id,
    doneAt: f.lastReadAt,
    counterHours: 1000,
    manHours: 30,
    measurements: [{ ...MEASUREMENTS[0]!, value: 0.05, outOfLimits: false }],
    status: "awaiting-approval",
  });
  // Another company's routine, and a routine on vessel B of this company.
  const [otherComponent] = await db
    .insert(s.component)
    .values({ companyId: other.companyId, vesselId: other.vesselA.id, code: "ME", name: "Main engine" })
    .returning();
  const [otherRoutine] = await db
    .insert(s.routine)
    .values({
      companyId: other.companyId,
      vesselId: other.vesselA.id,
      componentId: otherComponent!.id,
      title: "Main engine: crankshaft deflection",
      calendarRule: "FREQ=YEARLY",
      baselineAt: new Date(),
      measurements: MEASUREMENTS,
    })
    .returning();
  ids.otherRoutine = otherRoutine!.id;
  const [bComponent] = await db
    .insert(s.component)
    .values({ companyId, vesselId: f.vesselB.id, code: "ME", name: "Main engine" })
    .returning();
  const [bRoutine] = await db
    .insert(s.routine)
    .values({
      companyId,
      vesselId: f.vesselB.id,
      componentId: bComponent!.id,
      title: "Main engine: crankshaft deflection",
      calendarRule: "FREQ=YEARLY",
      baselineAt: new Date(),
      measurements: MEASUREMENTS,
    })
    .returning();
  ids.vesselBRoutine = bRoutine!.id;
  engineer = await signIn(f.users.engineer.email, PASSWORD);
});
afterAll(closeTestDb);

describe("GET …/routines/[routineId]/trends", () => {
  it("gives each measurement's series, straight line and projection, and warns before the job falls due", async () => {
    const res = await api<RoutineTrends>(engineer, "GET", trendsPath(ids.overhaul));
    expect(res.status).toBe(200);
    const t = res.body;
    expect(t.routine).toMatchObject({ id: ids.overhaul, basis: "hours" });
    expect(t.counter).toMatchObject({ name: "Main engine", totalHours: 1000 });
    expect(t.counter!.hoursPerDay).toBeCloseTo(20, 6);
    expect(t.next).toMatchObject({ workOrderId: ids.open, number: ids.openNumber, dueHours: 1800 });

    const [wear, groove] = t.measurements;
    // The completion awaiting approval (0.05 mm at 1,000 h) is not in the series.
    expect(wear!.points.map((p) => [p.x, p.value])).toEqual(SERIES.map((o) => [o.hours, o.wear]));
    expect(wear!.line!.slope).toBeCloseTo(0.00044, 12);
    expect(wear!.line!.intercept).toBeCloseTo(0.11, 9);
    expect(wear!.projection).toMatchObject({ kind: "reaches", limit: "upper", limitValue: 0.8 });
    if (wear!.projection.kind !== "reaches") throw new Error("no projection");
    expect(wear!.projection.atHours).toBeCloseTo(1568.18, 2);
    const meetsAt = new Date(f.lastReadAt.getTime() + (0.69 / 0.00044 - 1000) / 20 * DAY);
    expect(Math.abs(new Date(wear!.projection.atDate!).getTime() - meetsAt.getTime())).toBeLessThan(1000);
    const tz = f.vesselA.timeZone;
    expect(wear!.caption).toBe(
      "A straight line fitted by least squares to 4 points against the counter’s running hours, rising 0.440 mm per 1,000 h. " +
        `At the present rate it reaches the upper limit 0.80 mm at about 1,570 h (about ${formatShipDate(meetsAt, tz)}).`,
    );
    expect(wear!.warning).toBe(
      `At the present rate, liner wear reaches its limit 0.80 mm at about 1,570 h (about ${formatShipDate(meetsAt, tz)}) — before this job falls due at 1,800 h.`,
    );

    expect(groove!.line!.slope).toBeCloseTo(5e-6, 12);
    expect(groove!.projection).toMatchObject({ kind: "reaches", limit: "upper", limitValue: 0.5 });
    if (groove!.projection.kind === "reaches") expect(groove!.projection.atHours).toBeCloseTo(40_000, 3);
    expect(groove!.warning).toBeNull();
  });

  it("charts a calendar routine against the date, with too few values to project", async () => {
    const res = await api<RoutineTrends>(engineer, "GET", trendsPath(ids.weekly));
    expect(res.status).toBe(200);
    expect(res.body.routine.basis).toBe("days");
    expect(res.body.measurements[0]).toMatchObject({ points: [], line: null, warning: null, projection: { reason: "too-few-points" } });
  });

  it("is 404 for another company's routine, a routine of another vessel, and a malformed id", async () => {
    // Another company's routine under our own vessel, and under theirs (not ours to open).
    expect((await api(engineer, "GET", trendsPath(ids.otherRoutine))).status).toBe(404);
    expect((await api(engineer, "GET", trendsPath(ids.otherRoutine, other.vesselA.id))).status).toBe(404);
    // Their own chief engineer does not reach ours through their vessel.
    const outsider = await signIn(other.users["chief-engineer"].email, PASSWORD);
    expect((await api(outsider, "GET", trendsPath(ids.overhaul, other.vesselA.id))).status).toBe(404);
    // Vessel B's routine asked for under vessel A, by a role that may open both.
    const superintendent = await signIn(f.users.superintendent.email, PASSWORD);
    expect((await api(superintendent, "GET", trendsPath(ids.vesselBRoutine))).status).toBe(404);
    expect((await api(superintendent, "GET", trendsPath(ids.vesselBRoutine, f.vesselB.id))).status).toBe(200);
    expect((await api(engineer, "GET", trendsPath("not-a-uuid"))).status).toBe(404);
    expect((await api(null, "GET", trendsPath(ids.overhaul))).status).toBe(401);
  });
});

describe("the daily digest", () => {
  it("carries the same warning as a line for the work order", async () => {
    const tz = f.vesselA.timeZone;
    // A moment past the company's digest hour (06:00) on the vessel's day: now, or later today.
    const cutOff = digestCutOff(shipDay(new Date(), tz), 6, tz);
    const at = new Date(Math.max(Date.now(), cutOff.getTime() + 30 * 60_000));
    await runReminders(testDb(), at, { companyIds: [f.companyId] });
    const mails = (await testDb().select().from(s.mailOutbox).where(eq(s.mailOutbox.companyId, f.companyId))).filter(
      (m) => m.kind === "due-digest",
    );
    expect(mails.length).toBeGreaterThan(0);
    const trends = (await api<RoutineTrends>(engineer, "GET", trendsPath(ids.overhaul))).body;
    for (const mail of mails) {
      expect(mail.text).toContain("Measurements reaching their limit before the job falls due");
      expect(mail.text).toContain(`${ids.openNumber} Cylinder unit 1: piston overhaul and liner gauging`);
      expect(mail.text).toContain(trends.measurements[0]!.warning!);
      expect(mail.html).toContain(`/vessels/${f.vesselA.id}/work-orders/${ids.open}`);
      // The clearance heads nowhere near its limit before the job: no line for it.
      expect(mail.text).not.toContain("ring groove clearance reaches");
    }
  });
});
