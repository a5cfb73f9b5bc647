// The parts catalogue and the stores on board over HTTP against the real database: who may edit
// the catalogue and move stock, company isolation, bad input named with nothing written, stock as
// the sum of its movements, and two people taking the last part at once.
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as s from "@/db/schema";
import type { Problem } from "@/server/http/problem";
import type { Catalogue, CataloguePart, StoresView } from "@/server/parts/contract";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { api, type Session, signIn } from "../support/http";

let f: Fixture;
let other: Fixture;
let chief: Session;
let engineer: Session;
let superintendent: Session;
let viewer: Session;
let cylinderId: string;
let ringSet: CataloguePart;
let oil: CataloguePart;
const loc: Record<string, string> = {};

beforeAll(async () => {
  [f, other] = await Promise.all([createCompany("parts"), createCompany("parts-other")]);
  [chief, engineer, superintendent, viewer] = await Promise.all([
    signIn(f.users["chief-engineer"].email, PASSWORD),
    signIn(f.users.engineer.email, PASSWORD),
    signIn(f.users.superintendent.email, PASSWORD),
    signIn(f.users.viewer.email, PASSWORD),
  ]);
  const [cyl] = await testDb().insert(s.component).values({ companyId: f.companyId, vesselId: f.vesselA.id, code: "ME.CYL.1", name: "Cylinder unit 1" }).returning();
  cylinderId = cyl!.id;
});
afterAll(closeTestDb);

const movements = async () => testDb().select().from(s.stockMovement).where(eq(s.stockMovement.vesselId, f.vesselA.id));

describe("the catalogue", () => {
  it("takes a part from the superintendent with the components it fits, and lists it to everyone in the company", async () => {
    const res = await api<CataloguePart>(superintendent, "POST", "/api/parts", {
      number: "KP-10432",
      makerRef: "HV-90-221",
      description: "Piston ring set, cylinder unit",
      unit: "set",
      critical: true,
      minimumOnBoard: "2",
      fits: [cylinderId],
    });
    expect(res.status).toBe(201);
    ringSet = res.body;
    expect(ringSet).toMatchObject({ number: "KP-10432", unit: "set", critical: true, minimumOnBoard: 2, fits: [{ code: "ME.CYL.1", vesselCode: "ALPHA" }] });
    oil = (await api<CataloguePart>(chief, "POST", "/api/parts", { number: "LO-40", description: "Cylinder oil, BN 40", unit: "litre" })).body;
    const list = await api<Catalogue>(viewer, "GET", "/api/parts");
    expect(list.body.parts.map((p) => p.number)).toEqual(["KP-10432", "LO-40"]);
    expect(list.body.canEdit).toBe(false);
  });

  it("refuses bad input by field, a number twice, other roles and other companies, and writes nothing", async () => {
    const bad = await api<Problem>(chief, "POST", "/api/parts", { number: "bad number!", description: "x", unit: "crate" });
    expect(bad.status).toBe(422);
    expect(bad.body.errors?.map((e) => e.field).sort()).toEqual(["description", "number", "unit"]);
    const twice = await api<Problem>(chief, "POST", "/api/parts", { number: "KP-10432", description: "Another ring set" });
    expect(twice.status).toBe(422);
    expect(twice.body.errors).toEqual([{ field: "number", message: "The catalogue already has a part of that number." }]);
    expect((await api(engineer, "POST", "/api/parts", { number: "X-1", description: "Bolt" })).status).toBe(403);
    // Another company's component cannot be fitted, nor its part changed.
    const [foreign] = await testDb().insert(s.component).values({ companyId: other.companyId, vesselId: other.vesselA.id, code: "ME", name: "Main engine" }).returning();
    const fits = await api<Problem>(chief, "PATCH", `/api/parts/${ringSet.id}`, { fits: [foreign!.id] });
    expect(fits.status).toBe(422);
    expect(fits.body.errors?.[0]?.field).toBe("fits");
    const outsider = await signIn(other.users.admin.email, PASSWORD);
    expect((await api(outsider, "PATCH", `/api/parts/${ringSet.id}`, { description: "Mine now" })).status).toBe(404);
    expect((await api<Catalogue>(outsider, "GET", "/api/parts")).body.parts).toEqual([]);
    const [stored] = await testDb().select().from(s.part).where(eq(s.part.id, ringSet.id));
    expect(stored).toMatchObject({ description: "Piston ring set, cylinder unit" });
    expect(await testDb().select().from(s.part).where(eq(s.part.companyId, f.companyId))).toHaveLength(2);
  });
});

describe("the stores on board", () => {
  const move = (session: Session, body: Record<string, unknown>) => api<{ onBoard: number } & Problem>(session, "POST", `/api/vessels/${f.vesselA.id}/stores/movements`, body);

  it("keeps locations and takes in, counts and moves stock, each as a movement of its own", async () => {
    for (const [key, body] of [["store", { store: "Engine store", rack: "3", bin: "B" }], ["workshop", { store: "Workshop" }]] as const) {
      const res = await api<{ id: string; place: string }>(engineer, "POST", `/api/vessels/${f.vesselA.id}/stores/locations`, body);
      expect(res.status).toBe(201);
      loc[key] = res.body.id;
    }
    expect((await move(engineer, { kind: "received", partId: ringSet.id, locationId: loc.store, quantity: 3, reason: "Delivered in Rotterdam" })).body.onBoard).toBe(3);
    // Counted 4 on the shelf: the difference (+1) is stored with the reason.
    expect((await move(chief, { kind: "counted", partId: ringSet.id, locationId: loc.store, counted: "4", reason: "One found in the wrong bin" })).body.onBoard).toBe(4);
    expect((await move(engineer, { kind: "moved", partId: ringSet.id, locationId: loc.store, toLocationId: loc.workshop, quantity: 1 })).body.onBoard).toBe(4);
    expect((await move(engineer, { kind: "received", partId: oil.id, locationId: loc.store, quantity: "20,5" })).body.onBoard).toBe(20.5);
    const rows = (await movements()).filter((m) => m.partId === ringSet.id);
    expect(rows.map((m) => [m.kind, m.quantity]).sort()).toEqual([["counted", 1], ["moved-in", 1], ["moved-out", -1], ["received", 3]]);
    const view = await api<StoresView>(viewer, "GET", `/api/vessels/${f.vesselA.id}/stores`);
    expect(view.body.canWrite).toBe(false);
    const line = view.body.lines.find((l) => l.part.id === ringSet.id)!;
    expect(line).toMatchObject({ onBoard: 4, low: false });
    expect(line.byLocation.map((b) => [b.place, b.quantity]).sort()).toEqual([["Engine store, rack 3, bin B", 3], ["Workshop", 1]]);
  });

  it("refuses to take more than a location holds, a half piece, and a count without its reason; nothing is written", async () => {
    const before = await movements();
    const tooMany = await move(engineer, { kind: "moved", partId: ringSet.id, locationId: loc.workshop, toLocationId: loc.store, quantity: 2 });
    expect(tooMany.status).toBe(422);
    expect(tooMany.body.errors).toEqual([{ field: "quantity", message: "Only 1 set recorded at Workshop, not 2. If more is on the shelf, count it first (a count correction with its reason)." }]);
    expect((await move(engineer, { kind: "received", partId: ringSet.id, locationId: loc.store, quantity: 1.5 })).body.errors?.[0]?.message).toBe("This part is counted in whole sets; enter a whole number.");
    expect((await move(engineer, { kind: "counted", partId: ringSet.id, locationId: loc.store, counted: 2, reason: "" })).status).toBe(422);
    expect((await move(viewer, { kind: "received", partId: ringSet.id, locationId: loc.store, quantity: 1 })).status).toBe(403);
    // The other vessel's location, and another company's person.
    const [elsewhere] = await testDb().insert(s.storeLocation).values({ companyId: f.companyId, vesselId: f.vesselB.id, store: "Bravo store" }).returning();
    expect((await move(engineer, { kind: "received", partId: ringSet.id, locationId: elsewhere!.id, quantity: 1 })).body.errors?.[0]?.field).toBe("locationId");
    const outsider = await signIn(other.users["chief-engineer"].email, PASSWORD);
    expect((await move(outsider, { kind: "received", partId: ringSet.id, locationId: loc.store, quantity: 1 })).status).toBe(404);
    expect(await movements()).toHaveLength(before.length);
  });

  it("lets one of two people take the last set and refuses the other; the stock stays the sum of its movements", async () => {
    // The workshop holds 1 set. Two moves of it at the same moment: one goes through.
    const both = await Promise.all([chief, engineer].map((who) => move(who, { kind: "moved", partId: ringSet.id, locationId: loc.workshop, toLocationId: loc.store, quantity: 1 })));
    expect(both.map((r) => r.status).sort()).toEqual([201, 422]);
    const rows = (await movements()).filter((m) => m.partId === ringSet.id);
    const at = (id: string) => rows.filter((m) => m.locationId === id).reduce((n, m) => n + m.quantity, 0);
    expect([at(loc.store!), at(loc.workshop!)]).toEqual([4, 0]);
    const [line] = (await api<StoresView>(viewer, "GET", `/api/vessels/${f.vesselA.id}/stores`)).body.lines.filter((l) => l.part.id === ringSet.id);
    expect(line!.onBoard).toBe(4);
    // A minimum of 5 makes it low.
    await api(superintendent, "PATCH", `/api/parts/${ringSet.id}`, { minimumOnBoard: 5 });
    const low = (await api<StoresView>(viewer, "GET", `/api/vessels/${f.vesselA.id}/stores`)).body.lines.find((l) => l.part.id === ringSet.id);
    expect(low).toMatchObject({ onBoard: 4, low: true });
    // The change touched the minimum only.
    const [stored] = await testDb().select().from(s.part).where(eq(s.part.id, ringSet.id));
    expect(stored).toMatchObject({ unit: "set", critical: true, makerRef: "HV-90-221", minimumOnBoard: 5 });
    expect(await testDb().select().from(s.stockMovement).where(and(eq(s.stockMovement.companyId, other.companyId)))).toEqual([]);
  });

  it("shows a job on the cylinder unit the parts that fit it, with what is on board", async () => {
    const [wo] = await testDb()
      .insert(s.workOrder)
      .values({ companyId: f.companyId, vesselId: f.vesselA.id, componentId: cylinderId, number: "WO-PARTS-1", occurrence: 1, title: "Piston overhaul", state: "scheduled" })
      .returning();
    const detail = await api<{ partsOnBoard: { number: string; onBoard: number; low: boolean; fits: string }[] }>(viewer, "GET", `/api/vessels/${f.vesselA.id}/work-orders/${wo!.id}`);
    expect(detail.status).toBe(200);
    // The ring set fits ME.CYL.1 (4 on board, under its minimum of 5); the cylinder oil fits nothing here.
    expect(detail.body.partsOnBoard).toEqual([expect.objectContaining({ number: "KP-10432", onBoard: 4, low: true, fits: "ME.CYL.1", needed: null, short: 0 })]);

    // The overhaul's routine needs 6 ring sets (4 on board: 2 short) and 25 l of oil (20.5 l on board: 4.5 l short).
    const [overhaul] = await testDb()
      .insert(s.routine)
      .values({ companyId: f.companyId, vesselId: f.vesselA.id, componentId: cylinderId, title: "Piston overhaul", intervalHours: 16000, rank: "second-engineer", estimatedManHours: 12 })
      .returning();
    const path = `/api/vessels/${f.vesselA.id}/routines/${overhaul!.id}/parts`;
    const half = await api<Problem>(chief, "PUT", path, { parts: [{ partId: ringSet.id, quantity: 1.5 }] });
    expect(half.body.errors).toEqual([{ field: "parts.0.quantity", message: "This part is counted in whole sets; enter a whole number." }]);
    expect((await api(engineer, "PUT", path, { parts: [] })).status).toBe(403);
    expect((await api(chief, "PUT", path, { parts: [{ partId: ringSet.id, quantity: 6 }, { partId: oil.id, quantity: "25" }] })).status).toBe(200);
    const listed = await api<{ parts: { number: string; quantity: number; unit: string }[] }>(viewer, "GET", path);
    expect(listed.body.parts).toEqual([
      expect.objectContaining({ number: "KP-10432", quantity: 6, unit: "set" }),
      expect.objectContaining({ number: "LO-40", quantity: 25, unit: "litre" }),
    ]);
    await testDb().update(s.workOrder).set({ routineId: overhaul!.id }).where(eq(s.workOrder.id, wo!.id));
    const needs = await api<{ partsOnBoard: { number: string; needed: number | null; short: number }[] }>(viewer, "GET", `/api/vessels/${f.vesselA.id}/work-orders/${wo!.id}`);
    expect(needs.body.partsOnBoard.map((p) => [p.number, p.needed, p.short])).toEqual([
      ["KP-10432", 6, 2],
      ["LO-40", 25, 4.5],
    ]);
  });
});
