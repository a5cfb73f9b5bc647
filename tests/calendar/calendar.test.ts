import { TZDate } from "@date-fns/tz";
import { format } from "date-fns";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as s from "@/db/schema";
import type { CalendarRange, PlannedDateResult } from "@/server/calendar/contract";
import { instantOfShipTime, shipDay } from "@/server/format/hours";
import type { Problem } from "@/server/http/problem";
import { recomputeVessel } from "@/server/scheduling/recompute";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { api, type Session, signIn } from "../support/http";

// Vessel A of the fixture keeps Asia/Singapore time (UTC+8, no DST): 23:30 on the ship is 15:30 UTC.
const TZ = "Asia/Singapore";
const DAY = 86_400_000;

let f: Fixture;
let other: Fixture;
let chief: Session;
let engineer: Session;
let viewer: Session;
let today: string;
/** Ship's day `n` days from today. */
const day = (n: number) => shipDay(new Date(Date.parse(`${today}T12:00:00+08:00`) + n * DAY), TZ);
const calendar = (query: string, vesselId = f.vesselA.id) => `/api/vessels/${vesselId}/calendar${query}`;
const plannedDate = (workOrderId: string, vesselId = f.vesselA.id) =>
  `/api/vessels/${vesselId}/work-orders/${workOrderId}/planned-date`;

const wo: Record<"pump" | "wash" | "lateEvening" | "earlyMorning" | "done", string> = {
  pump: "",
  wash: "",
  lateEvening: "",
  earlyMorning: "",
  done: "",
};

async function readWorkOrder(id: string) {
  const [row] = await testDb().select().from(s.workOrder).where(eq(s.workOrder.id, id));
  return row!;
}

beforeAll(async () => {
  [f, other] = await Promise.all([createCompany("calendar"), createCompany("calendar-other")]);
  today = shipDay(new Date(), TZ);
  const db = testDb();
  const companyId = f.companyId;
  const vesselId = f.vesselA.id;
  const [me] = await db
    .insert(s.component)
    .values({ companyId, vesselId, code: "ME", name: "Main engine", counterId: f.counters.main.id, critical: true })
    .returning();
  const [pump] = await db
    .insert(s.component)
    .values({ companyId, vesselId, code: "FP", name: "Fire pump" })
    .returning();
  const [ac] = await db
    .insert(s.component)
    .values({ companyId, vesselId, code: "AC", name: "Air compressor" })
    .returning();
  const routines = await db
    .insert(s.routine)
    .values([
      // Every 100 h from 925 h with the counter at 1,000 h: due at 1,025 h, projected at the
      // counter's planned 12 h/day (no history yet) from yesterday's reading.
      {
        companyId,
        vesselId,
        componentId: me!.id,
        title: "Turbocharger wash",
        critical: true,
        intervalHours: 100,
        baselineHours: 925,
        baselineAt: new Date(Date.now() - 5 * DAY),
      },
      {
        companyId,
        vesselId,
        componentId: pump!.id,
        title: "Fire pump monthly run",
        calendarRule: "FREQ=MONTHLY",
        baselineAt: new Date(Date.now() - 20 * DAY),
      },
      {
        companyId,
        vesselId,
        componentId: ac!.id,
        title: "Compressor valves",
        calendarRule: "FREQ=MONTHLY;INTERVAL=3",
        baselineAt: new Date(Date.now() - 30 * DAY),
      },
      {
        companyId,
        vesselId,
        componentId: ac!.id,
        title: "Compressor drain traps",
        calendarRule: "FREQ=MONTHLY;INTERVAL=2",
        baselineAt: new Date(Date.now() - 30 * DAY),
      },
      {
        companyId,
        vesselId,
        componentId: pump!.id,
        title: "Fire pump gland check",
        calendarRule: "FREQ=MONTHLY;INTERVAL=6",
        baselineAt: new Date(Date.now() - 30 * DAY),
      },
    ])
    .returning();
  await recomputeVessel(db, companyId, vesselId);
  const rows = await db.select().from(s.workOrder).where(eq(s.workOrder.vesselId, vesselId));
  const byTitle = (title: string) => rows.find((r) => r.title === title)!.id;
  wo.wash = byTitle("Turbocharger wash");
  wo.pump = byTitle("Fire pump monthly run");
  wo.lateEvening = byTitle("Compressor valves");
  wo.earlyMorning = byTitle("Compressor drain traps");
  wo.done = byTitle("Fire pump gland check");
  expect(routines).toHaveLength(5);

  // Fixed due instants and plannable days, so the checks below do not depend on the worker's
  // arithmetic (tested in server/scheduling): the pump run is due on day +10 and may be planned
  // from day +3 to day +14.
  const set = (id: string, values: Partial<typeof s.workOrder.$inferInsert>) =>
    db.update(s.workOrder).set(values).where(eq(s.workOrder.id, id));
  await set(wo.pump, {
    dueDate: instantOfShipTime(day(10), "23:59", TZ),
    planFrom: day(3),
    planUntil: day(14),
    plannedDate: null,
  });
  // The ship's-day boundary: 23:30 on day +20 is still day +20; 00:10 the next morning is day +21.
  await set(wo.lateEvening, { dueDate: instantOfShipTime(day(20), "23:30", TZ), planFrom: null, planUntil: null });
  await set(wo.earlyMorning, { dueDate: instantOfShipTime(day(21), "00:10", TZ), planFrom: null, planUntil: null });
  await set(wo.done, { state: "done", completedAt: instantOfShipTime(day(-2), "10:00", TZ) });

  await db.insert(s.portStay).values([
    // Arrives 07:00 on day +5, leaves 19:00 on day +6 (ship's time): the ship's days +5 and +6.
    {
      companyId,
      vesselId,
      port: "Test harbour",
      arrivesAt: instantOfShipTime(day(5), "07:00", TZ),
      departsAt: instantOfShipTime(day(6), "19:00", TZ),
      engineStopFrom: instantOfShipTime(day(5), "07:00", TZ),
      engineStopTo: instantOfShipTime(day(5), "19:00", TZ),
    },
    {
      companyId,
      vesselId,
      port: "Far harbour",
      arrivesAt: instantOfShipTime(day(80), "07:00", TZ),
      departsAt: instantOfShipTime(day(81), "19:00", TZ),
    },
  ]);

  [chief, engineer, viewer] = await Promise.all([
    signIn(f.users["chief-engineer"].email, PASSWORD),
    signIn(f.users.engineer.email, PASSWORD),
    signIn(f.users.viewer.email, PASSWORD),
  ]);
});
afterAll(closeTestDb);

describe("GET /api/vessels/[vesselId]/calendar", () => {
  it("shows each work order on its due ship's day, with its state, flags and the port stays", async () => {
    const res = await api<CalendarRange>(viewer, "GET", calendar(`?start=${day(-7)}&end=${day(35)}`));
    expect(res.status).toBe(200);
    expect(res.body.timeZone).toBe(TZ);
    const pump = res.body.workOrders.find((w) => w.id === wo.pump)!;
    expect(pump).toMatchObject({ day: day(10), dueDay: day(10), plannedDate: null, projected: false, basis: null });
    expect(pump.planFrom).toBe(day(3));
    expect(pump.planUntil).toBe(day(14));
    const wash = res.body.workOrders.find((w) => w.id === wo.wash)!;
    expect(wash.projected).toBe(true);
    expect(wash.critical).toBe(true);
    // The reading the fixture took 24 h ago, on the ship's calendar.
    const readingDay = format(new TZDate(f.lastReadAt, TZ), "d MMM");
    expect(wash.basis).toBe(
      `due at 1,025 h; projected at 12.0 h/day (the planned rate: too little history) from the reading of ${readingDay}, 1,000 h`,
    );
    // Done work appears on the day it was done.
    expect(res.body.workOrders.find((w) => w.id === wo.done)).toMatchObject({ state: "done", day: day(-2) });
    // Only the stay inside the range, with its ship's days.
    expect(res.body.portStays).toEqual([
      expect.objectContaining({
        port: "Test harbour",
        firstDay: day(5),
        lastDay: day(6),
        engineStopHours: 12,
        packageAccepted: false,
      }),
    ]);
    // Ordered by day.
    const days = res.body.workOrders.map((w) => w.day);
    expect(days).toEqual([...days].sort());
  });

  it("puts a work order due at 23:30 ship's time on that ship's day, not the next", async () => {
    const onDay = await api<CalendarRange>(engineer, "GET", calendar(`?start=${day(20)}&end=${day(21)}`));
    expect(onDay.body.workOrders.map((w) => w.id)).toEqual([wo.lateEvening]);
    expect(onDay.body.workOrders[0]!.day).toBe(day(20));
    const next = await api<CalendarRange>(engineer, "GET", calendar(`?start=${day(21)}&end=${day(22)}`));
    expect(next.body.workOrders.map((w) => w.id)).toEqual([wo.earlyMorning]);
  });

  it("gives the same answer for the same range, and the same days inside a wider range", async () => {
    const q = `?start=${day(0)}&end=${day(28)}`;
    const [a, b] = await Promise.all([
      api<CalendarRange>(chief, "GET", calendar(q)),
      api<CalendarRange>(chief, "GET", calendar(q)),
    ]);
    expect(a.body.workOrders.length).toBeGreaterThan(0);
    expect(b.body).toEqual(a.body);
    const wide = await api<CalendarRange>(chief, "GET", calendar(`?start=${day(-14)}&end=${day(56)}`));
    const inside = wide.body.workOrders.filter((w) => w.day >= day(0) && w.day < day(28));
    expect(inside).toEqual(a.body.workOrders);
  });

  it("answers 422 naming the query field for a bad range", async () => {
    const missing = await api<Problem>(chief, "GET", calendar(`?end=${day(3)}`));
    expect(missing.status).toBe(422);
    expect(missing.body.errors?.map((e) => e.field)).toEqual(["query.start"]);
    const backwards = await api<Problem>(chief, "GET", calendar(`?start=${day(3)}&end=${day(3)}`));
    expect(backwards.status).toBe(422);
    expect(backwards.body.errors).toEqual([{ field: "query.end", message: "end must be after start." }]);
    const long = await api<Problem>(chief, "GET", calendar(`?start=${day(0)}&end=${day(150)}`));
    expect(long.status).toBe(422);
    expect(long.body.errors?.[0]).toMatchObject({ field: "query.end" });
    expect(long.body.errors?.[0]?.message).toMatch(/at most 100 days/);
    const notADay = await api<Problem>(chief, "GET", calendar(`?start=1%20Dec&end=${day(3)}`));
    expect(notADay.body.errors?.map((e) => e.field)).toEqual(["query.start"]);
  });

  it("refuses anonymous calls and hides another company's vessel", async () => {
    expect((await api(null, "GET", calendar(`?start=${day(0)}&end=${day(7)}`))).status).toBe(401);
    expect((await api(chief, "GET", calendar(`?start=${day(0)}&end=${day(7)}`, other.vesselA.id))).status).toBe(404);
    // Vessel B is assigned to nobody: a seagoing user cannot open it either.
    expect((await api(chief, "GET", calendar(`?start=${day(0)}&end=${day(7)}`, f.vesselB.id))).status).toBe(404);
  });
});

describe("PUT /api/vessels/[vesselId]/work-orders/[workOrderId]/planned-date", () => {
  it("refuses anonymous calls, roles that do not plan, and other companies' work", async () => {
    expect((await api(null, "PUT", plannedDate(wo.pump), { plannedDate: day(5) })).status).toBe(401);
    expect((await api(engineer, "PUT", plannedDate(wo.pump), { plannedDate: day(5) })).status).toBe(403);
    expect((await api(viewer, "PUT", plannedDate(wo.pump), { plannedDate: day(5) })).status).toBe(403);
    const otherChief = await signIn(other.users["chief-engineer"].email, PASSWORD);
    expect((await api(otherChief, "PUT", plannedDate(wo.pump), { plannedDate: day(5) })).status).toBe(404);
    expect((await api(otherChief, "PUT", plannedDate(wo.pump, other.vesselA.id), { plannedDate: day(5) })).status).toBe(
      404,
    );
    expect((await readWorkOrder(wo.pump)).plannedDate).toBeNull();
  });

  it("answers 422 naming plannedDate for a bad body, and writes nothing", async () => {
    for (const body of [{ plannedDate: "5 Dec" }, {}, { plannedDate: 20261205 }]) {
      const res = await api<Problem>(chief, "PUT", plannedDate(wo.pump), body);
      expect(res.status, JSON.stringify(body)).toBe(422);
      expect(res.body.errors?.map((e) => e.field)).toEqual(["plannedDate"]);
    }
    const empty = await api<Problem>(chief, "PUT", plannedDate(wo.pump), "");
    expect(empty.status).toBe(422);
    expect((await readWorkOrder(wo.pump)).plannedDate).toBeNull();
  });

  it("refuses a day outside the tolerance window, saying which days are allowed, and writes nothing", async () => {
    for (const outside of [day(2), day(15)]) {
      const res = await api<Problem>(chief, "PUT", plannedDate(wo.pump), { plannedDate: outside });
      expect(res.status).toBe(422);
      expect(res.body.errors).toHaveLength(1);
      expect(res.body.errors![0]!.field).toBe("plannedDate");
      const words = (d: string) =>
        new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "long", year: "numeric", timeZone: "UTC" }).format(
          new Date(`${d}T00:00:00Z`),
        );
      expect(res.body.errors![0]!.message).toContain(`may be planned from ${words(day(3))} to ${words(day(14))}`);
      expect(res.body.errors![0]!.message).toContain(`${words(outside)} is outside it`);
    }
    expect((await readWorkOrder(wo.pump)).plannedDate).toBeNull();
  });

  it("stores a day inside the window beside the computed due date, and the Calendar shows it there", async () => {
    const before = await readWorkOrder(wo.pump);
    const res = await api<PlannedDateResult>(chief, "PUT", plannedDate(wo.pump), { plannedDate: day(5) });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ id: wo.pump, plannedDate: day(5), dueDay: day(10) });
    const after = await readWorkOrder(wo.pump);
    expect(after.plannedDate).toBe(day(5));
    expect(after.dueDate?.toISOString()).toBe(before.dueDate?.toISOString());
    expect(after.state).toBe(before.state);

    // Both ends of the window are allowed days.
    for (const edge of [day(3), day(14), day(5)]) {
      expect((await api(chief, "PUT", plannedDate(wo.pump), { plannedDate: edge })).status).toBe(200);
    }
    const onPlan = await api<CalendarRange>(chief, "GET", calendar(`?start=${day(5)}&end=${day(6)}`));
    expect(onPlan.body.workOrders.find((w) => w.id === wo.pump)).toMatchObject({
      day: day(5),
      plannedDate: day(5),
      dueDay: day(10),
    });
    const onDue = await api<CalendarRange>(chief, "GET", calendar(`?start=${day(10)}&end=${day(11)}`));
    expect(onDue.body.workOrders.map((w) => w.id)).not.toContain(wo.pump);
  });

  it("clears a planned date with null, putting the work order back on its due day", async () => {
    const res = await api<PlannedDateResult>(chief, "PUT", plannedDate(wo.pump), { plannedDate: null });
    expect(res.status).toBe(200);
    expect((await readWorkOrder(wo.pump)).plannedDate).toBeNull();
    const onDue = await api<CalendarRange>(chief, "GET", calendar(`?start=${day(10)}&end=${day(11)}`));
    expect(onDue.body.workOrders.map((w) => w.id)).toContain(wo.pump);
  });

  it("refuses a day already past (422) and done work (409)", async () => {
    // A day already gone on board is refused even where the window has no lower bound.
    const past = await api<Problem>(chief, "PUT", plannedDate(wo.lateEvening), { plannedDate: day(-1) });
    expect(past.status).toBe(422);
    expect(past.body.errors?.find((e) => e.field === "plannedDate")?.message).toMatch(/has passed/);
    const res = await api<Problem>(chief, "PUT", plannedDate(wo.done), { plannedDate: day(1) });
    expect(res.status).toBe(409);
    expect(res.body.detail).toMatch(/is done/);
    expect((await readWorkOrder(wo.done)).plannedDate).toBeNull();
  });

  it("answers 404 for a work order id that is not one", async () => {
    expect((await api(chief, "PUT", plannedDate("not-a-uuid"), { plannedDate: day(5) })).status).toBe(404);
    expect((await api(chief, "PUT", plannedDate(crypto.randomUUID()), { plannedDate: day(5) })).status).toBe(404);
  });
});
