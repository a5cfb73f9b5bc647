// The company administrator's tolerance rules: list, add, edit, delete, restore the presets; every
// refusal names the field and writes nothing, and an edit reaches the Backlog through the worker.
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as s from "@/db/schema";
import type { Role } from "@/server/auth/roles";
import type { BacklogPage } from "@/server/backlog/contract";
import type { Problem } from "@/server/http/problem";
import { TOLERANCE_PRESETS } from "@/server/scheduling/presets";
import { recomputeVessel } from "@/server/scheduling/recompute";
import type { AdminToleranceRule, AdminToleranceRuleList, RestoredPresets } from "@/server/tolerance/contract";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { api, type Session, signIn } from "../support/http";

let f: Fixture;
let other: Fixture;
let admin: Session;
let otherRuleId: string;
const RULES = "/api/admin/tolerance-rules";
const MONTHLY = TOLERANCE_PRESETS.find((p) => p.id === "preset-monthly")!.name;
const DAILY = TOLERANCE_PRESETS.find((p) => p.id === "preset-daily")!.name;

const sixWeekly = {
  name: "Six-weekly checks: 5 days before, 2 after",
  kind: "calendar",
  minInterval: 40,
  maxInterval: 44,
  windowBefore: { value: 5, unit: "days" },
  graceAfter: { value: 2, unit: "days" },
  keepsAnniversary: true,
};

async function companyRules() {
  return testDb()
    .select()
    .from(s.toleranceRule)
    .where(eq(s.toleranceRule.companyId, f.companyId))
    .orderBy(s.toleranceRule.id);
}

async function ruleNamed(name: string): Promise<AdminToleranceRule> {
  const list = await api<AdminToleranceRuleList>(admin, "GET", RULES);
  const rule = list.body.rules.find((r) => r.name === name);
  if (!rule) throw new Error(`no rule named ${name}`);
  return rule;
}

async function expect422(method: string, path: string, body: unknown, field: string, message: RegExp) {
  const before = await companyRules();
  const res = await api<Problem>(admin, method, path, body);
  expect(res.status).toBe(422);
  expect(res.contentType).toContain("application/problem+json");
  const error = res.body.errors?.find((e) => e.field === field);
  expect(error?.message, JSON.stringify(res.body.errors)).toMatch(message);
  expect(await companyRules()).toEqual(before);
}

async function backlogState(): Promise<string | undefined> {
  const res = await api<BacklogPage>(
    admin,
    "GET",
    `/api/vessels/${f.vesselA.id}/backlog?q=${encodeURIComponent("Fire pump")}`,
  );
  return res.body.items[0]?.state;
}

beforeAll(async () => {
  [f, other] = await Promise.all([createCompany("tolerance"), createCompany("tolerance-other")]);
  const db = testDb();
  const [rule] = await db
    .insert(s.toleranceRule)
    .values({
      companyId: other.companyId,
      name: "Other company’s rule",
      kind: "calendar",
      minInterval: 0,
      maxInterval: 10,
      windowBeforeValue: 1,
      windowBeforeUnit: "days",
      graceAfterValue: 1,
      graceAfterUnit: "days",
    })
    .returning();
  otherRuleId = rule!.id;
  const [pump] = await db
    .insert(s.component)
    .values({ companyId: f.companyId, vesselId: f.vesselA.id, code: "FP", name: "Fire pump" })
    .returning();
  // Last run 45 days ago on a monthly rule: about 15 days past due, beyond the monthly preset's
  // 3 days of grace (as in tests/backlog/backlog.test.ts).
  await db.insert(s.routine).values({
    companyId: f.companyId,
    vesselId: f.vesselA.id,
    componentId: pump!.id,
    title: "Fire pump monthly run",
    calendarRule: "FREQ=MONTHLY",
    baselineAt: new Date(Date.now() - 45 * 86_400_000),
    rank: "third-engineer",
  });
  admin = await signIn(f.users.admin.email, PASSWORD);
});
afterAll(closeTestDb);

describe("who may use /api/admin/tolerance-rules", () => {
  it("refuses anonymous calls with 401", async () => {
    expect((await api(null, "GET", RULES)).status).toBe(401);
    expect((await api(null, "POST", RULES, sixWeekly)).status).toBe(401);
    expect((await api(null, "POST", `${RULES}/presets`)).status).toBe(401);
  });

  it.each<Role>(["superintendent", "chief-engineer", "engineer", "viewer"])("refuses the %s with 403", async (role) => {
    const session = await signIn(f.users[role].email, PASSWORD);
    expect((await api(session, "GET", RULES)).status).toBe(403);
    expect((await api(session, "POST", RULES, sixWeekly)).status).toBe(403);
    expect((await api(session, "POST", `${RULES}/presets`)).status).toBe(403);
    expect((await api(session, "PATCH", `${RULES}/${otherRuleId}`, { name: "Mine" })).status).toBe(403);
  });

  it("shows the page to the administrator and the not-found page to everyone else", async () => {
    for (const role of ["superintendent", "chief-engineer", "engineer", "viewer"] as const) {
      const session = await signIn(f.users[role].email, PASSWORD);
      expect((await api(session, "GET", "/admin/tolerance-rules")).status, role).toBe(404);
    }
    const page = await api<string>(admin, "GET", "/admin/tolerance-rules");
    expect(page.status).toBe(200);
    expect(page.body).toContain("Tolerance rules");
  });

  it("answers 404 for another company's rule and leaves it alone", async () => {
    expect((await api(admin, "PATCH", `${RULES}/${otherRuleId}`, { name: "Taken over" })).status).toBe(404);
    expect((await api(admin, "DELETE", `${RULES}/${otherRuleId}`)).status).toBe(404);
    expect((await api(admin, "DELETE", `${RULES}/not-a-rule`)).status).toBe(404);
    const [still] = await testDb().select().from(s.toleranceRule).where(eq(s.toleranceRule.id, otherRuleId));
    expect(still?.name).toBe("Other company’s rule");
  });
});

describe("restoring the presets", () => {
  it("adds every preset to a company that has none, then nothing more", async () => {
    const first = await api<RestoredPresets>(admin, "POST", `${RULES}/presets`);
    expect(first.status).toBe(200);
    expect(first.body.restored).toEqual(TOLERANCE_PRESETS.map((p) => p.name));
    // Hours first (the kind enum's order), then the presets' own order.
    expect(first.body.rules.map((r) => r.name)).toEqual(TOLERANCE_PRESETS.map((p) => p.name));
    expect(first.body.rules[0]).toMatchObject({
      kind: "hours",
      capHours: 500,
      windowBefore: { value: 10, unit: "percent" },
    });

    const again = await api<RestoredPresets>(admin, "POST", `${RULES}/presets`);
    expect(again.body.restored).toEqual([]);
    expect((await companyRules()).length).toBe(TOLERANCE_PRESETS.length);
  });

  it("puts back a deleted preset and keeps a changed one as it is", async () => {
    const daily = await ruleNamed(DAILY);
    expect((await api(admin, "DELETE", `${RULES}/${daily.id}`)).status).toBe(200);
    const weekly = TOLERANCE_PRESETS.find((p) => p.id === "preset-weekly")!;
    const changed = await ruleNamed(weekly.name);
    expect(
      (await api(admin, "PATCH", `${RULES}/${changed.id}`, { graceAfter: { value: 2, unit: "days" } })).status,
    ).toBe(200);
    const res = await api<RestoredPresets>(admin, "POST", `${RULES}/presets`);
    expect(res.body.restored).toEqual([DAILY]);
    expect(res.body.rules.find((r) => r.id === changed.id)?.graceAfter).toEqual({ value: 2, unit: "days" });
  });
});

describe("refusals name the field and write nothing", () => {
  it.each([
    [
      "a smallest interval above the largest",
      { minInterval: 50, maxInterval: 40 },
      "maxInterval",
      /cannot be below the smallest/,
    ],
    [
      "percent on a calendar rule",
      { windowBefore: { value: 10, unit: "percent" } },
      "windowBefore.unit",
      /calendar rule counts in days or months/,
    ],
    [
      "months on an hours rule",
      { kind: "hours", windowBefore: { value: 10, unit: "hours" }, graceAfter: { value: 3, unit: "months" } },
      "graceAfter.unit",
      /running-hours rule counts in hours or percent/,
    ],
    ["a cap on a calendar rule", { capHours: 100 }, "capHours", /on an hours rule/],
    ["an empty name", { name: "  " }, "name", /Give the rule a name/],
  ])("POST refuses %s with 422", async (_label, change, field, message) => {
    await expect422("POST", RULES, { ...sixWeekly, ...change }, field, message);
  });

  it("refuses a name the company already has, whatever its capitals", async () => {
    await expect422("POST", RULES, { ...sixWeekly, name: MONTHLY.toUpperCase() }, "name", /already has a rule named/);
    const annual = await ruleNamed(TOLERANCE_PRESETS.find((p) => p.id === "preset-annual")!.name);
    await expect422("PATCH", `${RULES}/${annual.id}`, { name: MONTHLY }, "name", /already has a rule named/);
  });

  it("checks an edit against the rule it makes", async () => {
    const monthly = await ruleNamed(MONTHLY);
    await expect422("PATCH", `${RULES}/${monthly.id}`, { minInterval: 60 }, "maxInterval", /cannot be below/);
    await expect422("PATCH", `${RULES}/${monthly.id}`, { kind: "hours" }, "windowBefore.unit", /hours or percent/);
    await expect422("PATCH", `${RULES}/${monthly.id}`, { capHours: 50 }, "capHours", /on an hours rule/);
  });

  it("adds a valid rule and deletes it again", async () => {
    const res = await api<AdminToleranceRule>(admin, "POST", RULES, sixWeekly);
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ name: sixWeekly.name, minInterval: 40, maxInterval: 44, capHours: null });
    expect((await api(admin, "DELETE", `${RULES}/${res.body.id}`)).status).toBe(200);
    expect((await companyRules()).some((r) => r.name === sixWeekly.name)).toBe(false);
  });
});

describe("an edit reaches the Backlog through the worker", () => {
  it("widening the monthly grace moves the work order from out of tolerance to late", async () => {
    await recomputeVessel(testDb(), f.companyId, f.vesselA.id);
    expect(await backlogState()).toBe("out-of-tolerance");

    const monthly = await ruleNamed(MONTHLY);
    const patch = await api<AdminToleranceRule>(admin, "PATCH", `${RULES}/${monthly.id}`, {
      graceAfter: { value: 20, unit: "days" },
    });
    expect(patch.status).toBe(200);
    expect(patch.body).toMatchObject({ name: MONTHLY, graceAfter: { value: 20, unit: "days" }, minInterval: 11 });

    let state: string | undefined;
    for (let i = 0; i < 60 && state !== "late"; i++) {
      state = await backlogState();
      if (state !== "late") await new Promise((r) => setTimeout(r, 250));
    }
    // About 15 days past due and inside the 20 days of grace now.
    expect(state).toBe("late");
  });

  it("refuses to delete a rule a routine chose by hand, naming the routine", async () => {
    const monthly = await ruleNamed(MONTHLY);
    await testDb()
      .update(s.routine)
      .set({ toleranceRuleId: monthly.id })
      .where(and(eq(s.routine.companyId, f.companyId), eq(s.routine.title, "Fire pump monthly run")));
    const res = await api<Problem>(admin, "DELETE", `${RULES}/${monthly.id}`);
    expect(res.status).toBe(409);
    expect(res.body.detail).toMatch(/Fire pump monthly run/);
    expect((await ruleNamed(MONTHLY)).overridingRoutines).toBe(1);
  });
});
