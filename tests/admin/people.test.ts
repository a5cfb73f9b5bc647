// The company administrator's people: accounts, roles, assignments, disabling and password resets.
import { randomUUID } from "node:crypto";
import { and, eq, inArray } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as s from "@/db/schema";
import type { AdminPeopleList, AdminPerson } from "@/server/admin/contract";
import type { Problem } from "@/server/http/problem";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { api, type Session, signIn } from "../support/http";

let f: Fixture;
let other: Fixture;
let admin: Session;

beforeAll(async () => {
  [f, other] = await Promise.all([createCompany("admin-people"), createCompany("admin-people-other")]);
  admin = await signIn(f.users.admin.email, PASSWORD);
});
afterAll(closeTestDb);

/** Everything a person's account touches in the company, to compare before and after a refusal. */
async function companySnapshot(email?: string) {
  const db = testDb();
  const members = await db
    .select()
    .from(s.membership)
    .where(eq(s.membership.companyId, f.companyId))
    .orderBy(s.membership.userId);
  const userIds = members.map((m) => m.userId);
  return {
    members,
    assignments: await db
      .select()
      .from(s.vesselAssignment)
      .where(eq(s.vesselAssignment.companyId, f.companyId))
      .orderBy(s.vesselAssignment.userId, s.vesselAssignment.vesselId),
    users: await db
      .select({ id: s.user.id, name: s.user.name, banned: s.user.banned })
      .from(s.user)
      .where(inArray(s.user.id, userIds))
      .orderBy(s.user.id),
    accounts: await db
      .select({ id: s.account.id, password: s.account.password })
      .from(s.account)
      .where(inArray(s.account.userId, userIds))
      .orderBy(s.account.id),
    withEmail: email ? (await db.select().from(s.user).where(eq(s.user.email, email.toLowerCase()))).length : 0,
  };
}

async function expect422(method: string, path: string, body: Record<string, unknown>, field: string, message: RegExp) {
  const email = typeof body.email === "string" ? body.email : undefined;
  const before = await companySnapshot(email);
  const res = await api<Problem>(admin, method, path, body);
  expect(res.status, JSON.stringify(res.body)).toBe(422);
  expect(res.contentType).toContain("application/problem+json");
  expect(res.body.errors?.find((e) => e.field === field)?.message, JSON.stringify(res.body.errors)).toMatch(message);
  expect(await companySnapshot(email)).toEqual(before);
}

const newPerson = () => ({
  name: "Ana Kolar",
  email: `Ana.Kolar-${randomUUID().slice(0, 8)}@Fixture.example`,
  role: "engineer",
  rank: "Second engineer",
  vesselIds: [] as string[],
  initialPassword: "first-watch-2026",
});

describe("GET /api/admin/users", () => {
  it("lists the company's people with role, rank, vessels and status", async () => {
    const res = await api<AdminPeopleList>(admin, "GET", "/api/admin/users");
    expect(res.status).toBe(200);
    expect(res.body.people).toHaveLength(5);
    const engineer = res.body.people.find((p) => p.id === f.users.engineer.id);
    expect(engineer).toMatchObject({
      role: "engineer",
      disabled: false,
      isYou: false,
      vessels: [{ id: f.vesselA.id, code: "ALPHA" }],
    });
    const me = res.body.people.find((p) => p.id === f.users.admin.id);
    expect(me).toMatchObject({ role: "admin", isYou: true });
    expect(me?.lastSignInAt).not.toBeNull();
  });
});

describe("POST /api/admin/users: bad input gets 422 naming the field and writes nothing", () => {
  it("an e-mail address already registered, whatever its capitals", async () => {
    await expect422(
      "POST",
      "/api/admin/users",
      { ...newPerson(), email: f.users.engineer.email.toUpperCase() },
      "email",
      /already has a Keelson account/,
    );
  });

  it("an e-mail address registered by another company", async () => {
    await expect422(
      "POST",
      "/api/admin/users",
      { ...newPerson(), email: other.users.viewer.email },
      "email",
      /already has a Keelson account/,
    );
  });

  it("a vessel of another company", async () => {
    await expect422(
      "POST",
      "/api/admin/users",
      { ...newPerson(), vesselIds: [f.vesselA.id, other.vesselA.id] },
      "vesselIds.1",
      /no such vessel/,
    );
  });

  it.each([
    ["a short password", { initialPassword: "too-short" }, "initialPassword", /at least 10 characters/],
    ["an unknown role", { role: "captain" }, "role", /Pick a role/],
    ["a malformed e-mail address", { email: "ana.kolar@" }, "email", /does not look right/],
    ["a one-letter name", { name: "A" }, "name", /at least 2 characters/],
  ])("%s", async (_label, change, field, message) => {
    await expect422("POST", "/api/admin/users", { ...newPerson(), ...change }, field, message);
  });
});

describe("a person the administrator creates", () => {
  let created: AdminPerson;
  let session: Session;
  const input = newPerson();

  it("is stored with account, membership and assignments, and can sign in", async () => {
    const res = await api<AdminPerson>(admin, "POST", "/api/admin/users", { ...input, vesselIds: [f.vesselB.id] });
    expect(res.status).toBe(201);
    created = res.body;
    expect(created).toMatchObject({
      name: "Ana Kolar",
      email: input.email.toLowerCase(),
      role: "engineer",
      rank: "Second engineer",
      disabled: false,
    });
    expect(created.vessels.map((v) => v.id)).toEqual([f.vesselB.id]);
    session = await signIn(input.email.toLowerCase(), input.initialPassword);
  });

  it("sees exactly the vessels assigned", async () => {
    expect((await api(session, "GET", `/api/vessels/${f.vesselB.id}/hour-log`)).status).toBe(200);
    expect((await api(session, "GET", `/api/vessels/${f.vesselA.id}/hour-log`)).status).toBe(404);
  });

  it("gets a new role, rank and assignments, effective on the next call", async () => {
    const res = await api<AdminPerson>(admin, "PATCH", `/api/admin/users/${created.id}`, {
      role: "chief-engineer",
      rank: "Chief engineer",
      vesselIds: [f.vesselA.id],
    });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ role: "chief-engineer", rank: "Chief engineer", vessels: [{ id: f.vesselA.id }] });
    expect((await api(session, "GET", `/api/vessels/${f.vesselA.id}/hour-log`)).status).toBe(200);
    expect((await api(session, "GET", `/api/vessels/${f.vesselB.id}/hour-log`)).status).toBe(404);
  });

  it("refuses a foreign vessel on edit and keeps the assignments", async () => {
    await expect422(
      "PATCH",
      `/api/admin/users/${created.id}`,
      { vesselIds: [other.vesselB.id] },
      "vesselIds.0",
      /no such vessel/,
    );
  });

  it("gets a new password from the administrator; the old one stops working", async () => {
    const res = await api(admin, "PATCH", `/api/admin/users/${created.id}`, { newPassword: "second-watch-2026" });
    expect(res.status).toBe(200);
    await expect(signIn(input.email, input.initialPassword)).rejects.toThrow(/failed: 401/);
    session = await signIn(input.email, "second-watch-2026");
    await expect422(
      "PATCH",
      `/api/admin/users/${created.id}`,
      { newPassword: "short" },
      "newPassword",
      /at least 10 characters/,
    );
  });

  // The session cookie a browser holds must stop working on the very next call, not when better-auth's
  // 60-second cookie cache runs out: the access door has to read the session from the database.
  it("once disabled, is signed out at once and cannot sign in; re-enabled, can again", async () => {
    expect((await api(session, "GET", `/api/vessels/${f.vesselA.id}/hour-log`)).status).toBe(200);
    const res = await api<AdminPerson>(admin, "PATCH", `/api/admin/users/${created.id}`, { disabled: true });
    expect(res.status).toBe(200);
    expect(res.body.disabled).toBe(true);
    expect((await api(session, "GET", `/api/vessels/${f.vesselA.id}/hour-log`)).status).toBe(401);
    const sessions = await testDb().select().from(s.session).where(eq(s.session.userId, created.id));
    expect(sessions).toHaveLength(0);
    await expect(signIn(input.email, "second-watch-2026")).rejects.toThrow(/failed: 403/);

    const back = await api<AdminPerson>(admin, "PATCH", `/api/admin/users/${created.id}`, { disabled: false });
    expect(back.body.disabled).toBe(false);
    const again = await signIn(input.email, "second-watch-2026");
    expect((await api(again, "GET", `/api/vessels/${f.vesselA.id}/hour-log`)).status).toBe(200);
  });
});

describe("the company keeps an active administrator", () => {
  const self = () => `/api/admin/users/${f.users.admin.id}`;

  it("the only administrator cannot demote or disable themself", async () => {
    await expect422("PATCH", self(), { role: "superintendent" }, "role", /only active administrator/);
    await expect422("PATCH", self(), { disabled: true }, "disabled", /only active administrator/);
    const [row] = await testDb()
      .select()
      .from(s.membership)
      .where(and(eq(s.membership.companyId, f.companyId), eq(s.membership.userId, f.users.admin.id)));
    expect(row?.role).toBe("admin");
  });

  it("with a second administrator, the first may step down", async () => {
    const promoted = await api(admin, "PATCH", `/api/admin/users/${f.users.superintendent.id}`, { role: "admin" });
    expect(promoted.status).toBe(200);
    const res = await api<AdminPerson>(admin, "PATCH", self(), { role: "superintendent", rank: "Fleet manager" });
    expect(res.status).toBe(200);
    expect(res.body.role).toBe("superintendent");
    // No longer an administrator: the next call is refused.
    expect((await api(admin, "GET", "/api/admin/users")).status).toBe(403);
  });
});
