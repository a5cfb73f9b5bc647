import { and, desc, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb } from "@/db/client";
import * as s from "@/db/schema";
import type { Access } from "@/server/auth/access";
import type { BacklogPage } from "@/server/backlog/contract";
import {
  COMPANY_OFFICE_MESSAGE,
  type DeferralEntry,
  type DeferralListItem,
  OFFICE_ONLY_MESSAGE,
  type WorkOrderWithDeferrals,
} from "@/server/deferrals/contract";
import { listFleetPendingDeferrals } from "@/server/deferrals/queries";
import { shipDay } from "@/server/format/hours";
import type { Problem } from "@/server/http/problem";
import { addShipDays, addShipMonths, shipDateFromKey, shipDateKey } from "@/server/scheduling/ship-date";
import { recomputeVessel } from "@/server/scheduling/recompute";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { api, type Session, signIn } from "../support/http";

let f: Fixture;
let other: Fixture;
const as = {} as Record<"chief" | "engineer" | "viewer" | "superintendent" | "admin", Session>;
/** plain: hours, due at 1,025 h; critical: hours, critical equipment; monthly: calendar, plain. */
const wo = {} as Record<"plain" | "critical" | "monthly", typeof s.workOrder.$inferSelect>;

const requests = (workOrderId: string, vesselId = f.vesselA.id) =>
  `/api/vessels/${vesselId}/work-orders/${workOrderId}/deferrals`;
const decision = (deferralId: string, vesselId = f.vesselA.id) =>
  `/api/vessels/${vesselId}/deferrals/${deferralId}/decision`;
const one = (deferralId: string, vesselId = f.vesselA.id) => `/api/vessels/${vesselId}/deferrals/${deferralId}`;
const ALL = "out-of-tolerance,late,window-open,deferred,scheduled,done";
const reason = "Piston ring set on order; the agent delivers at the next port.";
const tz = () => f.vesselA.timeZone;
const today = () => shipDay(new Date(), tz());
const plusDays = (day: string, n: number) => shipDateKey(addShipDays(shipDateFromKey(day), n));

async function deferralRows() {
  return testDb().select().from(s.deferral).where(eq(s.deferral.companyId, f.companyId));
}
async function workOrderRow(id: string) {
  const [row] = await testDb().select().from(s.workOrder).where(eq(s.workOrder.id, id));
  return row!;
}

beforeAll(async () => {
  [f, other] = await Promise.all([createCompany("deferrals"), createCompany("deferrals-other")]);
  const db = testDb();
  const [me, ae] = await db
    .insert(s.component)
    .values([
      {
        companyId: f.companyId,
        vesselId: f.vesselA.id,
        code: "ME",
        name: "Main engine",
        counterId: f.counters.main.id,
      },
      {
        companyId: f.companyId,
        vesselId: f.vesselA.id,
        code: "AE.1",
        name: "Generator 1",
        counterId: f.counters.gen.id,
      },
    ])
    .returning();
  const baselineAt = new Date(Date.now() - 5 * 86_400_000);
  const routines = await db
    .insert(s.routine)
    .values([
      // 925 h + 100 h = due at 1,025 h; the counter shows 1,000 h.
      {
        companyId: f.companyId,
        vesselId: f.vesselA.id,
        componentId: me!.id,
        title: "Fuel valves test",
        intervalHours: 100,
        baselineHours: 925,
        baselineAt,
      },
      // 400 h + 250 h = due at 650 h, critical equipment; the counter shows 500 h.
      {
        companyId: f.companyId,
        vesselId: f.vesselA.id,
        componentId: ae!.id,
        title: "Heads and valves",
        intervalHours: 250,
        baselineHours: 400,
        baselineAt,
        critical: true,
      },
      {
        companyId: f.companyId,
        vesselId: f.vesselA.id,
        componentId: me!.id,
        title: "Monthly inspection",
        calendarRule: "FREQ=MONTHLY",
        baselineAt,
      },
    ])
    .returning();
  await recomputeVessel(db, f.companyId, f.vesselA.id);
  const orders = await db.select().from(s.workOrder).where(eq(s.workOrder.companyId, f.companyId));
  const byRoutine = (i: number) => orders.find((o) => o.routineId === routines[i]!.id)!;
  wo.plain = byRoutine(0);
  wo.critical = byRoutine(1);
  wo.monthly = byRoutine(2);
  expect(wo.plain.dueHours).toBe(1025);
  expect(wo.critical.dueHours).toBe(650);
  expect(wo.monthly.dueDate).not.toBeNull();
  [as.chief, as.engineer, as.viewer, as.superintendent, as.admin] = await Promise.all([
    signIn(f.users["chief-engineer"].email, PASSWORD),
    signIn(f.users.engineer.email, PASSWORD),
    signIn(f.users.viewer.email, PASSWORD),
    signIn(f.users.superintendent.email, PASSWORD),
    signIn(f.users.admin.email, PASSWORD),
  ]);
});
afterAll(async () => {
  await Promise.all([closeTestDb(), closeDb()]);
});

describe("access to deferrals", () => {
  it("refuses anonymous calls to every route", async () => {
    const id = "00000000-0000-4000-8000-000000000000";
    expect((await api(null, "GET", requests(wo.plain.id))).status).toBe(401);
    expect((await api(null, "POST", requests(wo.plain.id), { reason, proposedDueHours: 1060 })).status).toBe(401);
    expect((await api(null, "GET", `/api/vessels/${f.vesselA.id}/deferrals`)).status).toBe(401);
    expect((await api(null, "POST", decision(id), { decision: "approve" })).status).toBe(401);
    expect((await api(null, "DELETE", one(id))).status).toBe(401);
    expect((await api(null, "GET", "/api/admin/settings")).status).toBe(401);
    expect((await api(null, "PATCH", "/api/admin/settings", { chiefDecidesDeferrals: false })).status).toBe(401);
  });

  it("answers 404 for another company's vessel and for a work order not on the vessel", async () => {
    const outsider = await signIn(other.users["chief-engineer"].email, PASSWORD);
    expect((await api(outsider, "GET", requests(wo.plain.id))).status).toBe(404);
    expect((await api(outsider, "POST", requests(wo.plain.id), { reason, proposedDueHours: 1060 })).status).toBe(404);
    expect((await api(outsider, "GET", `/api/vessels/${f.vesselA.id}/deferrals`)).status).toBe(404);
    // Our chief, asking about the other company's vessel.
    expect((await api(as.chief, "GET", `/api/vessels/${other.vesselA.id}/deferrals`)).status).toBe(404);
    // The work order is on vessel A; under vessel B (whole-fleet role) it is not found.
    expect((await api(as.superintendent, "GET", requests(wo.plain.id, f.vesselB.id))).status).toBe(404);
    expect((await api(as.chief, "GET", requests("not-a-uuid"))).status).toBe(404);
    expect(await deferralRows()).toEqual([]);
  });

  it("answers 403 to an engineer, a viewer or a superintendent requesting", async () => {
    for (const who of ["engineer", "viewer", "superintendent"] as const) {
      const res = await api(as[who], "POST", requests(wo.plain.id), { reason, proposedDueHours: 1060 });
      expect(res.status, who).toBe(403);
    }
    expect((await api(as.viewer, "GET", requests(wo.plain.id))).status).toBe(200);
    expect(await deferralRows()).toEqual([]);
  });

  it("keeps the company setting to the administrator", async () => {
    expect((await api(as.chief, "GET", "/api/admin/settings")).status).toBe(403);
    expect(
      (await api(as.superintendent, "PATCH", "/api/admin/settings", { chiefDecidesDeferrals: false })).status,
    ).toBe(403);
    const res = await api(as.admin, "GET", "/api/admin/settings");
    expect(res).toMatchObject({ status: 200, body: { chiefDecidesDeferrals: true } });
  });
});

describe("bad input gets 422 naming the field, and writes nothing", () => {
  const monthlyDueDay = () => shipDay(wo.monthly.dueDate!, tz());
  const cases: [string, () => string, () => Record<string, unknown>, string, RegExp][] = [
    [
      "a reason under 10 characters",
      () => wo.plain.id,
      () => ({ reason: "spares", proposedDueHours: 1060 }),
      "reason",
      /at least 10/,
    ],
    ["no reason at all", () => wo.plain.id, () => ({ proposedDueHours: 1060 }), "reason", /why/],
    [
      "a reason over 2,000 characters",
      () => wo.plain.id,
      () => ({ reason: "x".repeat(2001), proposedDueHours: 1060 }),
      "reason",
      /2,000/,
    ],
    [
      "neither a day nor hours",
      () => wo.plain.id,
      () => ({ reason }),
      "proposedDueDay",
      /new due day, a new running-hours limit/,
    ],
    [
      "hours on a calendar-only work order",
      () => wo.monthly.id,
      () => ({ reason, proposedDueHours: 1200 }),
      "proposedDueHours",
      /no running-hours limit/,
    ],
    [
      "hours not above the limit (1,025 h)",
      () => wo.plain.id,
      () => ({ reason, proposedDueHours: 1025 }),
      "proposedDueHours",
      /above the current one, 1,025 h/,
    ],
    // 1,025 h + one interval of 100 h = 1,125 h at most.
    [
      "hours more than one interval beyond",
      () => wo.plain.id,
      () => ({ reason, proposedDueHours: 1125.1 }),
      "proposedDueHours",
      /up to 1,125 h/,
    ],
    [
      "hours that are not a number",
      () => wo.plain.id,
      () => ({ reason, proposedDueHours: "lots" }),
      "proposedDueHours",
      /running hours/,
    ],
    [
      "today as the new day",
      () => wo.monthly.id,
      () => ({ reason, proposedDueDay: today() }),
      "proposedDueDay",
      /after today/,
    ],
    [
      "a day before the current due day",
      () => wo.monthly.id,
      () => ({ reason, proposedDueDay: plusDays(today(), 1) }),
      "proposedDueDay",
      /after the current due day/,
    ],
    [
      "a day more than two years ahead",
      () => wo.monthly.id,
      () => ({ reason, proposedDueDay: plusDays(shipDateKey(addShipMonths(shipDateFromKey(today()), 24)), 1) }),
      "proposedDueDay",
      /two years/,
    ],
    [
      "a day that is not a date",
      () => wo.monthly.id,
      () => ({ reason, proposedDueDay: "2027-13-01" }),
      "proposedDueDay",
      /YYYY-MM-DD/,
    ],
  ];
  for (const [what, workOrderId, body, field, message] of cases) {
    it(`refuses ${what}`, async () => {
      expect(monthlyDueDay() > plusDays(today(), 1)).toBe(true);
      const res = await api<Problem>(as.chief, "POST", requests(workOrderId()), body());
      expect(res.status).toBe(422);
      expect(res.contentType).toContain("application/problem+json");
      const error = res.body.errors?.find((e) => e.field === field);
      expect(error?.message, JSON.stringify(res.body)).toMatch(message);
      expect(await deferralRows()).toEqual([]);
    });
  }

  it("refuses a decision that is neither approve nor reject, and a rejection without a note", async () => {
    const id = "00000000-0000-4000-8000-000000000000";
    const bad = await api<Problem>(as.superintendent, "POST", decision(id), { decision: "maybe" });
    expect(bad.status).toBe(422);
    expect(bad.body.errors?.map((e) => e.field)).toEqual(["decision"]);
    const noNote = await api<Problem>(as.superintendent, "POST", decision(id), { decision: "reject", note: "no" });
    expect(noNote.status).toBe(422);
    expect(noNote.body.errors?.[0]).toMatchObject({ field: "note", message: expect.stringMatching(/why/) });
  });

  it("refuses a settings change that is not true or false", async () => {
    const res = await api<Problem>(as.admin, "PATCH", "/api/admin/settings", { chiefDecidesDeferrals: "yes" });
    expect(res.status).toBe(422);
    expect(res.body.errors?.map((e) => e.field)).toEqual(["chiefDecidesDeferrals"]);
    expect((await api(as.admin, "GET", "/api/admin/settings")).body).toEqual({ chiefDecidesDeferrals: true });
  });
});

describe("a plain work order: the chief may decide, once at a time", () => {
  let first = "";

  it("records a request, and refuses a second one while it is pending", async () => {
    const res = await api<{ id: string; status: string; needsOffice: boolean }>(
      as.chief,
      "POST",
      requests(wo.plain.id),
      {
        reason,
        proposedDueHours: "1,060",
      },
    );
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ status: "pending", needsOffice: false });
    first = res.body.id;
    const again = await api<Problem>(as.chief, "POST", requests(wo.plain.id), { reason, proposedDueHours: 1070 });
    expect(again.status).toBe(409);
    expect(again.body.detail).toMatch(/already has a deferral request awaiting a decision/);
    expect((await deferralRows()).length).toBe(1);
  });

  it("shows the pending request on the work order, the vessel's list and the Backlog", async () => {
    const detail = await api<WorkOrderWithDeferrals>(
      as.chief,
      "GET",
      `/api/vessels/${f.vesselA.id}/work-orders/${wo.plain.id}`,
    );
    expect(detail.status).toBe(200);
    expect(detail.body.deferrals).toMatchObject({
      current: { dueHours: 1025, deferred: false },
      hasHoursLimit: true,
      highestHours: 1125,
      needsOffice: false,
      may: { request: false, decide: true, withdraw: true },
    });
    expect(detail.body.deferrals.history[0]).toMatchObject({
      status: "pending",
      proposedDueHours: 1060,
      requestedBy: expect.stringContaining("chief-engineer"),
    });
    const seenByEngineer = await api<WorkOrderWithDeferrals>(
      as.engineer,
      "GET",
      `/api/vessels/${f.vesselA.id}/work-orders/${wo.plain.id}`,
    );
    expect(seenByEngineer.body.deferrals.may).toEqual({ request: false, decide: false, withdraw: false });

    const list = await api<{ deferrals: DeferralListItem[] }>(
      as.viewer,
      "GET",
      `/api/vessels/${f.vesselA.id}/deferrals`,
    );
    expect(list.status).toBe(200);
    expect(list.body.deferrals).toHaveLength(1);
    expect(list.body.deferrals[0]).toMatchObject({
      id: first,
      workOrder: {
        id: wo.plain.id,
        number: wo.plain.number,
        title: "Fuel valves test",
        critical: false,
        classRelated: false,
      },
    });
    const badStatus = await api<Problem>(as.viewer, "GET", `/api/vessels/${f.vesselA.id}/deferrals?status=maybe`);
    expect(badStatus.status).toBe(422);
    expect(badStatus.body.errors?.[0]?.field).toBe("query.status");

    const backlog = await api<BacklogPage>(as.viewer, "GET", `/api/vessels/${f.vesselA.id}/backlog?state=${ALL}`);
    expect(backlog.body.pendingDeferrals).toBe(1);
    const flags = Object.fromEntries(backlog.body.items.map((i) => [i.id, i.pendingDeferral]));
    expect(flags).toEqual({ [wo.plain.id]: true, [wo.critical.id]: false, [wo.monthly.id]: false });
    const only = await api<BacklogPage>(
      as.viewer,
      "GET",
      `/api/vessels/${f.vesselA.id}/backlog?deferral=pending&state=${ALL}`,
    );
    expect(only.body.items.map((i) => i.id)).toEqual([wo.plain.id]);
  });

  it("lets the chief reject his own plain request: the work order is unchanged and the decision recorded", async () => {
    const before = await workOrderRow(wo.plain.id);
    const res = await api(as.chief, "POST", decision(first), { decision: "reject", note: "Spares arrived after all." });
    expect(res).toMatchObject({ status: 200, body: { status: "rejected" } });
    const after = await workOrderRow(wo.plain.id);
    expect({ state: after.state, hours: after.deferredDueHours, date: after.deferredDueDate }).toEqual({
      state: before.state,
      hours: null,
      date: null,
    });
    const [row] = await deferralRows();
    expect(row).toMatchObject({
      status: "rejected",
      decidedBy: f.users["chief-engineer"].id,
      decisionNote: "Spares arrived after all.",
    });
    expect(row!.decidedAt).toBeInstanceOf(Date);
    // Decided once: a second decision is a conflict.
    const again = await api<Problem>(as.superintendent, "POST", decision(first), { decision: "approve" });
    expect(again.status).toBe(409);
    expect(again.body.detail).toMatch(/rejected already/);
  });

  it("lets the chief withdraw a new request while it waits, and not twice", async () => {
    const res = await api<{ id: string }>(as.chief, "POST", requests(wo.plain.id), { reason, proposedDueHours: 1080 });
    expect(res.status).toBe(201);
    expect((await api(as.engineer, "DELETE", one(res.body.id))).status).toBe(403);
    expect((await api(as.superintendent, "DELETE", one(res.body.id))).status).toBe(403);
    expect(await api(as.chief, "DELETE", one(res.body.id))).toMatchObject({
      status: 200,
      body: { status: "withdrawn" },
    });
    expect((await api(as.chief, "DELETE", one(res.body.id))).status).toBe(409);
    const history = await api<{ deferrals: DeferralEntry[] }>(as.viewer, "GET", requests(wo.plain.id));
    expect(history.body.deferrals.map((d) => d.status)).toEqual(["withdrawn", "rejected"]);
    expect(history.body.deferrals[0]?.decidedBy).toContain("chief-engineer");
  });
});

describe("critical work: the superintendent decides", () => {
  let id = "";

  it("answers 403 to the chief and to an engineer deciding a request that needs the office", async () => {
    const res = await api<{ id: string; needsOffice: boolean }>(as.chief, "POST", requests(wo.critical.id), {
      reason: "Cylinder head gasket set on back-order; the generator stays on stand-by.",
      proposedDueHours: 700,
    });
    expect(res.status).toBe(201);
    expect(res.body.needsOffice).toBe(true);
    id = res.body.id;
    const byChief = await api<Problem>(as.chief, "POST", decision(id), { decision: "approve" });
    expect(byChief.status).toBe(403);
    expect(byChief.body.detail).toBe(OFFICE_ONLY_MESSAGE);
    expect((await api(as.engineer, "POST", decision(id), { decision: "approve" })).status).toBe(403);
    expect((await api(as.admin, "POST", decision(id), { decision: "approve" })).status).toBe(403);
    const detail = await api<WorkOrderWithDeferrals>(
      as.chief,
      "GET",
      `/api/vessels/${f.vesselA.id}/work-orders/${wo.critical.id}`,
    );
    expect(detail.body.deferrals.may).toEqual({ request: false, decide: false, withdraw: true });
    expect((await workOrderRow(wo.critical.id)).state).toBe(wo.critical.state);
  });

  it("lists it among the fleet's pending requests for the superintendent", async () => {
    const office: Access = {
      user: { id: f.users.superintendent.id, name: "", email: f.users.superintendent.email },
      company: { id: f.companyId, name: "" },
      role: "superintendent",
      assignedVesselIds: null,
    };
    expect((await listFleetPendingDeferrals(office)).map((d) => [d.id, d.vessel.id, d.workOrder.number])).toEqual([
      [id, f.vesselA.id, wo.critical.number],
    ]);
    expect(
      await listFleetPendingDeferrals({ ...office, role: "chief-engineer", assignedVesselIds: [f.vesselB.id] }),
    ).toEqual([]);
  });

  it("approves it: the work order is deferred with the new limit and a state change", async () => {
    const before = await workOrderRow(wo.critical.id);
    const res = await api(as.superintendent, "POST", decision(id), { decision: "approve", note: "Agreed." });
    expect(res).toMatchObject({ status: 200, body: { status: "approved", workOrderState: "deferred" } });
    const after = await workOrderRow(wo.critical.id);
    expect(after.deferredDueHours).toBe(700);
    expect(after.deferredDueDate).toBeNull();
    expect(after.state).toBe("deferred");
    const [change] = await testDb()
      .select()
      .from(s.workOrderStateChange)
      .where(
        and(eq(s.workOrderStateChange.companyId, f.companyId), eq(s.workOrderStateChange.workOrderId, wo.critical.id)),
      )
      .orderBy(desc(s.workOrderStateChange.changedAt))
      .limit(1);
    expect(change).toMatchObject({ fromState: before.state, toState: "deferred" });
    const [row] = (await deferralRows()).filter((d) => d.id === id);
    expect(row).toMatchObject({ status: "approved", decidedBy: f.users.superintendent.id, decisionNote: "Agreed." });
    // A new request now has to go beyond the deferred limit of 700 h.
    const lower = await api<Problem>(as.chief, "POST", requests(wo.critical.id), { reason, proposedDueHours: 690 });
    expect(lower.status).toBe(422);
    expect(lower.body.errors?.[0]?.message).toMatch(/above the current one, 700 h/);
  });
});

describe("the company has the office decide every deferral", () => {
  it("turns the setting off; the chief may then not decide a plain request", async () => {
    const off = await api(as.admin, "PATCH", "/api/admin/settings", { chiefDecidesDeferrals: false });
    expect(off).toMatchObject({ status: 200, body: { chiefDecidesDeferrals: false } });
    const dueDay = shipDay(wo.monthly.dueDate!, tz());
    const proposedDueDay = plusDays(dueDay, 10);
    const res = await api<{ id: string; needsOffice: boolean }>(as.chief, "POST", requests(wo.monthly.id), {
      reason: "The class surveyor attends at the next port; the inspection waits for him.",
      proposedDueDay,
    });
    expect(res.status).toBe(201);
    expect(res.body.needsOffice).toBe(true);
    const byChief = await api<Problem>(as.chief, "POST", decision(res.body.id), { decision: "approve" });
    expect(byChief.status).toBe(403);
    expect(byChief.body.detail).toBe(COMPANY_OFFICE_MESSAGE);

    // A plain request asked while the chief could decide, then the setting turned off: the office decides.
    const [asked] = await testDb()
      .update(s.deferral)
      .set({ needsOffice: false })
      .where(eq(s.deferral.id, res.body.id))
      .returning();
    expect(asked!.needsOffice).toBe(false);
    const stillNot = await api<Problem>(as.chief, "POST", decision(res.body.id), { decision: "approve" });
    expect(stillNot.status).toBe(403);
    expect(stillNot.body.detail).toBe(COMPANY_OFFICE_MESSAGE);
    expect((await workOrderRow(wo.monthly.id)).deferredDueDate).toBeNull();

    // The superintendent approves: the limit is the end of that ship's day in Asia/Singapore (UTC+8,
    // no daylight saving): 23:59:59.999 local = 15:59:59.999 UTC the same day.
    expect((await api(as.superintendent, "POST", decision(res.body.id), { decision: "approve" })).status).toBe(200);
    const after = await workOrderRow(wo.monthly.id);
    expect(after.deferredDueDate?.toISOString()).toBe(`${proposedDueDay}T15:59:59.999Z`);
    expect(after.state).toBe("deferred");
  });
});
