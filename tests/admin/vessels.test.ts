// The company administrator's vessels: add, edit, retire; every refusal names the field and writes nothing.
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as s from "@/db/schema";
import type { AdminVessel, AdminVesselList } from "@/server/admin/contract";
import type { Problem } from "@/server/http/problem";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { api, type Session, signIn } from "../support/http";

let f: Fixture;
let admin: Session;

async function companyVessels() {
  return testDb().select().from(s.vessel).where(eq(s.vessel.companyId, f.companyId)).orderBy(s.vessel.id);
}

beforeAll(async () => {
  f = await createCompany("admin-vessels");
  admin = await signIn(f.users.admin.email, PASSWORD);
});
afterAll(closeTestDb);

// IMO vectors from ../shared/SOURCES.md, "IMO ship identification number": 9074729, 7654329 and
// 9241061 are valid; 9074728 is not. The fixture's own vessels use other, generated numbers.
const corran = { name: "Corran Ness", imoNumber: "IMO 9074729", code: "cn", timeZone: "europe/oslo" };

async function expect422(method: string, path: string, body: unknown, field: string, message: RegExp) {
  const before = await companyVessels();
  const res = await api<Problem>(admin, method, path, body);
  expect(res.status).toBe(422);
  expect(res.contentType).toContain("application/problem+json");
  const error = res.body.errors?.find((e) => e.field === field);
  expect(error?.message, JSON.stringify(res.body.errors)).toMatch(message);
  expect(await companyVessels()).toEqual(before);
}

describe("POST /api/admin/vessels", () => {
  it.each([
    [
      "a bad IMO check digit",
      { imoNumber: "9074728" },
      "imoNumber",
      /check digit does not match: with 907472 the last digit must be 9/,
    ],
    ["an IMO number that is not seven digits", { imoNumber: "IMO 90747" }, "imoNumber", /exactly seven digits/],
    ["an unknown time zone", { timeZone: "Atlantis/Lost_City" }, "timeZone", /not an IANA time zone/],
    ["a malformed code", { code: "C-N" }, "code", /2 to 6 letters or digits/],
    ["a one-letter name", { name: "C" }, "name", /at least 2 characters/],
  ])("refuses %s with 422 on that field", async (_label, change, field, message) => {
    await expect422("POST", "/api/admin/vessels", { ...corran, ...change }, field, message);
  });

  it("refuses a code the company already uses, naming the vessel", async () => {
    await expect422(
      "POST",
      "/api/admin/vessels",
      { ...corran, code: "alpha" },
      "code",
      new RegExp(`^Code ALPHA is already used by ${f.vesselA.name}\\.$`),
    );
  });

  it("refuses an IMO number the company already has", async () => {
    await expect422(
      "POST",
      "/api/admin/vessels",
      { ...corran, imoNumber: f.vesselB.imoNumber },
      "imoNumber",
      new RegExp(`already registered as ${f.vesselB.name}`),
    );
  });

  it("stores a valid vessel normalised, and lists it", async () => {
    const before = (await companyVessels()).length;
    const res = await api<AdminVessel>(admin, "POST", "/api/admin/vessels", corran);
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      name: "Corran Ness",
      imoNumber: "9074729",
      code: "CN",
      timeZone: "Europe/Oslo",
      counters: 0,
      retiredAt: null,
    });
    expect((await companyVessels()).length).toBe(before + 1);

    const list = await api<AdminVesselList>(admin, "GET", "/api/admin/vessels");
    expect(list.body.vessels.find((v) => v.code === "CN")?.id).toBe(res.body.id);
    expect(list.body.vessels.find((v) => v.id === f.vesselA.id)).toMatchObject({
      code: "ALPHA",
      counters: 2,
      assignedPeople: 3,
    });

    // Another administrator sending the same vessel again is told which one has it.
    await expect422("POST", "/api/admin/vessels", corran, "code", /Code CN is already used by Corran Ness/);
  });
});

describe("PATCH and DELETE /api/admin/vessels/[vesselId]", () => {
  const path = () => `/api/admin/vessels/${f.vesselB.id}`;

  it("edits only what is sent", async () => {
    const res = await api<AdminVessel>(admin, "PATCH", path(), { name: "Bravo Star", timeZone: "Asia/Tokyo" });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({
      name: "Bravo Star",
      code: "BRAVO",
      imoNumber: f.vesselB.imoNumber,
      timeZone: "Asia/Tokyo",
    });
  });

  it("lets a vessel keep its own code, and refuses another vessel's", async () => {
    expect((await api(admin, "PATCH", path(), { code: "BRAVO" })).status).toBe(200);
    await expect422("PATCH", path(), { code: "ALPHA" }, "code", /Code ALPHA is already used by/);
    await expect422("PATCH", path(), { imoNumber: "9241062" }, "imoNumber", /check digit/);
    await expect422("PATCH", path(), { timeZone: "CET" }, "timeZone", /not an IANA time zone/);
  });

  it("retires a vessel and returns it to service; its records stay", async () => {
    const retired = await api<AdminVessel>(admin, "DELETE", path());
    expect(retired.status).toBe(200);
    expect(retired.body.retiredAt).not.toBeNull();
    const [row] = await testDb().select().from(s.vessel).where(eq(s.vessel.id, f.vesselB.id));
    expect(row?.retiredAt).not.toBeNull();
    const counters = await testDb().select().from(s.counter).where(eq(s.counter.vesselId, f.vesselB.id));
    expect(counters).toHaveLength(1);

    // A retired vessel's code stays taken: old work-order numbers still point at it.
    await expect422(
      "POST",
      "/api/admin/vessels",
      { ...corran, code: "BRAVO", imoNumber: "7654329" },
      "code",
      /already used by Bravo Star \(retired\)/,
    );

    const back = await api<AdminVessel>(admin, "PATCH", path(), { retired: false });
    expect(back.status).toBe(200);
    expect(back.body.retiredAt).toBeNull();
  });
});
