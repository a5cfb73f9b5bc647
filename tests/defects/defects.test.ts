// Defect reports over HTTP against the real database: reported by the engineer, planned by the
// chief, done through its work order's completion and closed with its cause and action when the
// chief approves; a measurement out of limits raises one too. Roles, other companies, bad input
// named with nothing written, the Backlog's filter and the Fleet board's figures.
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as s from "@/db/schema";
import type { BacklogPage } from "@/server/backlog/contract";
import type { WorkOrderDetail } from "@/server/completions/contract";
import type { DefectList, DefectView } from "@/server/defects/contract";
import type { FleetBoard } from "@/server/fleet/contract";
import { shipClock, shipDay } from "@/server/format/hours";
import type { Problem } from "@/server/http/problem";
import type { CataloguePart } from "@/server/parts/contract";
import { recomputeVessel } from "@/server/scheduling/recompute";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { api, type Session, signIn } from "../support/http";

let f: Fixture;
let other: Fixture;
let engineer: Session;
let chief: Session;
let superintendent: Session;
let pumpId = "";
let leak: DefectView;

const base = () => `/api/vessels/${f.vesselA.id}`;
const hourAgo = () => {
  const at = new Date(Date.now() - 3_600_000);
  return { foundOn: shipDay(at, f.vesselA.timeZone), time: shipClock(at, f.vesselA.timeZone) };
};
const defectRows = async () => testDb().select().from(s.defect).where(eq(s.defect.companyId, f.companyId));
const orderRows = async () => testDb().select().from(s.workOrder).where(eq(s.workOrder.companyId, f.companyId));

beforeAll(async () => {
  [f, other] = await Promise.all([createCompany("defects"), createCompany("defects-other")]);
  [engineer, chief, superintendent] = await Promise.all([
    signIn(f.users.engineer.email, PASSWORD),
    signIn(f.users["chief-engineer"].email, PASSWORD),
    signIn(f.users.superintendent.email, PASSWORD),
  ]);
  const [pump] = await testDb()
    .insert(s.component)
    .values({ companyId: f.companyId, vesselId: f.vesselA.id, code: "SW.P1", name: "Sea water pump 1", critical: true })
    .returning();
  pumpId = pump!.id;
});
afterAll(closeTestDb);

describe("a defect report", () => {
  it("is reported by the engineer and becomes a corrective work order with its own number", async () => {
    const res = await api<DefectView>(engineer, "POST", `${base()}/defects`, {
      componentId: pumpId,
      title: "Mechanical seal leaking",
      description: "Steady drip at the seal, about a litre an hour.",
      ...hourAgo(),
      affectsCritical: true,
      affectsSafety: false,
    });
    expect(res.status).toBe(201);
    leak = res.body;
    expect(leak).toMatchObject({ number: "DR-ALPHA-0001", state: "reported", affectsCritical: true, targetDay: null, source: "report", component: { code: "SW.P1" } });
    const [order] = await orderRows();
    expect(order).toMatchObject({ kind: "corrective", routineId: null, title: "DR-ALPHA-0001: Mechanical seal leaking", state: "scheduled", critical: true, dueDate: null });
    expect(leak.workOrder.number).toBe(order!.number);
  });

  it("refuses bad input by field, other roles and other companies, and writes nothing", async () => {
    const before = { defects: (await defectRows()).length, orders: (await orderRows()).length };
    const bad = await api<Problem>(engineer, "POST", `${base()}/defects`, { componentId: pumpId, title: "x", foundOn: "2026-13-01", time: "25:00" });
    expect(bad.status).toBe(422);
    expect(bad.body.errors?.map((e) => e.field).sort()).toEqual(["foundOn", "time", "title"]);
    const tomorrow = shipDay(new Date(Date.now() + 2 * 86_400_000), f.vesselA.timeZone);
    const future = await api<Problem>(engineer, "POST", `${base()}/defects`, { componentId: pumpId, title: "Noisy bearing", foundOn: tomorrow, time: "10:00" });
    expect(future.body.errors?.[0]?.field).toBe("foundOn");
    const [foreign] = await testDb().insert(s.component).values({ companyId: other.companyId, vesselId: other.vesselA.id, code: "X", name: "Theirs" }).returning();
    const theirs = await api<Problem>(engineer, "POST", `${base()}/defects`, { componentId: foreign!.id, title: "Noisy bearing", ...hourAgo() });
    expect(theirs.body.errors?.[0]).toMatchObject({ field: "componentId" });
    expect((await api(superintendent, "POST", `${base()}/defects`, { componentId: pumpId, title: "Noisy bearing", ...hourAgo() })).status).toBe(403);
    const outsider = await signIn(other.users.engineer.email, PASSWORD);
    expect((await api(outsider, "GET", `${base()}/defects`)).status).toBe(404);
    expect((await api(outsider, "POST", `${base()}/defects/${leak.id}/plan`, { targetDay: "2030-01-01", rank: "motorman", manHours: 2 })).status).toBe(404);
    expect({ defects: (await defectRows()).length, orders: (await orderRows()).length }).toEqual(before);
  });

  it("is planned by the chief engineer: target day, rank, man-hours and parts; the worker gives it its window", async () => {
    const seal = (await api<CataloguePart>(chief, "POST", "/api/parts", { number: "MS-45", description: "Mechanical seal, 45 mm", unit: "piece" })).body;
    const target = shipDay(new Date(Date.now() + 3 * 86_400_000), f.vesselA.timeZone);
    expect((await api(engineer, "POST", `${base()}/defects/${leak.id}/plan`, { targetDay: target, rank: "motorman", manHours: 2 })).status).toBe(403);
    const half = await api<Problem>(chief, "POST", `${base()}/defects/${leak.id}/plan`, { targetDay: target, rank: "motorman", manHours: 2, parts: [{ partId: seal.id, quantity: 0.5 }] });
    expect(half.body.errors?.map((e) => e.field)).toEqual(["parts.0.quantity"]);
    const far = await api<Problem>(chief, "POST", `${base()}/defects/${leak.id}/plan`, { targetDay: "2099-01-01", rank: "oiler-x", manHours: "0" });
    expect(far.body.errors?.map((e) => e.field).sort()).toEqual(["manHours", "rank", "targetDay"]);
    const res = await api<DefectView>(chief, "POST", `${base()}/defects/${leak.id}/plan`, { targetDay: target, rank: "motorman", manHours: "3,5", parts: [{ partId: seal.id, quantity: 1 }] });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ state: "planned", targetDay: target, rank: "motorman", manHours: 3.5, parts: [{ number: "MS-45", quantity: 1 }] });
    await recomputeVessel(testDb(), f.companyId, f.vesselA.id);
    const [order] = await orderRows();
    expect(order?.state).toBe("window-open");
    expect(order?.graceEndsAt).not.toBeNull();
  });

  it("shows in the Backlog's defects filter, and on the work order page with its report", async () => {
    const backlog = await api<BacklogPage>(chief, "GET", `${base()}/backlog?defects=true`);
    expect(backlog.body.items.map((i) => i.title)).toEqual(["DR-ALPHA-0001: Mechanical seal leaking"]);
    const planned = await api<BacklogPage>(chief, "GET", `${base()}/backlog?defects=false`);
    expect(planned.body.items).toEqual([]);
    const detail = await api<WorkOrderDetail>(engineer, "GET", `${base()}/work-orders/${leak.workOrder.id}`);
    expect(detail.body.defect).toMatchObject({ number: "DR-ALPHA-0001", state: "planned", description: "Steady drip at the seal, about a litre an hour." });
  });

  it("is done when its repair is recorded, and closed only with its cause and action when the chief approves", async () => {
    const at = hourAgo();
    const recorded = await api(engineer, "POST", `${base()}/work-orders/${leak.workOrder.id}/completion`, {
      doneOn: at.foundOn,
      time: at.time,
      manHours: 3,
      checklist: [],
      measurements: [],
      remarks: "Seal renewed; no leak at test run.",
    });
    expect(recorded.status).toBe(201);
    const list = await api<DefectList>(chief, "GET", `${base()}/defects`);
    expect(list.body.defects.map((d) => [d.number, d.state])).toEqual([["DR-ALPHA-0001", "done"]]);
    const bare = await api<Problem>(chief, "POST", `${base()}/work-orders/${leak.workOrder.id}/completion/decision`, { decision: "approve" });
    expect(bare.status).toBe(422);
    expect(bare.body.errors?.map((e) => e.field)).toEqual(["cause", "action"]);
    expect((await defectRows())[0]?.closedAt).toBeNull();
    const closed = await api(chief, "POST", `${base()}/work-orders/${leak.workOrder.id}/completion/decision`, {
      decision: "approve",
      cause: "Seal faces worn: sand in the sea water after dredging in port",
      action: "Strainer cleaned after each dredged port; seal added to the yearly overhaul",
    });
    expect(closed.status).toBe(200);
    const all = await api<DefectList>(chief, "GET", `${base()}/defects?state=all`);
    expect(all.body.defects[0]).toMatchObject({ state: "closed", cause: "Seal faces worn: sand in the sea water after dredging in port" });
    expect((await api<DefectList>(chief, "GET", `${base()}/defects`)).body.defects).toEqual([]);
  });

  it("is raised by a measurement out of limits: one kind of unplanned work", async () => {
    const [unit] = await testDb().insert(s.component).values({ companyId: f.companyId, vesselId: f.vesselA.id, code: "AE.1", name: "Generator 1" }).returning();
    const [routine] = await testDb()
      .insert(s.routine)
      .values({
        companyId: f.companyId,
        vesselId: f.vesselA.id,
        componentId: unit!.id,
        title: "Injector pressure test",
        calendarRule: "FREQ=MONTHLY",
        baselineAt: new Date(Date.now() - 40 * 86_400_000),
        measurements: [{ name: "Opening pressure", unit: "bar", lower: 380, upper: 400 }],
      })
      .returning();
    await recomputeVessel(testDb(), f.companyId, f.vesselA.id);
    const [order] = await testDb().select().from(s.workOrder).where(and(eq(s.workOrder.routineId, routine!.id)));
    const at = hourAgo();
    const res = await api<{ followUpNumber: string }>(engineer, "POST", `${base()}/work-orders/${order!.id}/completion`, {
      doneOn: at.foundOn,
      time: at.time,
      manHours: 1,
      checklist: [],
      measurements: [{ name: "Opening pressure", value: 360 }],
    });
    expect(res.status).toBe(201);
    const list = await api<DefectList>(chief, "GET", `${base()}/defects`);
    expect(list.body.defects).toHaveLength(1);
    expect(list.body.defects[0]).toMatchObject({
      number: "DR-ALPHA-0002",
      source: "measurement",
      title: "Opening pressure out of limits",
      state: "planned",
      workOrder: { number: res.body.followUpNumber },
    });
    expect(list.body.defects[0]?.description).toMatch(/^Opening pressure: 360 bar \(limits 380 … 400 bar\) when WO-ALPHA-\d{5} was done\.$/);
  });

  it("is counted on the Fleet board: open defects per vessel, those on critical equipment, the oldest's age", async () => {
    await api(engineer, "POST", `${base()}/defects`, { componentId: pumpId, title: "Impeller noise", ...hourAgo(), affectsCritical: true });
    const board = await api<FleetBoard>(superintendent, "GET", "/api/fleet/board");
    const a = board.body.vessels.find((v) => v.id === f.vesselA.id)!;
    expect(a).toMatchObject({ openDefects: 2, criticalDefects: 1, oldestDefectDays: 0 });
    expect(board.body.vessels.find((v) => v.id === f.vesselB.id)).toMatchObject({ openDefects: 0, oldestDefectDays: null });
  });
});
