import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as s from "@/db/schema";
import { shipClock, shipDay } from "@/server/format/hours";
import type { Problem } from "@/server/http/problem";
import type { HourLogView } from "@/server/readings/contract";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { api, type Session, signIn } from "../support/http";

let one: Fixture;
let two: Fixture;
const sessions: Record<string, Session> = {};

beforeAll(async () => {
  [one, two] = await Promise.all([createCompany("access-one"), createCompany("access-two")]);
  for (const role of ["admin", "superintendent", "chief-engineer", "engineer", "viewer"] as const) {
    sessions[role] = await signIn(one.users[role].email, PASSWORD);
  }
});
afterAll(closeTestDb);

const NO_SUCH_ID = "00000000-0000-4000-8000-000000000000";

/** Every route handler of the app but better-auth's own, with a valid-looking request. */
function routes(f: Fixture) {
  return [
    { method: "GET", path: `/api/vessels/${f.vesselA.id}/hour-log` },
    { method: "GET", path: `/api/vessels/${f.vesselA.id}/readings?counterId=${f.counters.main.id}` },
    { method: "POST", path: `/api/vessels/${f.vesselA.id}/readings`, body: { shipDay: "2026-01-01", time: "09:00", entries: [] } },
    { method: "PATCH", path: `/api/vessels/${f.vesselA.id}/readings/${NO_SUCH_ID}`, body: { value: 1, reason: "checking the door" } },
    { method: "DELETE", path: `/api/vessels/${f.vesselA.id}/readings/${NO_SUCH_ID}`, body: { reason: "checking the door" } },
    { method: "GET", path: `/api/vessels/${f.vesselA.id}/backlog/export` },
  ];
}

describe("every route handler refuses anonymous calls", () => {
  it("with 401 and a problem document", async () => {
    for (const r of routes(one)) {
      const res = await api<Problem>(null, r.method, r.path, r.body);
      expect(res.status, `${r.method} ${r.path}`).toBe(401);
      expect(res.body.title).toBe("Sign in required");
    }
  });
});

describe("company isolation: another company's ids are not found", () => {
  it.each(["admin", "superintendent", "chief-engineer", "engineer", "viewer"])("for the %s", async (role) => {
    for (const r of routes(two)) {
      const res = await api<Problem>(sessions[role]!, r.method, r.path, r.body);
      expect(res.status, `${role} ${r.method} ${r.path}`).toBe(404);
    }
  });
});

describe("vessel assignments and roles", () => {
  it("seagoing users see only their assigned vessel", async () => {
    for (const role of ["chief-engineer", "engineer", "viewer"]) {
      const a = await api(sessions[role]!, "GET", `/api/vessels/${one.vesselA.id}/hour-log`);
      const b = await api(sessions[role]!, "GET", `/api/vessels/${one.vesselB.id}/hour-log`);
      expect([role, a.status, b.status]).toEqual([role, 200, 404]);
    }
  });

  it("office roles see every vessel of the company", async () => {
    for (const role of ["admin", "superintendent"]) {
      const b = await api<HourLogView>(sessions[role]!, "GET", `/api/vessels/${one.vesselB.id}/hour-log`);
      expect(b.status).toBe(200);
      expect(b.body.canWrite).toBe(false);
    }
  });

  it("only engineers and chief engineers write readings", async () => {
    const now = new Date();
    const batch = (value: number) => ({
      shipDay: shipDay(now, one.vesselA.timeZone),
      time: shipClock(now, one.vesselA.timeZone),
      entries: [{ counterId: one.counters.gen.id, value }],
    });
    for (const role of ["viewer", "superintendent", "admin"]) {
      const res = await api<Problem>(sessions[role]!, "POST", `/api/vessels/${one.vesselA.id}/readings`, batch(505));
      expect([role, res.status]).toEqual([role, 403]);
    }
    const chief = await api(sessions["chief-engineer"]!, "POST", `/api/vessels/${one.vesselA.id}/readings`, batch(505));
    expect(chief.status).toBe(201);
  });

  it("pages send anonymous visitors to sign in", async () => {
    const res = await api(null, "GET", `/vessels/${one.vesselA.id}/hour-log`);
    expect(res.status).toBe(307);
  });
});

describe("a retired vessel", () => {
  it("keeps its records readable and refuses changes until an administrator returns it to service", async () => {
    const f = await createCompany("access-retired");
    const admin = await signIn(f.users.admin.email, PASSWORD);
    const chief = await signIn(f.users["chief-engineer"].email, PASSWORD);
    const readingsOf = async () =>
      (await testDb().select().from(s.reading).where(eq(s.reading.vesselId, f.vesselA.id))).length;
    const now = new Date();
    const batch = {
      shipDay: shipDay(now, f.vesselA.timeZone),
      time: shipClock(now, f.vesselA.timeZone),
      entries: [{ counterId: f.counters.gen.id, value: 505 }],
    };
    const before = await readingsOf();

    expect((await api(admin, "DELETE", `/api/admin/vessels/${f.vesselA.id}`)).status).toBe(200);
    const refused = await api<Problem>(chief, "POST", `/api/vessels/${f.vesselA.id}/readings`, batch);
    expect(refused.status).toBe(409);
    expect(refused.body.detail).toMatch(/was retired on .*: its records can be read, not changed/);
    expect(await readingsOf()).toBe(before);
    // Reading is still allowed.
    expect((await api(chief, "GET", `/api/vessels/${f.vesselA.id}/hour-log`)).status).toBe(200);

    expect((await api(admin, "PATCH", `/api/admin/vessels/${f.vesselA.id}`, { retired: false })).status).toBe(200);
    expect((await api(chief, "POST", `/api/vessels/${f.vesselA.id}/readings`, batch)).status).toBe(201);
    expect(await readingsOf()).toBe(before + 1);
  });
});
