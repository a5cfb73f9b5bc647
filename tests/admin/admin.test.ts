// The company administrator's routes and pages: who may call them at all.
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Problem } from "@/server/http/problem";
import { closeTestDb, createCompany, type Fixture, PASSWORD } from "../support/fixtures";
import { api, type Session, signIn } from "../support/http";

let one: Fixture;
let two: Fixture;
const sessions: Record<string, Session> = {};
const NON_ADMINS = ["superintendent", "chief-engineer", "engineer", "viewer"] as const;

beforeAll(async () => {
  [one, two] = await Promise.all([createCompany("admin-one"), createCompany("admin-two")]);
  for (const role of ["admin", ...NON_ADMINS] as const) sessions[role] = await signIn(one.users[role].email, PASSWORD);
});
afterAll(closeTestDb);

/** Every admin route with a request that would succeed for an administrator of company `f`. */
function routes(f: Fixture) {
  return [
    { method: "GET", path: "/api/admin/vessels" },
    {
      method: "POST",
      path: "/api/admin/vessels",
      body: { name: "Corran Ness", imoNumber: "9241061", code: "CN", timeZone: "UTC" },
    },
    { method: "PATCH", path: `/api/admin/vessels/${f.vesselA.id}`, body: { name: "Alpha renamed" } },
    { method: "DELETE", path: `/api/admin/vessels/${f.vesselA.id}` },
    { method: "GET", path: "/api/admin/users" },
    {
      method: "POST",
      path: "/api/admin/users",
      body: {
        name: "New Hand",
        email: `new-${randomUUID()}@fixture.example`,
        role: "viewer",
        vesselIds: [],
        initialPassword: "long-enough-pw",
      },
    },
    { method: "PATCH", path: `/api/admin/users/${f.users.viewer.id}`, body: { rank: "Cadet" } },
  ];
}

describe("the admin routes refuse anonymous calls", () => {
  it("with 401 and a problem document", async () => {
    for (const r of routes(one)) {
      const res = await api<Problem>(null, r.method, r.path, r.body);
      expect(res.status, `${r.method} ${r.path}`).toBe(401);
      expect(res.contentType).toContain("application/problem+json");
    }
  });
});

describe("the admin routes are for company administrators only", () => {
  it.each(NON_ADMINS)("the %s gets 403 on each route", async (role) => {
    for (const r of routes(one)) {
      const res = await api<Problem>(sessions[role]!, r.method, r.path, r.body);
      expect(res.status, `${role} ${r.method} ${r.path}`).toBe(403);
      expect(res.body.detail).toMatch(/role does not allow/);
    }
  });

  it("non-administrators get the not-found page at /admin, administrators the page", async () => {
    for (const role of NON_ADMINS) {
      for (const path of ["/admin", "/admin/vessels", "/admin/people"]) {
        const res = await api(sessions[role]!, "GET", path);
        expect(res.status, `${role} ${path}`).toBe(404);
      }
    }
    const vessels = await api<string>(sessions.admin!, "GET", "/admin/vessels");
    expect(vessels.status).toBe(200);
    expect(vessels.body).toContain("Vessels");
    const people = await api<string>(sessions.admin!, "GET", "/admin/people");
    expect(people.status).toBe(200);
  });
});

describe("another company's vessels and people are not found", () => {
  it("for the administrator, with 404 and never 403", async () => {
    for (const r of routes(two).filter((route) => route.path.split("/").length > 4)) {
      const res = await api<Problem>(sessions.admin!, r.method, r.path, r.body);
      expect(res.status, `${r.method} ${r.path}`).toBe(404);
    }
  });

  it("nor are ids that exist nowhere or are malformed", async () => {
    for (const path of [
      `/api/admin/users/${randomUUID()}`,
      "/api/admin/users/nope",
      `/api/admin/vessels/${randomUUID()}`,
      "/api/admin/vessels/nope",
    ]) {
      const res = await api<Problem>(sessions.admin!, "PATCH", path, { name: "Someone Else" });
      expect(res.status, path).toBe(404);
    }
  });

  it("and the lists hold only the administrator's own company", async () => {
    const vessels = await api<{ vessels: { id: string }[] }>(sessions.admin!, "GET", "/api/admin/vessels");
    const ids = vessels.body.vessels.map((v) => v.id);
    expect(ids).toEqual(expect.arrayContaining([one.vesselA.id, one.vesselB.id]));
    expect(ids).not.toContain(two.vesselA.id);
    const people = await api<{ people: { id: string }[] }>(sessions.admin!, "GET", "/api/admin/users");
    expect(people.body.people.map((p) => p.id).sort()).toEqual(
      Object.values(one.users)
        .map((u) => u.id)
        .sort(),
    );
  });
});
