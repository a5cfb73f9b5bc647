// Port stays and their work package through the route handlers, against the real database: the
// access door, bad input (422 naming the field or row, nothing written), the proposal within the
// crew's hours, accepting and replacing a package.
import { and, eq, inArray } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as s from "@/db/schema";
import { shipDay } from "@/server/format/hours";
import type { Problem } from "@/server/http/problem";
import type {
  PackageResult,
  PortStayDetail,
  PortStayList,
  PortStayView,
  ProposalView,
} from "@/server/port-stays/contract";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { api, type Session, signIn } from "../support/http";

let f: Fixture;
let other: Fixture;
let chief: Session;
let engineer: Session;
let viewer: Session;
const DAY = 86_400_000;

/** The ship's day (Asia/Singapore, vessel A) `n` days from now. */
const dayIn = (n: number) => shipDay(new Date(Date.now() + n * DAY), f.vesselA.timeZone);

const base = (vesselId = f.vesselA.id) => `/api/vessels/${vesselId}/port-stays`;

// Like the demo crew (db/seed/port-stays.ts), without an electrician.
const CREW = [
  { rank: "chief-engineer", manHoursPerDay: 2 },
  { rank: "second-engineer", manHoursPerDay: 8 },
  { rank: "third-engineer", manHoursPerDay: 8 },
  { rank: "fourth-engineer", manHoursPerDay: 6 },
  { rank: "motorman", manHoursPerDay: 12 },
];

function stayBody(over: Record<string, unknown> = {}) {
  return {
    port: "Test harbour",
    arrivesAt: `${dayIn(3)}T07:00`,
    departsAt: `${dayIn(4)}T19:00`,
    engineMayStop: true,
    immobilisationHours: 10,
    crew: CREW,
    remarks: "Berth 2",
    ...over,
  };
}

async function stayCount(companyId = f.companyId) {
  return (await testDb().select().from(s.portStay).where(eq(s.portStay.companyId, companyId))).length;
}

const wo: Record<string, string> = {};

async function plannedDates(): Promise<Record<string, string | null>> {
  const rows = await testDb()
    .select({ number: s.workOrder.number, plannedDate: s.workOrder.plannedDate })
    .from(s.workOrder)
    .where(eq(s.workOrder.companyId, f.companyId));
  return Object.fromEntries(rows.map((r) => [r.number, r.plannedDate]));
}

beforeAll(async () => {
  [f, other] = await Promise.all([createCompany("port-stays"), createCompany("port-stays-other")]);
  const db = testDb();
  const [comp] = await db
    .insert(s.component)
    .values({ companyId: f.companyId, vesselId: f.vesselA.id, code: "ME", name: "Main engine", counterId: f.counters.main.id })
    .returning();
  const now = Date.now();
  const at = (days: number) => new Date(now + days * DAY);
  type Row = Partial<typeof s.workOrder.$inferInsert> & { number: string; title: string };
  const row = (r: Row, i: number): typeof s.workOrder.$inferInsert => ({
    companyId: f.companyId,
    vesselId: f.vesselA.id,
    componentId: comp!.id,
    occurrence: i + 1,
    state: "window-open",
    dueDate: at(10),
    outOfToleranceAt: at(60),
    ...r,
  });
  const rows: Row[] = [
    { number: "WO-ALPHA-1", title: "Crosshead bearing check", state: "out-of-tolerance", dueDate: at(-40), outOfToleranceAt: at(-5), rank: "second-engineer", estimatedManHours: 6, needsEngineStop: true, critical: true },
    { number: "WO-ALPHA-2", title: "Purifier overhaul", state: "late", dueDate: at(-3), rank: "second-engineer", estimatedManHours: 6 },
    { number: "WO-ALPHA-3", title: "Fuel pump inspection", rank: "second-engineer", estimatedManHours: 4 },
    { number: "WO-ALPHA-4", title: "Turbocharger overhaul", rank: "third-engineer", estimatedManHours: 10 },
    { number: "WO-ALPHA-5", title: "Switchboard insulation test", rank: "electrician", estimatedManHours: 2 },
    { number: "WO-ALPHA-6", title: "Bilge pump overhaul", state: "scheduled", dueDate: at(20), rank: "motorman", estimatedManHours: 12, planFrom: dayIn(4) },
    { number: "WO-ALPHA-7", title: "Boiler survey preparation", state: "scheduled", dueDate: at(200), outOfToleranceAt: at(290), rank: "motorman", estimatedManHours: 3, planFrom: dayIn(150) },
    { number: "WO-ALPHA-8", title: "Cylinder cover overhaul", rank: "third-engineer", estimatedManHours: 8, needsEngineStop: true },
    { number: "WO-ALPHA-9", title: "Strainer cleaning", state: "late", dueDate: at(-20), rank: "motorman", estimatedManHours: 2, planUntil: dayIn(-1) },
  ];
  const inserted = await db.insert(s.workOrder).values(rows.map(row)).returning();
  for (const w of inserted) wo[w.number] = w.id;
  [chief, engineer, viewer] = await Promise.all([
    signIn(f.users["chief-engineer"].email, PASSWORD),
    signIn(f.users.engineer.email, PASSWORD),
    signIn(f.users.viewer.email, PASSWORD),
  ]);
});
afterAll(closeTestDb);

let stay: PortStayView;

describe("creating a port stay", () => {
  it("saves the stay with arrival and departure on the ship's clock", async () => {
    const res = await api<PortStayView>(chief, "POST", base(), stayBody());
    expect(res.status).toBe(201);
    stay = res.body;
    // Asia/Singapore is UTC+08:00 all year: 07:00 ship's time is 23:00 UTC the day before.
    const [y, m, d] = dayIn(3).split("-").map(Number) as [number, number, number];
    expect(stay.arrivesAt).toBe(new Date(Date.UTC(y, m - 1, d, 7 - 8, 0)).toISOString());
    expect(stay).toMatchObject({
      arrivesLocal: `${dayIn(3)}T07:00`,
      departsLocal: `${dayIn(4)}T19:00`,
      days: [dayIn(3), dayIn(4)],
      immobilisationHours: 10,
      crew: CREW,
      packageAcceptedAt: null,
    });
    const list = await api<PortStayList>(viewer, "GET", base());
    expect(list.status).toBe(200);
    expect(list.body.upcoming.map((u) => u.id)).toEqual([stay.id]);
    expect(list.body.latestCrew).toEqual(CREW);
    expect(list.body.may.plan).toBe(false);
  });
});

describe("the access door", () => {
  it("refuses anonymous calls with 401", async () => {
    const calls: [string, string, unknown?][] = [
      ["GET", base()],
      ["POST", base(), stayBody()],
      ["GET", `${base()}/${stay.id}`],
      ["PATCH", `${base()}/${stay.id}`, { port: "X" }],
      ["DELETE", `${base()}/${stay.id}`],
      ["POST", `${base()}/${stay.id}/proposal`],
      ["PUT", `${base()}/${stay.id}/package`, { items: [] }],
    ];
    for (const [method, path, body] of calls) expect((await api(null, method, path, body)).status, `${method} ${path}`).toBe(401);
  });

  it("answers 404 for another company's vessel and stay, and for a vessel not assigned", async () => {
    const outsider = await signIn(other.users["chief-engineer"].email, PASSWORD);
    expect((await api(outsider, "GET", base())).status).toBe(404);
    expect((await api(outsider, "GET", `${base()}/${stay.id}`)).status).toBe(404);
    expect((await api(outsider, "POST", `${base()}/${stay.id}/proposal`)).status).toBe(404);
    // The stay asked for under the outsider's own vessel: still not found.
    expect((await api(outsider, "GET", `${base(other.vesselA.id)}/${stay.id}`)).status).toBe(404);
    expect((await api(outsider, "DELETE", `${base(other.vesselA.id)}/${stay.id}`)).status).toBe(404);
    expect((await api(chief, "GET", base(f.vesselB.id))).status).toBe(404);
    expect((await api(chief, "GET", `${base()}/not-a-uuid`)).status).toBe(404);
    expect(await stayCount()).toBe(1);
  });

  it("answers 403 to an engineer, a viewer and a superintendent planning, and writes nothing", async () => {
    const superintendent = await signIn(f.users.superintendent.email, PASSWORD);
    for (const session of [engineer, viewer, superintendent]) {
      expect((await api(session, "GET", `${base()}/${stay.id}`)).status).toBe(200);
      expect((await api(session, "POST", base(), stayBody())).status).toBe(403);
      expect((await api(session, "PATCH", `${base()}/${stay.id}`, { port: "Changed" })).status).toBe(403);
      expect((await api(session, "DELETE", `${base()}/${stay.id}`)).status).toBe(403);
      expect((await api(session, "POST", `${base()}/${stay.id}/proposal`)).status).toBe(403);
      expect((await api(session, "PUT", `${base()}/${stay.id}/package`, { items: [] })).status).toBe(403);
    }
    expect(await stayCount()).toBe(1);
    const [row] = await testDb().select().from(s.portStay).where(eq(s.portStay.id, stay.id));
    expect(row).toMatchObject({ port: "Test harbour", packageAcceptedAt: null });
  });
});

describe("bad stay input gets 422 naming the field or row, and writes nothing", () => {
  const crewWith = (i: number, row: Record<string, unknown>) => CREW.map((c, n) => (n === i ? { ...c, ...row } : c));
  const cases: [string, () => Record<string, unknown>, string, RegExp][] = [
    ["no port name", () => stayBody({ port: "  " }), "port", /Enter the port name/],
    ["a port name of 81 characters", () => stayBody({ port: "P".repeat(81) }), "port", /80 characters/],
    ["an arrival that is not a date-time", () => stayBody({ arrivesAt: "tomorrow 07:00" }), "arrivesAt", /2026-12-04T07:00/],
    ["a 31 February", () => stayBody({ arrivesAt: "2027-02-31T07:00" }), "arrivesAt", /date and 24-hour/],
    ["a departure before the arrival", () => stayBody({ departsAt: `${dayIn(3)}T06:00` }), "departsAt", /after the arrival/],
    ["a stay of 31 days", () => stayBody({ departsAt: `${dayIn(34)}T07:01` }), "departsAt", /at most 30 days/],
    ["immobilisation of 721 h", () => stayBody({ immobilisationHours: 721 }), "immobilisationHours", /0 to 720/],
    ["immobilisation when the engine may not stop", () => stayBody({ engineMayStop: false }), "immobilisationHours", /may not be immobilised/],
    ["a rank Keelson does not know", () => stayBody({ crew: crewWith(0, { rank: "captain" }) }), "crew.0.rank", /Choose the rank/],
    ["250 man-hours a day", () => stayBody({ crew: crewWith(1, { manHoursPerDay: 250 }) }), "crew.1.manHoursPerDay", /0 to 200/],
    ["man-hours with two decimals", () => stayBody({ crew: crewWith(2, { manHoursPerDay: 7.25 }) }), "crew.2.manHoursPerDay", /one decimal/],
    ["a rank twice", () => stayBody({ crew: crewWith(2, { rank: "second-engineer" }) }), "crew.2.rank", /already on row 2/],
    ["remarks of 2001 characters", () => stayBody({ remarks: "r".repeat(2001) }), "remarks", /2000 characters/],
  ];
  for (const [what, body, field, message] of cases) {
    it(`refuses ${what}`, async () => {
      const res = await api<Problem>(chief, "POST", base(), body());
      expect(res.status).toBe(422);
      expect(res.contentType).toMatch(/problem\+json/);
      const error = res.body.errors?.find((e) => e.field === field);
      expect(error?.message, JSON.stringify(res.body.errors)).toMatch(message);
      expect(await stayCount()).toBe(1);
    });
  }

  it("checks a change merged with the stay: immobilisation without the engine allowed to stop", async () => {
    const res = await api<Problem>(chief, "PATCH", `${base()}/${stay.id}`, { engineMayStop: false });
    expect(res.status).toBe(422);
    expect(res.body.errors?.[0]?.field).toBe("immobilisationHours");
    const [row] = await testDb().select().from(s.portStay).where(eq(s.portStay.id, stay.id));
    expect(row?.engineMayStop).toBe(true);
  });
});

let proposal: ProposalView;

describe("the proposed work package", () => {
  it("fills the crew's hours in priority order and says why for each job", async () => {
    const res = await api<ProposalView>(chief, "POST", `${base()}/${stay.id}/proposal`);
    expect(res.status).toBe(200);
    proposal = res.body;
    const [d1, d2] = [dayIn(3), dayIn(4)];
    // Worked by hand (server/planning/proposal.ts rules), second engineer 8 h a day, motorman 12 h,
    // third engineer 8 h, no electrician, 10 h immobilisation, no next stay (30-day look-ahead):
    // order: tier (out of tolerance, engine stop, urgency), then state, then earliest date.
    //   WO-1 out of tolerance, 6 h 2/E, engine stop → d1 (2/E 2 h left on d1; immobilisation 6 of 10)
    //   WO-8 engine stop, due in 10 days, 8 h 3/E → 4 h of immobilisation left → exceeds-immobilisation
    //   WO-9 late (due 20 days ago) but plannable only until yesterday → past-grace
    //   WO-2 late (due 3 days ago), 6 h 2/E → d1 has 2 h, so d2 (2 h left on d2)
    //   WO-3 window open, 4 h 2/E → 2 h left on either day → no-capacity-for-rank
    //   WO-4 window open, 10 h 3/E → more than 8 h a day → larger-than-any-day
    //   WO-5 window open, electrician → no-rank-on-board
    //   WO-6 scheduled, due in 20 days (inside the horizon), 12 h motorman, plannable from d2 → d2
    //   WO-7 due in 200 days: not a candidate
    const placed = Object.fromEntries(proposal.items.map((i) => [i.number, i.date]));
    expect(placed).toEqual({ "WO-ALPHA-1": d1, "WO-ALPHA-2": d2, "WO-ALPHA-6": d2 });
    const left = Object.fromEntries(proposal.leftOut.map((l) => [l.number, l.reason]));
    expect(left).toEqual({
      "WO-ALPHA-9": "past-grace",
      "WO-ALPHA-8": "exceeds-immobilisation",
      "WO-ALPHA-3": "no-capacity-for-rank",
      "WO-ALPHA-4": "larger-than-any-day",
      "WO-ALPHA-5": "no-rank-on-board",
    });
    expect(proposal.items.find((i) => i.number === "WO-ALPHA-1")).toMatchObject({
      tier: "would-go-out-of-tolerance",
      title: "Crosshead bearing check",
      componentCode: "ME",
    });
    for (const item of [...proposal.items, ...proposal.leftOut]) expect(item.reason.length).toBeGreaterThan(5);
    expect(proposal.immobilisation).toEqual({ allowed: 10, used: 6 });
    expect(proposal.nextStay).toBeNull();
  });

  it("never gives a rank more work on a day than its hours, nor the engine more stops than allowed", async () => {
    const used = new Map<string, number>();
    for (const item of proposal.items) {
      const key = `${item.date}|${item.rank}`;
      used.set(key, (used.get(key) ?? 0) + item.manHours);
      expect(stay.days).toContain(item.date);
    }
    for (const [key, hours] of used) {
      const rank = key.split("|")[1];
      expect(hours, key).toBeLessThanOrEqual(CREW.find((c) => c.rank === rank)?.manHoursPerDay ?? 0);
    }
    for (const u of proposal.usage) expect(u.used).toBeLessThanOrEqual(u.available);
    const stops = proposal.items.filter((i) => i.needsEngineStop).reduce((sum, i) => sum + i.manHours, 0);
    expect(stops).toBeLessThanOrEqual(stay.immobilisationHours);
    // Nothing is written by a proposal.
    expect(Object.values(await plannedDates()).every((d) => d === null)).toBe(true);
  });
});

describe("accepting the package", () => {
  const put = (items: { workOrderId: string; date: string; reason?: string }[]) =>
    api<PackageResult & Problem>(chief, "PUT", `${base()}/${stay.id}/package`, { items });

  it("refuses a date outside the work order's window, the stay or the crew's hours, and writes nothing", async () => {
    const [d1, d2] = [dayIn(3), dayIn(4)];
    const cases: [{ workOrderId: string; date: string }[], string, RegExp][] = [
      // WO-6 may be planned from d2 only.
      [[{ workOrderId: wo["WO-ALPHA-6"]!, date: d1 }], "items.0.date", /inside its tolerance window/],
      [[{ workOrderId: wo["WO-ALPHA-2"]!, date: dayIn(5) }], "items.0.date", /not a day of this stay/],
      // 6 h + 4 h of second engineer on d1: 10 h, over the 8 h on board.
      [
        [
          { workOrderId: wo["WO-ALPHA-2"]!, date: d1 },
          { workOrderId: wo["WO-ALPHA-3"]!, date: d1 },
        ],
        "items.1.date",
        /10 h of work, more than the 8 h/,
      ],
      // 6 h + 8 h with the engine stopped: 14 h of the 10 h allowed.
      [
        [
          { workOrderId: wo["WO-ALPHA-1"]!, date: d1 },
          { workOrderId: wo["WO-ALPHA-8"]!, date: d2 },
        ],
        "items.1.workOrderId",
        /14 h of the 10 h immobilisation/,
      ],
      [[{ workOrderId: wo["WO-ALPHA-5"]!, date: d1 }], "items.0.date", /more than the 0 h on board/],
      [[{ workOrderId: f.vesselB.id, date: d1 }], "items.0.workOrderId", /no such work order/],
      [
        [
          { workOrderId: wo["WO-ALPHA-2"]!, date: d1 },
          { workOrderId: wo["WO-ALPHA-2"]!, date: d2 },
        ],
        "items.1.workOrderId",
        /already item 1/,
      ],
      [[{ workOrderId: wo["WO-ALPHA-2"]!, date: "4 Dec" }], "items.0.date", /YYYY-MM-DD/],
    ];
    for (const [items, field, message] of cases) {
      const res = await put(items);
      expect(res.status, field).toBe(422);
      const error = res.body.errors?.find((e) => e.field === field);
      expect(error?.message, JSON.stringify(res.body.errors)).toMatch(message);
    }
    expect(Object.values(await plannedDates()).every((d) => d === null)).toBe(true);
    const items = await testDb().select().from(s.workPackageItem).where(eq(s.workPackageItem.companyId, f.companyId));
    expect(items).toHaveLength(0);
    const [row] = await testDb().select().from(s.portStay).where(eq(s.portStay.id, stay.id));
    expect(row?.packageAcceptedAt).toBeNull();
  });

  it("writes the planned dates of the accepted items and stamps the stay", async () => {
    const res = await put(proposal.items.map((i) => ({ workOrderId: i.workOrderId, date: i.date, reason: i.reason })));
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ items: 3, cleared: 0 });
    const dates = await plannedDates();
    for (const item of proposal.items) expect(dates[item.number]).toBe(item.date);
    expect(dates["WO-ALPHA-3"]).toBeNull();
    const detail = await api<PortStayDetail>(engineer, "GET", `${base()}/${stay.id}`);
    expect(detail.body.items.map((i) => i.number).sort()).toEqual(["WO-ALPHA-1", "WO-ALPHA-2", "WO-ALPHA-6"]);
    expect(detail.body.items.find((i) => i.number === "WO-ALPHA-1")?.reason).toBe(
      proposal.items.find((i) => i.number === "WO-ALPHA-1")?.reason,
    );
    expect(detail.body.stay.packageAcceptedAt).not.toBeNull();
    expect(detail.body.stay.packageAcceptedBy).toMatch(/chief-engineer/);
  });

  it("replacing the package clears the planned dates of the jobs taken out and keeps the others", async () => {
    const [d1, d2] = [dayIn(3), dayIn(4)];
    const res = await put([
      { workOrderId: wo["WO-ALPHA-1"]!, date: d2 },
      { workOrderId: wo["WO-ALPHA-3"]!, date: d1 },
    ]);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ items: 2, cleared: 2 });
    const dates = await plannedDates();
    expect(dates).toMatchObject({ "WO-ALPHA-1": d2, "WO-ALPHA-3": d1, "WO-ALPHA-2": null, "WO-ALPHA-6": null });
    const items = await testDb()
      .select({ workOrderId: s.workPackageItem.workOrderId, reason: s.workPackageItem.reason })
      .from(s.workPackageItem)
      .where(and(eq(s.workPackageItem.companyId, f.companyId), inArray(s.workPackageItem.workOrderId, [wo["WO-ALPHA-3"]!])));
    expect(items[0]?.reason).toMatch(/chief engineer/);
  });

  it("refuses new dates that leave accepted work outside the stay", async () => {
    // WO-1 is planned on d2: ending the stay on d1 would leave it outside.
    const res = await api<Problem>(chief, "PATCH", `${base()}/${stay.id}`, { departsAt: `${dayIn(3)}T23:00` });
    expect(res.status).toBe(422);
    expect(res.body.errors?.[0]).toMatchObject({ field: "departsAt" });
    expect(res.body.errors?.[0]?.message).toMatch(/WO-ALPHA-1/);
    const ok = await api<PortStayView>(chief, "PATCH", `${base()}/${stay.id}`, { port: "Test harbour east", remarks: "" });
    expect(ok.status).toBe(200);
    expect(ok.body).toMatchObject({ port: "Test harbour east", remarks: "", days: [dayIn(3), dayIn(4)] });
  });

  it("refuses fewer crew hours or less immobilisation than the accepted package needs", async () => {
    // The package: WO-1 (second engineer, 6 h, engine stopped) on d2, WO-3 (second engineer, 4 h) on d1.
    const before = (await testDb().select().from(s.portStay).where(eq(s.portStay.id, stay.id)))[0]!;
    const fewer = CREW.map((c) => (c.rank === "second-engineer" ? { ...c, manHoursPerDay: 5 } : c));
    const crew = await api<Problem>(chief, "PATCH", `${base()}/${stay.id}`, { crew: fewer });
    expect(crew.status).toBe(422);
    expect(crew.body.errors?.[0]).toMatchObject({ field: "crew" });
    // 6 h on d2 for a second engineer with 5 h a day.
    expect(crew.body.errors?.[0]?.message).toMatch(/second engineer would have 6 h of work, more than the 5 h on board/);
    const stop = await api<Problem>(chief, "PATCH", `${base()}/${stay.id}`, { immobilisationHours: 4 });
    expect(stop.body.errors?.[0]).toMatchObject({ field: "immobilisationHours" });
    expect(stop.body.errors?.[0]?.message).toMatch(/WO-ALPHA-1 needs the engine stopped: .*6 h of the 4 h/);
    const none = await api<Problem>(chief, "PATCH", `${base()}/${stay.id}`, { engineMayStop: false, immobilisationHours: 0 });
    expect(none.body.errors?.[0]).toMatchObject({ field: "engineMayStop" });
    expect(none.body.errors?.[0]?.message).toMatch(/no immobilisation is allowed/);
    const after = (await testDb().select().from(s.portStay).where(eq(s.portStay.id, stay.id)))[0]!;
    expect(after).toEqual(before);
    // Enough is still enough: 6 h a day for the second engineer holds both jobs (6 h and 4 h).
    const enough = CREW.map((c) => (c.rank === "second-engineer" ? { ...c, manHoursPerDay: 6 } : c));
    expect((await api(chief, "PATCH", `${base()}/${stay.id}`, { crew: enough, immobilisationHours: 6 })).status).toBe(200);
    expect((await api(chief, "PATCH", `${base()}/${stay.id}`, { crew: CREW, immobilisationHours: 10 })).status).toBe(200);
  });

  it("keeps work of another coming stay's package out of this one", async () => {
    const second = await api<PortStayView>(chief, "POST", base(), stayBody({
      port: "Second harbour",
      arrivesAt: `${dayIn(8)}T07:00`,
      departsAt: `${dayIn(8)}T20:00`,
    }));
    expect(second.status).toBe(201);
    const res = await api<Problem>(chief, "PUT", `${base()}/${second.body.id}/package`, {
      items: [{ workOrderId: wo["WO-ALPHA-1"]!, date: dayIn(8) }],
    });
    expect(res.status).toBe(422);
    expect(res.body.errors?.[0]?.message).toMatch(/in the package of Test harbour east/);
    const proposed = await api<ProposalView>(chief, "POST", `${base()}/${second.body.id}/proposal`);
    expect(proposed.status).toBe(200);
    const numbers = [...proposed.body.items, ...proposed.body.leftOut].map((i) => i.number);
    expect(numbers).not.toContain("WO-ALPHA-1");
    expect(numbers).not.toContain("WO-ALPHA-3");
    // The first stay's horizon is now the second stay's arrival.
    const first = await api<ProposalView>(chief, "POST", `${base()}/${stay.id}/proposal`);
    expect(first.body.nextStay?.port).toBe("Second harbour");
    expect((await api(chief, "DELETE", `${base()}/${second.body.id}`)).status).toBe(200);
  });

  it("deletes a stay with an accepted package only when told to release its planned dates", async () => {
    const refused = await api<Problem>(chief, "DELETE", `${base()}/${stay.id}`);
    expect(refused.status).toBe(409);
    expect(refused.body.detail).toMatch(/accepted work package of 2 jobs/);
    expect(await stayCount()).toBe(1);
    const res = await api<{ released: number }>(chief, "DELETE", `${base()}/${stay.id}?releasePackage=true`);
    expect(res.status).toBe(200);
    expect(res.body.released).toBe(2);
    expect(await stayCount()).toBe(0);
    expect(Object.values(await plannedDates()).every((d) => d === null)).toBe(true);
  });
});
