// Parts used on a job, over HTTP against the real database: taken from the stores in the completion's
// transaction, refused (with nothing written) when more is used than the stores record unless the
// engineer counts, put back when the chief returns the completion, and two jobs taking the last set
// at once leave the stock right with one of them asked to count.
import { and, eq, inArray } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as s from "@/db/schema";
import type { CompletionResult, WorkOrderDetail } from "@/server/completions/contract";
import { shipClock, shipDay } from "@/server/format/hours";
import type { Problem } from "@/server/http/problem";
import type { CataloguePart } from "@/server/parts/contract";
import { recomputeVessel } from "@/server/scheduling/recompute";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { api, type Session, signIn } from "../support/http";

let f: Fixture;
let engineer: Session;
let chief: Session;
let seals: CataloguePart;
let grease: CataloguePart;
const loc = { store: "", workshop: "" };
/** Work orders by the pump they are on: P1 … P5. */
const orders: Record<string, { id: string; number: string }> = {};

const path = (workOrderId: string, tail = "") => `/api/vessels/${f.vesselA.id}/work-orders/${workOrderId}${tail}`;

function body(partsUsed: unknown[]) {
  const now = new Date(Date.now() - 60_000);
  return { doneOn: shipDay(now, f.vesselA.timeZone), time: shipClock(now, f.vesselA.timeZone), manHours: 2, checklist: [], measurements: [], partsUsed };
}

/** What the vessel holds of a part: the sum of its movements. */
async function onBoard(partId: string) {
  const rows = await testDb().select().from(s.stockMovement).where(and(eq(s.stockMovement.vesselId, f.vesselA.id), eq(s.stockMovement.partId, partId)));
  return Math.round(rows.reduce((n, r) => n + r.quantity, 0) * 1000) / 1000;
}
const movementCount = async () => (await testDb().select().from(s.stockMovement).where(eq(s.stockMovement.vesselId, f.vesselA.id))).length;
const completionOf = async (workOrderId: string) => (await testDb().select().from(s.completion).where(eq(s.completion.workOrderId, workOrderId)))[0];

beforeAll(async () => {
  f = await createCompany("parts-used");
  [engineer, chief] = await Promise.all([signIn(f.users.engineer.email, PASSWORD), signIn(f.users["chief-engineer"].email, PASSWORD)]);
  const db = testDb();
  const pumps = await db
    .insert(s.component)
    .values([1, 2, 3, 4, 5].map((n) => ({ companyId: f.companyId, vesselId: f.vesselA.id, code: `P${n}`, name: `Cooling water pump ${n}` })))
    .returning();
  const routines = await db
    .insert(s.routine)
    .values(
      pumps.map((p) => ({
        companyId: f.companyId,
        vesselId: f.vesselA.id,
        componentId: p.id,
        title: `${p.code}: renew the mechanical seal`,
        calendarRule: "FREQ=MONTHLY",
        baselineAt: new Date(Date.now() - 40 * 86_400_000),
      })),
    )
    .returning();
  await recomputeVessel(db, f.companyId, f.vesselA.id);
  const made = await db.select().from(s.workOrder).where(inArray(s.workOrder.routineId, routines.map((r) => r.id)));
  for (const r of routines) orders[r.title.slice(0, 2)] = made.find((w) => w.routineId === r.id)!;

  seals = (await api<CataloguePart>(chief, "POST", "/api/parts", { number: "SEAL-45", description: "Mechanical seal, 45 mm", unit: "set", fits: pumps.map((p) => p.id) })).body;
  grease = (await api<CataloguePart>(chief, "POST", "/api/parts", { number: "GR-2", description: "Bearing grease", unit: "kg" })).body;
  for (const [key, store] of [["store", "Engine store"], ["workshop", "Workshop"]] as const) {
    loc[key] = (await api<{ id: string }>(engineer, "POST", `/api/vessels/${f.vesselA.id}/stores/locations`, { store })).body.id;
  }
  const receive = (partId: string, locationId: string, quantity: number) =>
    api(engineer, "POST", `/api/vessels/${f.vesselA.id}/stores/movements`, { kind: "received", partId, locationId, quantity });
  // Engine store 2 sets, workshop 1: 3 seal sets on board; 1.5 kg of grease in the engine store.
  await receive(seals.id, loc.store, 2);
  await receive(seals.id, loc.workshop, 1);
  await receive(grease.id, loc.store, 1.5);
});
afterAll(closeTestDb);

describe("parts used on a job", () => {
  it("the work order offers the parts that fit its component with what is on board", async () => {
    const detail = await api<WorkOrderDetail>(engineer, "GET", path(orders.P1!.id));
    expect(detail.body.partsOnBoard.map((p) => [p.number, p.onBoard])).toEqual([["SEAL-45", 3]]);
  });

  it("takes them from the stores when the job is recorded, fullest shelf first, and keeps them with the record", async () => {
    const res = await api<CompletionResult>(engineer, "POST", path(orders.P1!.id, "/completion"), body([
      { partId: seals.id, quantity: "2" },
      { partId: grease.id, quantity: "0,25" },
    ]));
    expect(res.status).toBe(201);
    expect(await onBoard(seals.id)).toBe(1);
    expect(await onBoard(grease.id)).toBe(1.25);
    const used = await testDb().select().from(s.stockMovement).where(eq(s.stockMovement.workOrderId, orders.P1!.id));
    // 2 sets from the engine store (it held most), none from the workshop.
    expect(used.map((m) => [m.partId === seals.id ? "seals" : "grease", m.locationId === loc.store ? "store" : "workshop", m.quantity, m.kind]).sort()).toEqual([
      ["grease", "store", -0.25, "used"],
      ["seals", "store", -2, "used"],
    ]);
    expect((await completionOf(orders.P1!.id))?.partsUsed).toEqual([
      { partId: seals.id, number: "SEAL-45", description: "Mechanical seal, 45 mm", unit: "set", quantity: 2 },
      { partId: grease.id, number: "GR-2", description: "Bearing grease", unit: "kg", quantity: 0.25 },
    ]);
    const detail = await api<WorkOrderDetail>(chief, "GET", path(orders.P1!.id));
    expect(detail.body.completion?.partsUsed.map((p) => [p.number, p.quantity])).toEqual([["SEAL-45", 2], ["GR-2", 0.25]]);
  });

  it("refuses more than the stores record, naming the row, and writes nothing", async () => {
    const before = await movementCount();
    const res = await api<Problem>(engineer, "POST", path(orders.P2!.id, "/completion"), body([
      { partId: grease.id, quantity: 0.25 },
      { partId: seals.id, quantity: 2 },
    ]));
    expect(res.status).toBe(422);
    expect(res.body.errors).toEqual([
      {
        field: "partsUsed.1.quantity",
        message: `${f.vesselA.name} has 1 set of SEAL-45 on record, not 2 sets. If more was on board, enter what you counted before the job and why the record differs.`,
      },
    ]);
    expect(await movementCount()).toBe(before);
    expect(await completionOf(orders.P2!.id)).toBeUndefined();
  });

  it("refuses half a set, a part listed twice, a count below the use and a count without its reason", async () => {
    const before = await movementCount();
    const fields = async (partsUsed: unknown[]) =>
      (await api<Problem>(engineer, "POST", path(orders.P2!.id, "/completion"), body(partsUsed))).body.errors?.map((e) => e.field);
    expect(await fields([{ partId: seals.id, quantity: "0.5" }])).toEqual(["partsUsed.0.quantity"]);
    expect(await fields([{ partId: seals.id, quantity: 1 }, { partId: seals.id, quantity: 1 }])).toEqual(["partsUsed"]);
    expect(await fields([{ partId: seals.id, quantity: 3, counted: 2, reason: "Found in the workshop" }])).toEqual(["partsUsed.0.counted"]);
    expect(await fields([{ partId: seals.id, quantity: 3, counted: 4 }])).toEqual(["partsUsed.0.reason"]);
    expect(await fields([{ partId: "00000000-0000-4000-8000-000000000000", quantity: 1 }])).toEqual(["partsUsed.0.partId"]);
    expect(await movementCount()).toBe(before);
  });

  it("with a count before the job, corrects the record by the difference and then takes what was used", async () => {
    const res = await api<CompletionResult>(engineer, "POST", path(orders.P2!.id, "/completion"), body([
      { partId: seals.id, quantity: 2, counted: "3", reason: "Two sets found in the spare-gear crate" },
    ]));
    expect(res.status).toBe(201);
    const rows = await testDb().select().from(s.stockMovement).where(and(eq(s.stockMovement.partId, seals.id), inArray(s.stockMovement.kind, ["counted"])));
    expect(rows.map((r) => [r.quantity, r.reason])).toEqual([[2, "Two sets found in the spare-gear crate"]]);
    // Recorded 1, counted 3 (+2), used 2: 1 left.
    expect(await onBoard(seals.id)).toBe(1);
  });

  it("puts the parts back when the chief returns the completion, and takes them again when it is resubmitted", async () => {
    const returned = await api(chief, "POST", path(orders.P1!.id, "/completion/decision"), { decision: "return", note: "Say which seal face was cracked." });
    expect(returned.status).toBe(200);
    expect(await onBoard(seals.id)).toBe(3);
    expect(await onBoard(grease.id)).toBe(1.5);
    const back = await testDb().select().from(s.stockMovement).where(and(eq(s.stockMovement.workOrderId, orders.P1!.id), eq(s.stockMovement.kind, "returned")));
    expect(back.map((m) => m.quantity).sort()).toEqual([0.25, 2]);
    // The corrected record used one set only.
    const again = await api(engineer, "PUT", path(orders.P1!.id, "/completion"), body([{ partId: seals.id, quantity: 1 }]));
    expect(again.status).toBe(200);
    expect(await onBoard(seals.id)).toBe(2);
    expect(await onBoard(grease.id)).toBe(1.5);
    expect((await completionOf(orders.P1!.id))?.partsUsed.map((p) => p.quantity)).toEqual([1]);
  });

  it("lets one of two jobs take the last sets and asks the other to count; the stock never goes below zero", async () => {
    expect(await onBoard(seals.id)).toBe(2);
    const both = await Promise.all(
      [orders.P3!, orders.P4!].map((w) => api<Problem>(engineer, "POST", path(w.id, "/completion"), body([{ partId: seals.id, quantity: 2 }]))),
    );
    expect(both.map((r) => r.status).sort()).toEqual([201, 422]);
    const refused = both.find((r) => r.status === 422)!;
    expect(refused.body.errors?.[0]?.field).toBe("partsUsed.0.quantity");
    expect(refused.body.errors?.[0]?.message).toMatch(/has none of SEAL-45 on record/);
    expect(await onBoard(seals.id)).toBe(0);
  });
});
