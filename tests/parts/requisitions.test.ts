// Requisitions over HTTP against the real database: a port stay's parts against what is on board,
// the chief engineer's draft, sending, the office's order, receiving line by line into the stores
// until it is delivered; roles, other companies, bad input named with nothing written, the fleet
// list and its CSV.
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as s from "@/db/schema";
import type { DefectView } from "@/server/defects/contract";
import { shipClock, shipDay } from "@/server/format/hours";
import type { Problem } from "@/server/http/problem";
import type { CataloguePart, RequisitionList, RequisitionView, StayParts } from "@/server/parts/contract";
import { lowCriticalSpares } from "@/server/parts/low-stock";
import { recomputeVessel } from "@/server/scheduling/recompute";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { api, BASE_URL, type Session, signIn } from "../support/http";

let f: Fixture;
let other: Fixture;
let chief: Session;
let engineer: Session;
let superintendent: Session;
let viewer: Session;
let stayId = "";
let store = "";
const p: Record<"rings" | "sealant" | "gasket", CataloguePart> = {} as never;
let req: RequisitionView;
let cylinderId = "";

const base = () => `/api/vessels/${f.vesselA.id}`;
const stayParts = (query = "") => api<StayParts>(chief, "GET", `${base()}/port-stays/${stayId}/parts${query}`);
const line = (parts: StayParts, part: CataloguePart) => parts.lines.find((l) => l.partId === part.id);
const onBoard = async (partId: string) =>
  (await testDb().select().from(s.stockMovement).where(and(eq(s.stockMovement.vesselId, f.vesselA.id), eq(s.stockMovement.partId, partId)))).reduce((n, m) => n + m.quantity, 0);
const requisitionRows = async () => testDb().select().from(s.requisition).where(eq(s.requisition.companyId, f.companyId));

beforeAll(async () => {
  [f, other] = await Promise.all([createCompany("requisitions"), createCompany("requisitions-other")]);
  [chief, engineer, superintendent, viewer] = await Promise.all([
    signIn(f.users["chief-engineer"].email, PASSWORD),
    signIn(f.users.engineer.email, PASSWORD),
    signIn(f.users.superintendent.email, PASSWORD),
    signIn(f.users.viewer.email, PASSWORD),
  ]);
  const db = testDb();
  const units = await db
    .insert(s.component)
    .values([1, 2].map((n) => ({ companyId: f.companyId, vesselId: f.vesselA.id, code: `ME.CYL.${n}`, name: `Cylinder unit ${n}` })))
    .returning();
  cylinderId = units[0]!.id;
  const routines = await db
    .insert(s.routine)
    .values(units.map((u) => ({ companyId: f.companyId, vesselId: f.vesselA.id, componentId: u.id, title: `${u.code}: piston overhaul`, calendarRule: "FREQ=YEARLY", baselineAt: new Date(Date.now() - 400 * 86_400_000) })))
    .returning();
  await recomputeVessel(db, f.companyId, f.vesselA.id);
  const orders = await db.select().from(s.workOrder).where(eq(s.workOrder.companyId, f.companyId));
  const day = 86_400_000;
  const [stay] = await db
    .insert(s.portStay)
    .values({ companyId: f.companyId, vesselId: f.vesselA.id, port: "Port Kelang", arrivesAt: new Date(Date.now() + 10 * day), departsAt: new Date(Date.now() + 13 * day) })
    .returning();
  stayId = stay!.id;
  await db.insert(s.workPackageItem).values(
    orders.map((w) => ({ companyId: f.companyId, vesselId: f.vesselA.id, portStayId: stayId, workOrderId: w.id, plannedDate: "2030-01-01", reason: "Out of tolerance" })),
  );
  const make = async (body: Record<string, unknown>) => (await api<CataloguePart>(chief, "POST", "/api/parts", body)).body;
  p.rings = await make({ number: "KP-10432", description: "Piston ring set", unit: "set", critical: true, minimumOnBoard: 2 });
  p.sealant = await make({ number: "SL-5", description: "Liquid sealant", unit: "litre" });
  p.gasket = await make({ number: "GK-77", description: "Cover gasket", unit: "piece", minimumOnBoard: 2 });
  // Each overhaul needs a ring set and 0.5 l of sealant.
  for (const r of routines) {
    await api(chief, "PUT", `${base()}/routines/${r.id}/parts`, { parts: [{ partId: p.rings.id, quantity: 1 }, { partId: p.sealant.id, quantity: 0.5 }] });
  }
  store = (await api<{ id: string }>(engineer, "POST", `${base()}/stores/locations`, { store: "Engine store" })).body.id;
  await api(engineer, "POST", `${base()}/stores/movements`, { kind: "received", partId: p.rings.id, locationId: store, quantity: 1 });
  await api(engineer, "POST", `${base()}/stores/movements`, { kind: "received", partId: p.sealant.id, locationId: store, quantity: 10 });
});
afterAll(closeTestDb);

describe("a port stay's parts", () => {
  it("sets what the accepted package's jobs need against what is on board", async () => {
    const res = await stayParts("?minimum=0");
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ basis: "accepted-package", jobs: 2, canRequest: true });
    // Two overhauls × 1 ring set, 1 on board: 1 short. Sealant 2 × 0.5 l of 10 l: none short.
    expect(line(res.body, p.rings)).toMatchObject({ needed: 2, onBoard: 1, short: 1, toOrder: 1, critical: true });
    expect(line(res.body, p.sealant)).toMatchObject({ needed: 1, onBoard: 10, short: 0, toOrder: 0 });
    expect(line(res.body, p.gasket)).toBeUndefined();
  });

  it("with the minimums kept, asks what brings each part back to its minimum after the jobs", async () => {
    const res = await stayParts();
    // Rings: 2 needed + 2 minimum − 1 = 3. Gaskets: none on board, minimum 2.
    expect(line(res.body, p.rings)?.toOrder).toBe(3);
    expect(line(res.body, p.gasket)).toMatchObject({ needed: 0, toOrder: 2, low: true });
    expect(res.body.lines[0]?.partId).toBe(p.rings.id);
  });

  it("tells the daily digest which critical spares are under their minimum (the gasket is not critical)", async () => {
    expect(await lowCriticalSpares(testDb(), f.companyId, f.vesselA.id)).toEqual([
      { number: "KP-10432", description: "Piston ring set", unit: "set", onBoard: 1, minimum: 2 },
    ]);
    expect(await lowCriticalSpares(testDb(), f.companyId, f.vesselB.id)).toEqual([
      { number: "KP-10432", description: "Piston ring set", unit: "set", onBoard: 0, minimum: 2 },
    ]);
  });

  it("counts the jobs shown on a timeline not yet accepted, and refuses a malformed list", async () => {
    const [one] = await testDb().select().from(s.workPackageItem).where(eq(s.workPackageItem.portStayId, stayId));
    const res = await stayParts(`?minimum=0&jobs=${one!.workOrderId}`);
    expect(res.body).toMatchObject({ basis: "shown", jobs: 1 });
    expect(line(res.body, p.rings)).toMatchObject({ needed: 1, short: 0 });
    const bad = await api<Problem>(chief, "GET", `${base()}/port-stays/${stayId}/parts?jobs=nonsense`);
    expect(bad.status).toBe(422);
    expect(bad.body.errors?.[0]?.field).toBe("query.jobs");
  });
});

describe("a requisition", () => {
  it("is drafted by the chief engineer from the shortfalls, numbered per vessel, for the stay", async () => {
    const res = await api<RequisitionView>(chief, "POST", `${base()}/requisitions`, {
      portStayId: stayId,
      note: "For the Port Kelang overhauls",
      lines: [
        { partId: p.rings.id, quantity: 3, reason: "Short for the stay's overhauls; minimum 2" },
        { partId: p.gasket.id, quantity: "2", reason: "Under its minimum" },
      ],
    });
    expect(res.status).toBe(201);
    req = res.body;
    expect(req).toMatchObject({ number: "RQ-ALPHA-0001", state: "drafted", portStay: { port: "Port Kelang" }, may: { edit: true, send: true, order: false } });
    expect(req.lines.map((l) => [l.number, l.quantity, l.received])).toEqual([["KP-10432", 3, 0], ["GK-77", 2, 0]]);
    // Asked for: the stay's parts no longer ask for them again.
    const after = await stayParts();
    expect(line(after.body, p.rings)).toMatchObject({ onOrder: 3, toOrder: 0 });
    expect(after.body.openRequisitions.map((r) => r.number)).toEqual(["RQ-ALPHA-0001"]);
  });

  it("refuses bad lines by row, other roles and other companies, and writes nothing", async () => {
    const before = await requisitionRows();
    const bad = await api<Problem>(chief, "POST", `${base()}/requisitions`, {
      portStayId: "00000000-0000-4000-8000-000000000000",
      lines: [
        { partId: p.rings.id, quantity: 0.5 },
        { partId: p.gasket.id, quantity: 1 },
        { partId: p.gasket.id, quantity: 1 },
        { partId: "00000000-0000-4000-8000-000000000001", quantity: 1 },
      ],
    });
    expect(bad.status).toBe(422);
    expect(bad.body.errors?.map((e) => e.field)).toEqual(["portStayId", "lines.0.quantity", "lines.2.partId", "lines.3.partId"]);
    expect((await api<Problem>(chief, "POST", `${base()}/requisitions`, { lines: [] })).body.errors?.[0]).toMatchObject({ field: "lines", message: "Ask for at least one part." });
    expect((await api(engineer, "POST", `${base()}/requisitions`, { lines: [{ partId: p.gasket.id, quantity: 1 }] })).status).toBe(403);
    expect((await api(viewer, "GET", `${base()}/requisitions`)).status).toBe(200);
    const outsider = await signIn(other.users["chief-engineer"].email, PASSWORD);
    expect((await api(outsider, "GET", `${base()}/requisitions`)).status).toBe(404);
    expect((await api(outsider, "POST", `${base()}/requisitions/${req.id}/state`, { to: "sent" })).status).toBe(404);
    expect((await api<{ requisitions: RequisitionView[] }>(outsider, "GET", "/api/requisitions?state=all")).body.requisitions).toEqual([]);
    expect(await requisitionRows()).toEqual(before);
  });

  it("is changed while a draft, sent by the chief, ordered by the office, and no longer changed on board", async () => {
    const edited = await api<RequisitionView>(chief, "PATCH", `${base()}/requisitions/${req.id}`, { lines: [{ partId: p.rings.id, quantity: 3 }, { partId: p.gasket.id, quantity: 4, reason: "Under its minimum" }] });
    expect(edited.status).toBe(200);
    expect(edited.body.lines.map((l) => l.quantity)).toEqual([3, 4]);
    expect((await api<Problem>(superintendent, "POST", `${base()}/requisitions/${req.id}/state`, { to: "ordered" })).status).toBe(409);
    const sent = await api<RequisitionView>(chief, "POST", `${base()}/requisitions/${req.id}/state`, { to: "sent" });
    expect(sent.body).toMatchObject({ state: "sent", may: { edit: false, send: false } });
    expect((await api(chief, "PATCH", `${base()}/requisitions/${req.id}`, { note: "changed" })).status).toBe(409);
    expect((await api<Problem>(chief, "POST", `${base()}/requisitions/${req.id}/state`, { to: "ordered" })).status).toBe(403);
    const ordered = await api<RequisitionView>(superintendent, "POST", `${base()}/requisitions/${req.id}/state`, { to: "ordered", orderRef: "PO-7781" });
    expect(ordered.body).toMatchObject({ state: "ordered", orderRef: "PO-7781" });
    req = ordered.body; // a draft's lines are replaced when it is changed
    const open = await api<{ requisitions: RequisitionView[] }>(superintendent, "GET", "/api/requisitions");
    expect(open.body.requisitions.map((r) => [r.number, r.vessel.code, r.state])).toEqual([["RQ-ALPHA-0001", "ALPHA", "ordered"]]);
  });

  it("is received into the stores line by line, and delivered when every line has come", async () => {
    const [rings, gaskets] = req.lines;
    const bad = await api<Problem>(engineer, "POST", `${base()}/requisitions/${req.id}/receipts`, { items: [{ lineId: rings!.id, locationId: other.vesselA.id, quantity: 1.5 }] });
    expect(bad.body.errors?.map((e) => e.field)).toEqual(["items.0.quantity", "items.0.locationId"]);
    const part1 = await api<RequisitionView>(engineer, "POST", `${base()}/requisitions/${req.id}/receipts`, { items: [{ lineId: rings!.id, locationId: store, quantity: 2 }] });
    expect(part1.status).toBe(200);
    expect(part1.body.state).toBe("ordered");
    expect(part1.body.lines.map((l) => l.received)).toEqual([2, 0]);
    expect(await onBoard(p.rings.id)).toBe(3);
    const rest = await api<RequisitionView>(engineer, "POST", `${base()}/requisitions/${req.id}/receipts`, {
      items: [
        { lineId: rings!.id, locationId: store, quantity: 1 },
        { lineId: gaskets!.id, locationId: store, quantity: 4 },
      ],
    });
    expect(rest.body).toMatchObject({ state: "delivered", may: { receive: false, cancel: false } });
    expect(rest.body.deliveredAt).not.toBeNull();
    expect(await onBoard(p.rings.id)).toBe(4);
    expect(await lowCriticalSpares(testDb(), f.companyId, f.vesselA.id)).toEqual([]);
    const moves = await testDb().select().from(s.stockMovement).where(eq(s.stockMovement.requisitionLineId, gaskets!.id));
    expect(moves.map((m) => [m.kind, m.quantity, m.reason])).toEqual([["received", 4, "Delivered against RQ-ALPHA-0001"]]);
    expect((await api(engineer, "POST", `${base()}/requisitions/${req.id}/receipts`, { items: [], complete: true })).status).toBe(409);
    // Delivered: no longer open, still in the whole list.
    expect((await api<{ requisitions: RequisitionView[] }>(superintendent, "GET", "/api/requisitions")).body.requisitions).toEqual([]);
    expect((await api<RequisitionList>(viewer, "GET", `${base()}/requisitions`)).body.requisitions.map((r) => r.state)).toEqual(["delivered"]);
  });

  it("is closed as delivered with what came, or cancelled by the one who holds it", async () => {
    const second = (await api<RequisitionView>(chief, "POST", `${base()}/requisitions`, { lines: [{ partId: p.sealant.id, quantity: 5 }] })).body;
    expect(second.number).toBe("RQ-ALPHA-0002");
    await api(chief, "POST", `${base()}/requisitions/${second.id}/state`, { to: "sent" });
    const closed = await api<RequisitionView>(chief, "POST", `${base()}/requisitions/${second.id}/receipts`, { items: [{ lineId: second.lines[0]!.id, locationId: store, quantity: "2,5" }], complete: true });
    expect(closed.body).toMatchObject({ state: "delivered", lines: [{ quantity: 5, received: 2.5 }] });
    const third = (await api<RequisitionView>(chief, "POST", `${base()}/requisitions`, { lines: [{ partId: p.sealant.id, quantity: 1 }] })).body;
    expect((await api(engineer, "POST", `${base()}/requisitions/${third.id}/state`, { to: "cancelled" })).status).toBe(403);
    expect((await api<RequisitionView>(chief, "POST", `${base()}/requisitions/${third.id}/state`, { to: "cancelled" })).body.state).toBe("cancelled");
  });

  it("lists every requisition as CSV for the office, a row per part", async () => {
    const res = await fetch(`${BASE_URL}/api/requisitions/export?state=all`, { headers: { cookie: superintendent.cookie } });
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toMatch(/text\/csv/);
    const rows = (await res.text()).replace(/^\uFEFF/, "").trim().split("\r\n");
    expect(rows[0]).toBe("Vessel,Requisition,State,Deliver at,Part number,Description,Unit,Asked,Received,Why,Order reference,Drafted (UTC),Sent (UTC),Ordered (UTC),Delivered (UTC),Note");
    expect(rows.filter((r) => r.includes("RQ-ALPHA-0001"))).toHaveLength(2);
    expect(rows.find((r) => r.includes("GK-77"))).toMatch(/,Delivered,"Port Kelang \(arrives \d{4}-\d\d-\d\d, ship’s day\)",GK-77,Cover gasket,piece,4,4,Under its minimum,PO-7781,/);
  });
});

describe("a defect's repair", () => {
  it("brings the parts its plan names into the stay's count", async () => {
    const at = new Date(Date.now() - 3_600_000);
    const reported = await api<DefectView>(engineer, "POST", `${base()}/defects`, {
      componentId: cylinderId,
      title: "Cover gasket leaking",
      foundOn: shipDay(at, f.vesselA.timeZone),
      time: shipClock(at, f.vesselA.timeZone),
    });
    const target = shipDay(new Date(Date.now() + 11 * 86_400_000), f.vesselA.timeZone);
    const planned = await api<DefectView>(chief, "POST", `${base()}/defects/${reported.body.id}/plan`, { targetDay: target, rank: "motorman", manHours: 2, parts: [{ partId: p.gasket.id, quantity: 3 }] });
    expect(planned.status).toBe(200);
    const res = await stayParts(`?minimum=0&jobs=${reported.body.workOrder.id}`);
    // 4 gaskets came on RQ-ALPHA-0001: 3 needed, none short.
    expect(line(res.body, p.gasket)).toMatchObject({ jobs: [reported.body.workOrder.number], needed: 3, onBoard: 4, short: 0 });
  });
});
