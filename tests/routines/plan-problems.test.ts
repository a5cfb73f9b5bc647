// A routine the due engine cannot plan is named on the Routines page with the reason, not only
// counted in the worker's log; once corrected, the next recompute clears it.
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as s from "@/db/schema";
import type { RoutineList } from "@/server/routines/contract";
import { recomputeVessel } from "@/server/scheduling/recompute";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { api, type Session, signIn } from "../support/http";

let f: Fixture;
let chief: Session;
let routineId: string;
const listPath = () => `/api/vessels/${f.vesselA.id}/routines`;

beforeAll(async () => {
  f = await createCompany("plan-problems");
  chief = await signIn(f.users["chief-engineer"].email, PASSWORD);
  const [purifier] = await testDb()
    .insert(s.component)
    .values({ companyId: f.companyId, vesselId: f.vesselA.id, code: "FO.PUR.1", name: "Fuel oil purifier 1", counterId: f.counters.gen.id })
    .returning();
  // As a plan taken over from elsewhere may arrive: an hours routine never done, with no baseline.
  const [r] = await testDb()
    .insert(s.routine)
    .values({ companyId: f.companyId, vesselId: f.vesselA.id, componentId: purifier!.id, title: "Bowl overhaul", intervalHours: 2000 })
    .returning();
  routineId = r!.id;
});
afterAll(closeTestDb);

describe("a routine the due engine cannot plan", () => {
  it("is listed on the Routines page with the reason, and marked on its row", async () => {
    const run = await recomputeVessel(testDb(), f.companyId, f.vesselA.id);
    expect(run.skipped.map((x) => x.routineId)).toEqual([routineId]);

    const list = await api<RoutineList>(chief, "GET", listPath());
    expect(list.status).toBe(200);
    expect(list.body.planProblems).toHaveLength(1);
    expect(list.body.planProblems[0]).toMatchObject({
      id: routineId,
      componentCode: "FO.PUR.1",
      title: "Bowl overhaul",
      reason: expect.stringMatching(/never done needs a baseline/),
    });
    const row = list.body.routines.find((x) => x.id === routineId);
    expect(row?.planProblem).toMatch(/never done needs a baseline/);
    // Named whatever the filter: a search that hides the row still shows the problem.
    const filtered = await api<RoutineList>(chief, "GET", `${listPath()}?q=nothing-matches-this`);
    expect(filtered.body.routines).toHaveLength(0);
    expect(filtered.body.planProblems).toHaveLength(1);
  });

  it("keeps the time it was first seen while the reason stays, and is cleared once planned", async () => {
    const [first] = await testDb().select().from(s.routinePlanProblem).where(eq(s.routinePlanProblem.routineId, routineId));
    await recomputeVessel(testDb(), f.companyId, f.vesselA.id);
    const [again] = await testDb().select().from(s.routinePlanProblem).where(eq(s.routinePlanProblem.routineId, routineId));
    expect(again!.since.getTime()).toBe(first!.since.getTime());

    await testDb()
      .update(s.routine)
      .set({ baselineAt: new Date(Date.now() - 10 * 86_400_000), baselineHours: 400 })
      .where(and(eq(s.routine.companyId, f.companyId), eq(s.routine.id, routineId)));
    const run = await recomputeVessel(testDb(), f.companyId, f.vesselA.id);
    expect(run.skipped).toEqual([]);
    const list = await api<RoutineList>(chief, "GET", listPath());
    expect(list.body.planProblems).toEqual([]);
    expect(list.body.routines.find((x) => x.id === routineId)?.planProblem).toBeNull();
  });
});
