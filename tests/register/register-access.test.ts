// Who may read and change a vessel's machinery register, through the one access door.
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Role } from "@/server/auth/roles";
import type { Problem } from "@/server/http/problem";
import type { RegisterView } from "@/server/register/contract";
import { closeTestDb, createCompany, type Fixture, PASSWORD } from "../support/fixtures";
import { api, type Session, signIn } from "../support/http";
import { type Register, registerRows, seedRegister } from "./register-fixture";

let one: Fixture;
let two: Fixture;
let oneRegister: Register;
let twoRegister: Register;
const sessions = {} as Record<Role, Session>;
const ROLES: Role[] = ["admin", "superintendent", "chief-engineer", "engineer", "viewer"];

beforeAll(async () => {
  [one, two] = await Promise.all([createCompany("register-access-one"), createCompany("register-access-two")]);
  [oneRegister, twoRegister] = await Promise.all([seedRegister(one), seedRegister(two)]);
  for (const role of ROLES) sessions[role] = await signIn(one.users[role].email, PASSWORD);
});
afterAll(closeTestDb);

type Route = { method: string; path: string; body?: unknown };

/** Every register route of vessel A, each with a request that would succeed for a chief engineer. */
function routes(f: Fixture, r: Register): Route[] {
  const v = `/api/vessels/${f.vesselA.id}`;
  return [
    { method: "GET", path: `${v}/register` },
    { method: "POST", path: `${v}/components`, body: { code: `NEW.${randomUUID().slice(0, 6)}`, name: "New part" } },
    { method: "PATCH", path: `${v}/components/${r.cyl3.id}`, body: { name: "Cylinder unit no. 3" } },
    {
      method: "POST",
      path: `${v}/counters`,
      body: { name: `Counter ${randomUUID().slice(0, 6)}`, plannedHoursPerDay: 4 },
    },
    { method: "PATCH", path: `${v}/counters/${r.spare.id}`, body: { plannedHoursPerDay: 6 } },
    { method: "DELETE", path: `${v}/counters/${r.spare.id}` },
    {
      method: "POST",
      path: `${v}/counters/${f.counters.gen.id}/replacements`,
      body: { replacedAt: { shipDay: "2020-01-01", time: "09:00" }, reason: "Meter failed" },
    },
  ];
}

describe("anonymous callers", () => {
  it("get 401 from every register route", async () => {
    for (const r of routes(one, oneRegister)) {
      const res = await api<Problem>(null, r.method, r.path, r.body);
      expect(res.status, `${r.method} ${r.path}`).toBe(401);
      expect(res.contentType).toContain("application/problem+json");
    }
  });
});

describe("another company's vessel, component and counter ids", () => {
  it.each(ROLES)("are not found for the %s, and nothing is written there", async (role) => {
    const before = await registerRows(two.companyId);
    for (const r of routes(two, twoRegister)) {
      const res = await api<Problem>(sessions[role], r.method, r.path, r.body);
      expect(res.status, `${role} ${r.method} ${r.path}`).toBe(404);
    }
    expect(await registerRows(two.companyId)).toEqual(before);
  });

  it("are not found on one's own vessel either (another company's component and counter)", async () => {
    const v = `/api/vessels/${one.vesselA.id}`;
    for (const role of ["chief-engineer", "admin"] as const) {
      const patch = await api(sessions[role], "PATCH", `${v}/components/${twoRegister.cyl3.id}`, { name: "x" });
      const retire = await api(sessions[role], "DELETE", `${v}/counters/${twoRegister.spare.id}`);
      expect([role, patch.status, retire.status]).toEqual([role, 404, 404]);
    }
  });
});

describe("another vessel's ids, in the path of vessel A", () => {
  it("are not found, and malformed ids neither", async () => {
    const v = `/api/vessels/${one.vesselA.id}`;
    const chief = sessions["chief-engineer"];
    const results = [
      await api(chief, "PATCH", `${v}/components/${oneRegister.otherVessel.id}`, { name: "x" }),
      await api(chief, "PATCH", `${v}/counters/${one.counters.otherVessel.id}`, { name: "x" }),
      await api(chief, "DELETE", `${v}/counters/${one.counters.otherVessel.id}`),
      await api(chief, "POST", `${v}/counters/${one.counters.otherVessel.id}/replacements`, {
        replacedAt: { shipDay: "2020-01-01", time: "09:00" },
        reason: "x",
      }),
      await api(chief, "PATCH", `${v}/components/not-a-uuid`, { name: "x" }),
      await api(chief, "DELETE", `${v}/counters/${randomUUID()}`),
    ];
    expect(results.map((r) => r.status)).toEqual([404, 404, 404, 404, 404, 404]);
  });

  it("a chief engineer does not see vessel B, which he is not assigned to", async () => {
    const res = await api(sessions["chief-engineer"], "GET", `/api/vessels/${one.vesselB.id}/register`);
    expect(res.status).toBe(404);
  });
});

describe("roles", () => {
  it("every role reads the register", async () => {
    for (const role of ROLES) {
      const res = await api<RegisterView>(sessions[role], "GET", `/api/vessels/${one.vesselA.id}/register`);
      expect([role, res.status]).toEqual([role, 200]);
      expect([role, res.body.canEdit]).toEqual([role, role === "chief-engineer" || role === "admin"]);
    }
  });

  it.each(["engineer", "viewer", "superintendent"] as const)(
    "the %s may not change it: 403, nothing written",
    async (role) => {
      const before = await registerRows(one.companyId);
      for (const r of routes(one, oneRegister).filter((x) => x.method !== "GET")) {
        const res = await api<Problem>(sessions[role], r.method, r.path, r.body);
        expect(res.status, `${role} ${r.method} ${r.path}`).toBe(403);
        expect(res.body.title).toBe("Not allowed");
      }
      expect(await registerRows(one.companyId)).toEqual(before);
    },
  );

  it.each(["chief-engineer", "admin"] as const)("the %s may add and edit components and counters", async (role) => {
    const v = `/api/vessels/${one.vesselA.id}`;
    const code = `${role === "admin" ? "ADM" : "CE"}.${randomUUID().slice(0, 4)}`;
    const added = await api<{ id: string; code: string }>(sessions[role], "POST", `${v}/components`, {
      code,
      name: "Bilge pump",
    });
    expect(added.status).toBe(201);
    const edited = await api(sessions[role], "PATCH", `${v}/components/${added.body.id}`, { name: "Bilge pump 1" });
    expect(edited.status).toBe(200);
    const counter = await api<{ id: string }>(sessions[role], "POST", `${v}/counters`, {
      name: `Bilge pump ${role}`,
      plannedHoursPerDay: 1,
    });
    expect(counter.status).toBe(201);
    const renamed = await api(sessions[role], "PATCH", `${v}/counters/${counter.body.id}`, {
      plannedHoursPerDay: "1.5",
    });
    expect(renamed.status).toBe(200);
    const retired = await api(sessions[role], "DELETE", `${v}/counters/${counter.body.id}`);
    expect(retired.status).toBe(200);
  });
});
