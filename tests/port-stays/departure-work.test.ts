// Work tied to the departure, end to end against the real database: a routine "before each
// departure" (the steering-gear test: SOLAS chapter V, regulation 26 — within 12 h before departure,
// memory, ../shared/SOURCES.md) gets its work order from the worker at the next stay's departure,
// the proposal places it on the departure day inside its 12 h, and once done it moves to the next
// stay — never a weekly rule, never a deferral.
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as s from "@/db/schema";
import { shipDay } from "@/server/format/hours";
import type { PortStayView, ProposalView } from "@/server/port-stays/contract";
import { recomputeVessel } from "@/server/scheduling/recompute";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { api, type Session, signIn } from "../support/http";

let f: Fixture;
let chief: Session;
let routineId: string;
const DAY = 86_400_000;
const dayIn = (n: number) => shipDay(new Date(Date.now() + n * DAY), f.vesselA.timeZone);
const base = () => `/api/vessels/${f.vesselA.id}/port-stays`;

function stayBody(port: string, arrive: number, depart: number) {
  return {
    port,
    arrivesAt: `${dayIn(arrive)}T07:00`,
    departsAt: `${dayIn(depart)}T19:00`,
    workdayFrom: "07:00",
    workdayTo: "19:00",
    engineStop: null,
    crew: [{ rank: "second-engineer", count: 1 }],
    watches: [],
  };
}

async function openOrder() {
  const rows = await testDb()
    .select()
    .from(s.workOrder)
    .where(and(eq(s.workOrder.companyId, f.companyId), eq(s.workOrder.routineId, routineId)));
  return rows.filter((r) => r.state !== "done");
}

beforeAll(async () => {
  f = await createCompany("departure-work");
  chief = await signIn(f.users["chief-engineer"].email, PASSWORD);
  const db = testDb();
  const [comp] = await db
    .insert(s.component)
    .values({ companyId: f.companyId, vesselId: f.vesselA.id, code: "SG", name: "Steering gear" })
    .returning();
  const [r] = await db
    .insert(s.routine)
    .values({
      companyId: f.companyId,
      vesselId: f.vesselA.id,
      componentId: comp!.id,
      title: "Steering gear test before departure",
      portEvent: "departure",
      portEventHours: 12,
      rank: "second-engineer",
      estimatedManHours: 1,
      critical: true,
    })
    .returning();
  routineId = r!.id;
});
afterAll(closeTestDb);

describe("a routine tied to the departure", () => {
  it("has no work order while no stay is planned", async () => {
    await recomputeVessel(testDb(), f.companyId, f.vesselA.id);
    expect(await openOrder()).toEqual([]);
  });

  let first: PortStayView;
  it("falls due at the next stay's departure, open the 12 h before it", async () => {
    const res = await api<PortStayView>(chief, "POST", base(), stayBody("First harbour", 3, 4));
    expect(res.status).toBe(201);
    first = res.body;
    expect((await api(chief, "POST", base(), stayBody("Second harbour", 10, 11))).status).toBe(201);
    await recomputeVessel(testDb(), f.companyId, f.vesselA.id);
    const [order] = await openOrder();
    expect(order).toMatchObject({
      state: "scheduled",
      portEvent: "departure",
      portEventHours: 12,
      planFrom: dayIn(4),
      planUntil: dayIn(4),
    });
    expect(order?.dueDate?.toISOString()).toBe(first.departsAt);
    // 12 h before a 19:00 departure: 07:00 on the departure day.
    expect(order?.windowOpensAt?.toISOString()).toBe(new Date(new Date(first.departsAt).getTime() - 12 * 3_600_000).toISOString());
  });

  it("is placed by the proposal on the departure day, inside its window", async () => {
    const res = await api<ProposalView>(chief, "POST", `${base()}/${first.id}/proposal`);
    expect(res.status).toBe(200);
    const item = res.body.items.find((i) => i.title === "Steering gear test before departure");
    expect(item).toMatchObject({ startLocal: `${dayIn(4)}T07:00`, urgency: "event", group: "port-only" });
    expect(item?.reason).toMatch(/^Required within 12 h before each departure — critical;/);
  });

  it("moves to the next stay's departure once done, and follows a stay's new times", async () => {
    const [order] = await openOrder();
    const doneAt = new Date(new Date(first.departsAt).getTime() - 3 * 3_600_000);
    await testDb().update(s.workOrder).set({ state: "done", completedAt: doneAt }).where(eq(s.workOrder.id, order!.id));
    await testDb()
      .insert(s.completion)
      .values({ companyId: f.companyId, vesselId: f.vesselA.id, workOrderId: order!.id, doneAt, manHours: 1, status: "approved" });
    await recomputeVessel(testDb(), f.companyId, f.vesselA.id);
    const [next] = await openOrder();
    expect(next).toMatchObject({ occurrence: 2, planFrom: dayIn(11), state: "scheduled" });

    // The second stay now leaves a day later: its test moves with it (the change asks for a recompute).
    const stays = await api<{ upcoming: PortStayView[] }>(chief, "GET", base());
    const second = stays.body.upcoming.find((u) => u.port === "Second harbour")!;
    expect((await api(chief, "PATCH", `${base()}/${second.id}`, { departsAt: `${dayIn(12)}T19:00` })).status).toBe(200);
    await recomputeVessel(testDb(), f.companyId, f.vesselA.id);
    const [moved] = await openOrder();
    expect(moved).toMatchObject({ id: next!.id, planFrom: dayIn(12), planUntil: dayIn(12) });
  });

  it("leaves with its stay when the stay is deleted, and comes back with the next stay entered", async () => {
    const stays = await api<{ upcoming: PortStayView[] }>(chief, "GET", base());
    const second = stays.body.upcoming.find((u) => u.port === "Second harbour")!;
    expect((await api(chief, "DELETE", `${base()}/${second.id}`)).status).toBe(200);
    // Gone in the same transaction as the stay: no work order due at a departure that will not be.
    expect(await openOrder()).toEqual([]);
    await recomputeVessel(testDb(), f.companyId, f.vesselA.id);
    expect(await openOrder()).toEqual([]);

    expect((await api(chief, "POST", base(), stayBody("Third harbour", 20, 21))).status).toBe(201);
    await recomputeVessel(testDb(), f.companyId, f.vesselA.id);
    const [again] = await openOrder();
    expect(again).toMatchObject({ planFrom: dayIn(21), planUntil: dayIn(21), state: "scheduled" });
  });

  it("keeps a work order with a deferral asked on it when its stay is deleted", async () => {
    const [order] = await openOrder();
    await testDb().insert(s.deferral).values({
      companyId: f.companyId,
      vesselId: f.vesselA.id,
      workOrderId: order!.id,
      reason: "Steering gear pump on order; test after it is fitted.",
      proposedDueDay: dayIn(30),
      requestedBy: f.users["chief-engineer"].id,
      needsOffice: true,
    });
    const stays = await api<{ upcoming: PortStayView[] }>(chief, "GET", base());
    const third = stays.body.upcoming.find((u) => u.port === "Third harbour")!;
    expect((await api(chief, "DELETE", `${base()}/${third.id}`)).status).toBe(200);
    expect((await openOrder()).map((o) => o.id)).toEqual([order!.id]);
  });
});
