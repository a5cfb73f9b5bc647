// Port stays and their work package through the route handlers, against the real database: the
// access door, bad input (422 naming the field or row, nothing written), the proposal on the
// stay's clock (worked by hand below), the timeline's check, accepting and replacing a package.
import { and, eq, inArray } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as s from "@/db/schema";
import { shipDay } from "@/server/format/hours";
import type { Problem } from "@/server/http/problem";
import type {
  PackageCheck,
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

// Like the demo crew (db/seed/port-stays.ts), without an electro-technical officer.
const CREW = [
  { rank: "chief-engineer", count: 1 },
  { rank: "second-engineer", count: 1 },
  { rank: "third-engineer", count: 1 },
  { rank: "motorman", count: 2 },
];

function stayBody(over: Record<string, unknown> = {}) {
  return {
    port: "Test harbour",
    arrivesAt: `${dayIn(3)}T07:00`,
    departsAt: `${dayIn(4)}T19:00`,
    workdayFrom: "07:00",
    workdayTo: "19:00",
    engineStop: { from: `${dayIn(3)}T07:00`, to: `${dayIn(3)}T19:00` },
    crew: CREW,
    watches: [],
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
  const one = (rank: string, hours: number) => ({ rank, estimatedManHours: hours, team: [{ rank, count: 1 }], elapsedHours: hours });
  const rows: Row[] = [
    // A 10 h overhaul by three, with the engine stopped, out of tolerance: 30 man-hours.
    { number: "WO-ALPHA-1", title: "Piston overhaul", state: "out-of-tolerance", dueDate: at(-40), outOfToleranceAt: at(-5), rank: "second-engineer", estimatedManHours: 30, team: [{ rank: "second-engineer", count: 1 }, { rank: "motorman", count: 2 }], elapsedHours: 10, needsEngineStop: true, critical: true },
    { number: "WO-ALPHA-2", title: "Purifier overhaul", state: "late", dueDate: at(-3), needsPort: true, ...one("second-engineer", 6) },
    { number: "WO-ALPHA-3", title: "Generator oil change", ...one("third-engineer", 3) },
    { number: "WO-ALPHA-4", title: "Fire pump run", outOfToleranceAt: at(4), ...one("motorman", 1) },
    { number: "WO-ALPHA-5", title: "Switchboard insulation test", needsPort: true, ...one("electro-technical-officer", 2) },
    { number: "WO-ALPHA-6", title: "Bilge pump overhaul", state: "scheduled", dueDate: at(20), planFrom: dayIn(4), needsPort: true, ...one("motorman", 12) },
    { number: "WO-ALPHA-7", title: "Boiler survey preparation", state: "scheduled", dueDate: at(200), outOfToleranceAt: at(290), planFrom: dayIn(150), needsPort: true, ...one("motorman", 3) },
    { number: "WO-ALPHA-8", title: "Cylinder cover overhaul", needsEngineStop: true, ...one("third-engineer", 8) },
    { number: "WO-ALPHA-9", title: "Strainer cleaning", state: "late", dueDate: at(-20), planUntil: dayIn(-1), needsPort: true, ...one("motorman", 2) },
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
      workdayFrom: "07:00",
      workdayTo: "19:00",
      engineStop: { fromLocal: `${dayIn(3)}T07:00`, toLocal: `${dayIn(3)}T19:00` },
      crew: CREW,
      watches: [],
      packageAcceptedAt: null,
    });
    const list = await api<PortStayList>(viewer, "GET", base());
    expect(list.status).toBe(200);
    expect(list.body.upcoming.map((u) => u.id)).toEqual([stay.id]);
    expect(list.body.latest).toEqual({ crew: CREW, workdayFrom: "07:00", workdayTo: "19:00" });
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
      ["POST", `${base()}/${stay.id}/package/check`, { items: [] }],
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
      expect((await api(session, "POST", `${base()}/${stay.id}/package/check`, { items: [] })).status).toBe(403);
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
    ["a working day that ends before it starts", () => stayBody({ workdayTo: "06:00" }), "workdayTo", /ends after it starts/],
    ["a working time of 25:00", () => stayBody({ workdayFrom: "25:00" }), "workdayFrom", /24-hour ship’s time/],
    ["an engine stop after departure", () => stayBody({ engineStop: { from: `${dayIn(4)}T18:00`, to: `${dayIn(5)}T06:00` } }), "engineStop.from", /within the stay/],
    ["an engine stop that ends before it starts", () => stayBody({ engineStop: { from: `${dayIn(3)}T12:00`, to: `${dayIn(3)}T08:00` } }), "engineStop.to", /ends after it starts/],
    ["a rank Keelson does not know", () => stayBody({ crew: crewWith(0, { rank: "captain" }) }), "crew.0.rank", /Choose the rank/],
    ["21 people of a rank", () => stayBody({ crew: crewWith(1, { count: 21 }) }), "crew.1.count", /at most 20/],
    ["half a person", () => stayBody({ crew: crewWith(2, { count: 1.5 }) }), "crew.2.count", /whole number/],
    ["a rank twice", () => stayBody({ crew: crewWith(2, { rank: "second-engineer" }) }), "crew.2.rank", /already on row 2/],
    ["a watch of a third motorman", () => stayBody({ watches: [{ rank: "motorman", person: 3, from: `${dayIn(3)}T20:00`, to: `${dayIn(3)}T23:00`, label: "cargo" }] }), "watches.0.person", /has 2 of this rank/],
    ["a watch outside the stay", () => stayBody({ watches: [{ rank: "motorman", person: 1, from: `${dayIn(2)}T20:00`, to: `${dayIn(2)}T23:00`, label: "cargo" }] }), "watches.0.from", /within the stay/],
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

  it("checks a change merged with the stay: an engine stop outside the new dates", async () => {
    const res = await api<Problem>(chief, "PATCH", `${base()}/${stay.id}`, { arrivesAt: `${dayIn(3)}T12:00` });
    expect(res.status).toBe(422);
    expect(res.body.errors?.[0]?.field).toBe("engineStop.from");
    const [row] = await testDb().select().from(s.portStay).where(eq(s.portStay.id, stay.id));
    expect(row?.arrivesAt.toISOString()).toBe(stay.arrivesAt);
  });
});

let proposal: ProposalView;
const placedOf = (p: { items: ProposalView["items"] }) =>
  Object.fromEntries(p.items.map((i) => [i.number, [i.startLocal, i.segments.length, i.people.join(" ")]]));

describe("the proposed work package", () => {
  it("puts each job on the stay's clock as worked out by hand, and says why", async () => {
    const res = await api<ProposalView>(chief, "POST", `${base()}/${stay.id}/proposal`);
    expect(res.status).toBe(200);
    proposal = res.body;
    const [d3, d4] = [dayIn(3), dayIn(4)];
    // By hand (server/planning/*): working day 07:00–19:00, engine stop d3 07:00–19:00, second and
    // third engineer ×1, motormen ×2, no electro-technical officer, no next stay (30-day look-ahead).
    // Fill order: engine-stop work, then port-only work, then sea work; most urgent first.
    //   WO-1 out of tolerance, 10 h, second engineer + 2 motormen, engine stop → d3 07:00–17:00
    //   WO-8 falls due, 8 h third engineer, engine stop → d3 07:00–15:00, beside WO-1
    //   WO-9 late but plannable only until yesterday → past-grace
    //   WO-2 late, 6 h second engineer, in port → busy till 17:00, so d3 17:00–19:00 and d4 07:00–11:00
    //     (the 24 h from d3 11:00 hold 6 + 2 + 4 = 12 h of his work: within the 14 h)
    //   WO-5 electro-technical officer → not on board
    //   WO-6 12 h motorman, plannable from d4 → d4 07:00–19:00, the first motorman (tied on 10 h)
    //   WO-4 sea work going out of tolerance in 4 days, before the first day at sea ends → the
    //     motorman with fewer hours (motorman 2), d3 17:00–18:00
    //   WO-3 sea work that can wait → left for the voyage; WO-7 due in 200 days → not considered
    expect(placedOf(proposal)).toEqual({
      "WO-ALPHA-1": [`${d3}T07:00`, 1, "second-engineer#1 motorman#1 motorman#2"],
      "WO-ALPHA-8": [`${d3}T07:00`, 1, "third-engineer#1"],
      "WO-ALPHA-2": [`${d3}T17:00`, 2, "second-engineer#1"],
      "WO-ALPHA-6": [`${d4}T07:00`, 1, "motorman#1"],
      "WO-ALPHA-4": [`${d3}T17:00`, 1, "motorman#2"],
    });
    const left = Object.fromEntries(proposal.leftOut.map((l) => [l.number, l.reason]));
    expect(left).toEqual({ "WO-ALPHA-9": "past-grace", "WO-ALPHA-5": "short-of-rank" });
    expect(proposal.atSea.map((a) => a.number)).toEqual(["WO-ALPHA-3"]);
    const piston = proposal.items.find((i) => i.number === "WO-ALPHA-1")!;
    expect(piston).toMatchObject({ urgency: "out-of-tolerance", group: "engine-stop", title: "Piston overhaul", componentCode: "ME", manHours: 30 });
    expect(piston.reason).toMatch(/inside the engine stop/);
    for (const item of [...proposal.items, ...proposal.leftOut]) expect(item.reason.length).toBeGreaterThan(5);
    // Weights (server/planning/job-classes.ts): WO-1 engine stop 100 × out of tolerance 8 × critical 2
    // × 30 man-hours = 48,000; WO-8 100 × 1 × 8 = 800; WO-2 port 10 × 1 × 6 = 60; WO-6 10 × 1 × 12 =
    // 120; WO-4 sea 1 × 4 × 1 = 4. Left out: WO-9 and WO-5, 10 × 1 × 2 = 20 each.
    expect([proposal.value, proposal.possible]).toEqual([48_984, 49_024]);
    expect(proposal.nextStay).toBeNull();
    // Nothing is written by a proposal.
    expect(Object.values(await plannedDates()).every((d) => d === null)).toBe(true);
  });
});

type Item = { workOrderId: string; start: string; people?: string[]; reason?: string };

describe("the timeline's check and accepting the package", () => {
  const put = (items: Item[]) => api<PackageResult & Problem>(chief, "PUT", `${base()}/${stay.id}/package`, { items });
  const check = (items: Item[]) => api<PackageCheck>(chief, "POST", `${base()}/${stay.id}/package/check`, { items });

  it("refuses a start outside the rules, the wrong people or a person twice, and writes nothing", async () => {
    const [d3, d4] = [dayIn(3), dayIn(4)];
    const cases: [Item[], string, RegExp][] = [
      [[{ workOrderId: wo["WO-ALPHA-8"]!, start: `${d4}T07:00` }], "items.0.start", /not inside the engine stop/],
      [[{ workOrderId: wo["WO-ALPHA-2"]!, start: `${d3}T06:00` }], "items.0.start", /not a working time of this stay/],
      [[{ workOrderId: wo["WO-ALPHA-6"]!, start: `${d3}T07:00` }], "items.0.start", /inside its tolerance window/],
      [[{ workOrderId: wo["WO-ALPHA-2"]!, start: `${d3}T07:00`, people: ["motorman#1"] }], "items.0.people", /its team is second engineer/],
      [
        [
          { workOrderId: wo["WO-ALPHA-1"]!, start: `${d3}T07:00` },
          { workOrderId: wo["WO-ALPHA-2"]!, start: `${d3}T08:00`, people: ["second-engineer#1"] },
        ],
        "items.1.people",
        /second-engineer#1 is on another job or a watch/,
      ],
      [[{ workOrderId: wo["WO-ALPHA-5"]!, start: `${d3}T07:00` }], "items.0.people", /not enough of its team/],
      [[{ workOrderId: f.vesselB.id, start: `${d3}T07:00` }], "items.0.workOrderId", /no such work order/],
      [
        [
          { workOrderId: wo["WO-ALPHA-2"]!, start: `${d3}T07:00` },
          { workOrderId: wo["WO-ALPHA-2"]!, start: `${d4}T07:00` },
        ],
        "items.1.workOrderId",
        /already item 1/,
      ],
      [[{ workOrderId: wo["WO-ALPHA-2"]!, start: "4 Dec" }], "items.0.start", /date and 24-hour/],
    ];
    for (const [items, field, message] of cases) {
      const res = await put(items);
      expect(res.status, field).toBe(422);
      const error = res.body.errors?.find((e) => e.field === field);
      expect(error?.message, JSON.stringify(res.body.errors)).toMatch(message);
    }
    // The check answers the same problems as data (200), for the timeline to show on the job.
    const checked = await check(cases[4]![0]);
    expect(checked.status).toBe(200);
    expect(checked.body.problems).toEqual([expect.objectContaining({ item: 1, field: "people" })]);
    expect(checked.body.items.map((i) => i.number)).toEqual(["WO-ALPHA-1"]);
    expect(Object.values(await plannedDates()).every((d) => d === null)).toBe(true);
    const items = await testDb().select().from(s.workPackageItem).where(eq(s.workPackageItem.companyId, f.companyId));
    expect(items).toHaveLength(0);
    const [row] = await testDb().select().from(s.portStay).where(eq(s.portStay.id, stay.id));
    expect(row?.packageAcceptedAt).toBeNull();
  });

  it("stores the proposal as accepted: times, people, planned days, and stamps the stay", async () => {
    const res = await put(proposal.items.map((i) => ({ workOrderId: i.workOrderId, start: i.startLocal, people: i.people, reason: i.reason })));
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ items: 5, cleared: 0 });
    const dates = await plannedDates();
    for (const item of proposal.items) expect(dates[item.number]).toBe(item.startLocal.slice(0, 10));
    expect(dates["WO-ALPHA-3"]).toBeNull();
    const detail = await api<PortStayDetail>(engineer, "GET", `${base()}/${stay.id}`);
    expect(placedOf(detail.body)).toEqual(placedOf(proposal));
    expect(detail.body.items.find((i) => i.number === "WO-ALPHA-2")?.segments).toEqual(
      proposal.items.find((i) => i.number === "WO-ALPHA-2")?.segments,
    );
    expect(detail.body.items.find((i) => i.number === "WO-ALPHA-1")?.reason).toBe(
      proposal.items.find((i) => i.number === "WO-ALPHA-1")?.reason,
    );
    expect(detail.body.stay.packageAcceptedAt).not.toBeNull();
    expect(detail.body.stay.packageAcceptedBy).toMatch(/chief-engineer/);
  });

  it("replacing the package clears the planned dates of the jobs taken out and keeps the others", async () => {
    const [d3, d4] = [dayIn(3), dayIn(4)];
    const res = await put([
      { workOrderId: wo["WO-ALPHA-1"]!, start: `${d3}T07:00` },
      { workOrderId: wo["WO-ALPHA-3"]!, start: `${d4}T07:00` },
    ]);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ items: 2, cleared: 4 });
    const dates = await plannedDates();
    expect(dates).toMatchObject({ "WO-ALPHA-1": d3, "WO-ALPHA-3": d4, "WO-ALPHA-2": null, "WO-ALPHA-6": null, "WO-ALPHA-8": null });
    const items = await testDb()
      .select({ workOrderId: s.workPackageItem.workOrderId, reason: s.workPackageItem.reason, people: s.workPackageItem.people })
      .from(s.workPackageItem)
      .where(and(eq(s.workPackageItem.companyId, f.companyId), inArray(s.workPackageItem.workOrderId, [wo["WO-ALPHA-3"]!])));
    expect(items[0]).toMatchObject({ people: ["third-engineer#1"] });
    expect(items[0]?.reason).toMatch(/chief engineer/);
  });

  it("refuses a change of the stay that the accepted package would no longer fit, naming the job", async () => {
    // The package: WO-1 d3 07:00–17:00 (second engineer, motormen 1 and 2, engine stopped), WO-3 d4 07:00–10:00.
    const [d3, d4] = [dayIn(3), dayIn(4)];
    const before = (await testDb().select().from(s.portStay).where(eq(s.portStay.id, stay.id)))[0]!;
    const refusals: [Record<string, unknown>, string, RegExp][] = [
      [{ departsAt: `${d4}T09:00` }, "departsAt", /WO-ALPHA-3/],
      [{ engineStop: { from: `${d3}T09:00`, to: `${d3}T19:00` } }, "engineStop", /WO-ALPHA-1: it needs the engine stopped/],
      [{ crew: CREW.map((c) => (c.rank === "motorman" ? { ...c, count: 1 } : c)) }, "crew", /motorman#2 is not in this stay's crew list/],
      [
        { watches: [{ rank: "third-engineer", person: 1, from: `${d4}T06:00`, to: `${d4}T09:00`, label: "bunkering" }] },
        "watches",
        /WO-ALPHA-3: third-engineer#1 is on another job or a watch/,
      ],
    ];
    for (const [patch, field, message] of refusals) {
      const res = await api<Problem>(chief, "PATCH", `${base()}/${stay.id}`, patch);
      expect(res.status, field).toBe(422);
      expect(res.body.errors?.[0]?.field).toBe(field);
      expect(res.body.errors?.[0]?.message).toMatch(message);
    }
    const after = (await testDb().select().from(s.portStay).where(eq(s.portStay.id, stay.id)))[0]!;
    expect(after).toEqual(before);
    const ok = await api<PortStayView>(chief, "PATCH", `${base()}/${stay.id}`, { port: "Test harbour east", remarks: "" });
    expect(ok.status).toBe(200);
    expect(ok.body).toMatchObject({ port: "Test harbour east", remarks: "", days: [d3, d4] });
  });

  it("keeps work of another coming stay's package out of this one", async () => {
    const d8 = dayIn(8);
    const second = await api<PortStayView>(chief, "POST", base(), stayBody({
      port: "Second harbour",
      arrivesAt: `${d8}T07:00`,
      departsAt: `${d8}T20:00`,
      engineStop: null,
    }));
    expect(second.status).toBe(201);
    const res = await api<Problem>(chief, "PUT", `${base()}/${second.body.id}/package`, {
      items: [{ workOrderId: wo["WO-ALPHA-1"]!, start: `${d8}T07:00` }],
    });
    expect(res.status).toBe(422);
    expect(res.body.errors?.[0]?.message).toMatch(/in the package of Test harbour east/);
    const proposed = await api<ProposalView>(chief, "POST", `${base()}/${second.body.id}/proposal`);
    expect(proposed.status).toBe(200);
    const numbers = [...proposed.body.items, ...proposed.body.leftOut, ...proposed.body.atSea].map((i) => i.number);
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
