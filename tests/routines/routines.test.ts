// Routines of a vessel through the one access door, and their way into the Backlog through the worker.
import { randomUUID } from "node:crypto";
import { and, count, eq, isNull } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as s from "@/db/schema";
import type { Role } from "@/server/auth/roles";
import type { BacklogPage } from "@/server/backlog/contract";
import type { Problem } from "@/server/http/problem";
import type { CopyResult, CopyTarget, RoutineList, RoutineView } from "@/server/routines/contract";
import { type Register, seedRegister } from "../register/register-fixture";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { api, type Session, signIn } from "../support/http";

let one: Fixture;
let two: Fixture;
let reg: Register;
let twoReg: Register;
let sisterMe: string;
let oneRoutine: string;
let twoRoutine: string;
const sessions = {} as Record<Role, Session>;
const ROLES: Role[] = ["admin", "superintendent", "chief-engineer", "engineer", "viewer"];
const path = (f: Fixture, rest = "") => `/api/vessels/${f.vesselA.id}/routines${rest}`;

async function insertRoutine(f: Fixture, componentId: string, title: string) {
  const [row] = await testDb()
    .insert(s.routine)
    .values({
      companyId: f.companyId,
      vesselId: f.vesselA.id,
      componentId,
      title,
      intervalHours: 1000,
      baselineAt: new Date(),
      baselineHours: 900,
      rank: "second-engineer",
    })
    .returning();
  return row!.id;
}

/** Routines and work orders of the whole company, to show that a refused write left no trace. */
async function rows(companyId: string) {
  const db = testDb();
  const [r] = await db.select({ n: count() }).from(s.routine).where(eq(s.routine.companyId, companyId));
  const [w] = await db.select({ n: count() }).from(s.workOrder).where(eq(s.workOrder.companyId, companyId));
  const revisions = await db
    .select({ id: s.routine.id, revision: s.routine.revision, retiredAt: s.routine.retiredAt })
    .from(s.routine)
    .where(eq(s.routine.companyId, companyId));
  return { routines: r?.n, workOrders: w?.n, revisions: revisions.sort((a, b) => a.id.localeCompare(b.id)) };
}

/** Polls the Backlog until `until` holds for the rows matching `q` (the worker runs on its own). */
async function backlogUntil(session: Session, f: Fixture, q: string, until: (page: BacklogPage) => boolean) {
  let page: BacklogPage | null = null;
  for (let i = 0; i < 60; i++) {
    page = (await api<BacklogPage>(session, "GET", `/api/vessels/${f.vesselA.id}/backlog?q=${encodeURIComponent(q)}`))
      .body;
    if (until(page)) return page;
    await new Promise((r) => setTimeout(r, 250));
  }
  return page!;
}

const valid = (componentId: string, title = `Crankcase inspection ${randomUUID().slice(0, 6)}`) => ({
  componentId,
  title,
  rank: "second-engineer",
  intervalHours: 500,
  baselineAt: "2026-01-01",
  baselineHours: 900,
  checklist: ["Stop, isolate and lock out", "Open the crankcase doors", "Inspect bearings and deflections"],
  measurements: [{ name: "Crankshaft deflection", unit: "mm", lower: -0.05, upper: 0.05 }],
  cautions: ["isolation", "enclosed-space", "turning-gear"],
  estimatedManHours: 6,
  needsEngineStop: true,
  critical: true,
});

beforeAll(async () => {
  [one, two] = await Promise.all([createCompany("routines-one"), createCompany("routines-two")]);
  [reg, twoReg] = await Promise.all([seedRegister(one), seedRegister(two)]);
  // A sister ship's main engine with the same code, on vessel B (assigned to nobody but seen by the office).
  const [me] = await testDb()
    .insert(s.component)
    .values({
      companyId: one.companyId,
      vesselId: one.vesselB.id,
      code: "ME",
      name: "Main engine",
      counterId: one.counters.otherVessel.id,
    })
    .returning();
  sisterMe = me!.id;
  oneRoutine = await insertRoutine(one, reg.cyl3.id, "Fuel valve test");
  twoRoutine = await insertRoutine(two, twoReg.cyl3.id, "Fuel valve test");
  for (const role of ROLES) sessions[role] = await signIn(one.users[role].email, PASSWORD);
});
afterAll(closeTestDb);

type Route = { method: string; path: string; body?: unknown };

function writes(f: Fixture, r: Register, routineId: string): Route[] {
  return [
    { method: "POST", path: path(f), body: valid(r.me.id) },
    { method: "PATCH", path: path(f, `/${routineId}`), body: { title: "Fuel valve pressure test" } },
    { method: "POST", path: path(f, `/${routineId}/copies`), body: { componentIds: [r.ae1.id] } },
    { method: "DELETE", path: path(f, `/${routineId}`) },
  ];
}
const reads = (f: Fixture, routineId: string): Route[] => [
  { method: "GET", path: path(f) },
  { method: "GET", path: path(f, `/${routineId}`) },
];

describe("access", () => {
  it("anonymous callers get 401 from every routine route", async () => {
    for (const r of [...reads(one, oneRoutine), ...writes(one, reg, oneRoutine)]) {
      const res = await api(null, r.method, r.path, r.body);
      expect(res.status, `${r.method} ${r.path}`).toBe(401);
      expect(res.contentType).toContain("application/problem+json");
    }
  });

  it.each(ROLES)("another company's vessel and routine are not found for the %s, nothing written", async (role) => {
    const before = await rows(two.companyId);
    for (const r of [...reads(two, twoRoutine), ...writes(two, twoReg, twoRoutine)]) {
      const res = await api(sessions[role], r.method, r.path, r.body);
      expect(res.status, `${role} ${r.method} ${r.path}`).toBe(404);
    }
    expect(await rows(two.companyId)).toEqual(before);
  });

  it("another company's routine id on one's own vessel is not found either", async () => {
    const chief = sessions["chief-engineer"];
    const results = [
      await api(chief, "GET", path(one, `/${twoRoutine}`)),
      await api(chief, "PATCH", path(one, `/${twoRoutine}`), { title: "x" }),
      await api(chief, "DELETE", path(one, `/${twoRoutine}`)),
      await api(chief, "POST", path(one, `/${twoRoutine}/copies`), { componentIds: [reg.ae1.id] }),
      await api(chief, "GET", path(one, "/not-a-uuid")),
    ];
    expect(results.map((r) => r.status)).toEqual([404, 404, 404, 404, 404]);
  });

  it.each(["engineer", "viewer", "superintendent"] as const)("the %s reads but may not write: 403", async (role) => {
    expect((await api(sessions[role], "GET", path(one))).status).toBe(200);
    const before = await rows(one.companyId);
    for (const r of writes(one, reg, oneRoutine)) {
      const res = await api<Problem>(sessions[role], r.method, r.path, r.body);
      expect(res.status, `${role} ${r.method} ${r.path}`).toBe(403);
    }
    expect(await rows(one.companyId)).toEqual(before);
  });
});

describe("bad input is 422, naming the field, and writes nothing", () => {
  const cases: [string, () => Record<string, unknown>, string][] = [
    ["no interval", () => ({ ...valid(reg.me.id), intervalHours: null }), "intervalHours"],
    ["a bad RRULE", () => ({ ...valid(reg.me.id), calendarRule: "FREQ=SOMETIMES" }), "calendarRule"],
    ["COUNT in the rule", () => ({ ...valid(reg.me.id), calendarRule: "FREQ=MONTHLY;COUNT=12" }), "calendarRule"],
    [
      "anchored without a date",
      () => ({ ...valid(reg.me.id), calendarRule: "FREQ=YEARLY", anchored: true }),
      "anchorDate",
    ],
    [
      "lower limit above upper",
      () => ({ ...valid(reg.me.id), measurements: [{ name: "Deflection", unit: "mm", lower: 0.05, upper: -0.05 }] }),
      "measurements.0.upper",
    ],
    ["an unknown component", () => valid(randomUUID()), "componentId"],
    ["another vessel's component", () => valid(reg.otherVessel.id), "componentId"],
    ["hours without a baseline", () => ({ ...valid(reg.me.id), baselineHours: null }), "baselineHours"],
  ];

  it.each(cases)("%s", async (_what, body, field) => {
    const before = await rows(one.companyId);
    const res = await api<Problem>(sessions["chief-engineer"], "POST", path(one), body());
    expect(res.status).toBe(422);
    expect(res.contentType).toContain("application/problem+json");
    expect(res.body.errors?.map((e) => e.field)).toContain(field);
    expect(await rows(one.companyId)).toEqual(before);
  });

  it("an edit that would leave the routine without an interval is refused, and copies to unknown components", async () => {
    const before = await rows(one.companyId);
    const chief = sessions["chief-engineer"];
    const patch = await api<Problem>(chief, "PATCH", path(one, `/${oneRoutine}`), { intervalHours: null });
    expect([patch.status, patch.body.errors?.[0]?.field]).toEqual([422, "intervalHours"]);
    const copy = await api<Problem>(chief, "POST", path(one, `/${oneRoutine}/copies`), {
      componentIds: [reg.ae1.id, twoReg.ae1.id],
    });
    expect([copy.status, copy.body.errors?.map((e) => e.field)]).toEqual([422, ["componentIds.1"]]);
    expect(await rows(one.companyId)).toEqual(before);
  });
});

describe("routines become work orders through the worker", () => {
  let created: RoutineView;
  const chief = () => sessions["chief-engineer"];

  it("a created routine appears in the Backlog within seconds, due at baseline + interval", async () => {
    const res = await api<RoutineView>(chief(), "POST", path(one), valid(reg.me.id, "Crankcase inspection"));
    expect(res.status).toBe(201);
    created = res.body;
    expect(created).toMatchObject({ intervalWords: "every 500 h", revision: 1, baselineAt: "2026-01-01" });
    // Worked example: baseline 900 h + 500 h = due at 1,400 h; the counter stands at 1,000 h.
    const page = await backlogUntil(chief(), one, "Crankcase inspection", (p) => p.items.length === 1);
    expect(page.items[0]).toMatchObject({ dueHours: 1400, remainingHours: 400, needsEngineStop: true, critical: true });
  });

  it("lists it with its interval in words, filtered by component and text", async () => {
    const list = await api<RoutineList>(sessions.viewer, "GET", path(one, `?component=${reg.me.id}&q=crankcase`));
    expect(list.status).toBe(200);
    expect(list.body.canEdit).toBe(false);
    expect(list.body.routines.map((r) => [r.component.code, r.title, r.intervalWords])).toEqual([
      ["ME", "Crankcase inspection", "every 500 h"],
    ]);
    const byCyl = await api<RoutineList>(sessions.viewer, "GET", path(one, `?component=${reg.cyl.id}`));
    expect(byCyl.body.routines.map((r) => r.title)).toEqual(["Fuel valve test"]);
  });

  it("lists only what the table shows; the whole definition comes with the routine itself", async () => {
    const list = await api<RoutineList>(sessions.viewer, "GET", path(one, `?q=crankcase`));
    const [row] = list.body.routines;
    expect(Object.keys(row ?? {}).sort()).toEqual(
      [
        "id",
        "title",
        "component",
        "intervalWords",
        "anchoredOn",
        "rank",
        "team",
        "elapsedHours",
        "estimatedManHours",
        "critical",
        "classRelated",
        "classItemRef",
        "needsEngineStop",
        "needsPort",
        "planProblem",
      ].sort(),
    );
    expect(row).toMatchObject({
      id: created.id,
      component: { id: reg.me.id, code: "ME" },
      rank: "second-engineer",
      team: [{ rank: "second-engineer", count: 1 }],
      elapsedHours: 6,
      estimatedManHours: 6,
      critical: true,
      needsEngineStop: true,
      classRelated: false,
      anchoredOn: null,
      planProblem: null,
    });
    expect(list.body.total).toBe(1);
    const full = await api<RoutineView>(sessions.viewer, "GET", path(one, `/${created.id}`));
    expect(full.status).toBe(200);
    expect(full.body).toMatchObject({
      checklist: valid(reg.me.id).checklist,
      measurements: valid(reg.me.id).measurements,
      cautions: ["isolation", "enclosed-space", "turning-gear"],
      baselineAt: "2026-01-01",
      baselineHours: 900,
    });
  });

  it("an anchored routine's list row carries its anniversary", async () => {
    const res = await api<RoutineView>(chief(), "POST", path(one), {
      ...valid(reg.ae1.id, "Generator annual survey"),
      intervalHours: null,
      baselineHours: null,
      calendar: { every: 12, unit: "month" },
      anchored: true,
      anchorDate: "2026-05-15",
      classRelated: true,
      classItemRef: "AE-1",
    });
    expect(res.status).toBe(201);
    const list = await api<RoutineList>(sessions.viewer, "GET", path(one, `?q=${encodeURIComponent("annual survey")}`));
    expect(list.body.routines).toMatchObject([
      {
        title: "Generator annual survey",
        intervalWords: "every 12 months",
        anchoredOn: "2026-05-15",
        classItemRef: "AE-1",
      },
    ]);
    expect((await api(chief(), "DELETE", path(one, `/${res.body.id}`))).status).toBe(200);
  });

  it("an edit bumps the revision and moves the work order's due point", async () => {
    const res = await api<RoutineView>(chief(), "PATCH", path(one, `/${created.id}`), {
      intervalHours: 300,
      calendar: { every: 12, unit: "month" },
    });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({
      revision: 2,
      calendarRule: "FREQ=MONTHLY;INTERVAL=12",
      intervalWords: "every 300 h or every 12 months, whichever first",
      checklist: valid(reg.me.id).checklist,
    });
    const page = await backlogUntil(chief(), one, "Crankcase inspection", (p) => p.items[0]?.dueHours === 1200);
    expect(page.items[0]?.dueHours).toBe(1200);
  });

  it("copies go to other components of the vessel, and to the same code on a sister ship", async () => {
    const targets = await api<CopyTarget[]>(sessions.admin, "GET", path(one, `/${created.id}/copies`));
    expect(targets.body.map((t) => t.id)).toEqual(expect.arrayContaining([reg.ae1.id, reg.cyl3.id, sisterMe]));
    expect(targets.body.map((t) => t.id)).not.toContain(reg.me.id);

    const here = await api<CopyResult>(chief(), "POST", path(one, `/${created.id}/copies`), {
      componentIds: [reg.ae1.id],
    });
    expect([here.status, here.body.created.map((c) => c.componentCode)]).toEqual([201, ["AE.1"]]);
    // The chief engineer is not assigned to vessel B: its component is not his to copy to.
    const refused = await api<Problem>(chief(), "POST", path(one, `/${created.id}/copies`), {
      componentIds: [sisterMe],
    });
    expect(refused.status).toBe(422);
    const sister = await api<CopyResult>(sessions.admin, "POST", path(one, `/${created.id}/copies`), {
      componentIds: [sisterMe],
    });
    expect(sister.status).toBe(201);
    const copies = await testDb()
      .select()
      .from(s.routine)
      .where(
        and(
          eq(s.routine.companyId, one.companyId),
          eq(s.routine.title, "Crankcase inspection"),
          isNull(s.routine.retiredAt),
        ),
      );
    expect(copies.map((c) => c.componentId).sort()).toEqual([reg.me.id, reg.ae1.id, sisterMe].sort());
    expect(copies.every((c) => c.intervalHours === 300 && c.calendarRule === "FREQ=MONTHLY;INTERVAL=12")).toBe(true);
    const page = await backlogUntil(chief(), one, "Crankcase inspection", (p) => p.items.length === 2);
    expect(page.items.map((i) => i.component.code).sort()).toEqual(["AE.1", "ME"]);
  });

  it("retiring takes the open work order out of the Backlog; the routine leaves the list", async () => {
    const res = await api<{ openWorkOrdersRemoved: number }>(chief(), "DELETE", path(one, `/${created.id}`));
    expect(res.status).toBe(200);
    expect(res.body.openWorkOrdersRemoved).toBe(1);
    const page = await backlogUntil(chief(), one, "Crankcase inspection", (p) => p.items.length === 1);
    expect(page.items.map((i) => i.component.code)).toEqual(["AE.1"]);
    expect((await api(chief(), "GET", path(one, `/${created.id}`))).status).toBe(404);
    const [row] = await testDb().select().from(s.routine).where(eq(s.routine.id, created.id));
    expect(row?.retiredAt).not.toBeNull();
  });
});
