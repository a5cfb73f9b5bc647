// The company's own rank names over HTTP: the administrator saves them, a refusal names the rank and
// writes nothing, another company keeps Keelson's words, and nobody else may change them.
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as s from "@/db/schema";
import type { Problem } from "@/server/http/problem";
import type { RankNamesView } from "@/server/routines/rank-names";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { api, type Session, signIn } from "../support/http";

let f: Fixture;
let other: Fixture;
let admin: Session;
const PATH = "/api/admin/rank-names";

const stored = async (companyId: string) =>
  (await testDb().select({ names: s.company.rankNames }).from(s.company).where(eq(s.company.id, companyId)))[0]!.names;
const named = (view: RankNamesView) =>
  Object.fromEntries(view.ranks.filter((r) => r.name).map((r) => [r.rank, r.name]));

beforeAll(async () => {
  [f, other] = await Promise.all([createCompany("rank-names"), createCompany("rank-names-other")]);
  admin = await signIn(f.users.admin.email, PASSWORD);
});
afterAll(closeTestDb);

describe("the company's rank names", () => {
  it("starts with Keelson's words for all seven ranks", async () => {
    const res = await api<RankNamesView>(admin, "GET", PATH);
    expect(res.status).toBe(200);
    expect(res.body.ranks.map((r) => [r.rank, r.keelson, r.name])).toEqual([
      ["chief-engineer", "Chief engineer", null],
      ["second-engineer", "Second engineer", null],
      ["third-engineer", "Third engineer", null],
      ["fourth-engineer", "Fourth engineer", null],
      ["electro-technical-officer", "Electro-technical officer", null],
      ["motorman", "Motorman", null],
      ["oiler", "Oiler", null],
    ]);
  });

  it("saves the renamed ranks, and a second save replaces the first", async () => {
    const first = await api<RankNamesView>(admin, "PUT", PATH, {
      oiler: "Wiper",
      "fourth-engineer": "Junior engineer",
    });
    expect(first.status).toBe(200);
    expect(named(first.body)).toEqual({ oiler: "Wiper", "fourth-engineer": "Junior engineer" });
    const second = await api<RankNamesView>(admin, "PUT", PATH, { oiler: "Wiper", "electro-technical-officer": "ETO" });
    expect(named(second.body)).toEqual({ oiler: "Wiper", "electro-technical-officer": "ETO" });
    expect(await stored(f.companyId)).toEqual({ oiler: "Wiper", "electro-technical-officer": "ETO" });
    expect(await stored(other.companyId)).toEqual({});
    const theirs = await api<RankNamesView>(await signIn(other.users.admin.email, PASSWORD), "GET", PATH);
    expect(named(theirs.body)).toEqual({});
  });

  it("refuses two ranks under one name with the rank's field, and writes nothing", async () => {
    const res = await api<Problem>(admin, "PUT", PATH, { oiler: "Wiper", motorman: "wiper" });
    expect(res.status).toBe(422);
    expect(res.body.errors).toEqual([
      { field: "oiler", message: "“Wiper” is already the name of motorman: give each rank its own name." },
    ]);
    expect(await stored(f.companyId)).toEqual({ oiler: "Wiper", "electro-technical-officer": "ETO" });
  });

  it("lets only the administrator read or change them", async () => {
    for (const role of ["superintendent", "chief-engineer", "engineer", "viewer"] as const) {
      const session = await signIn(f.users[role].email, PASSWORD);
      expect((await api(session, "GET", PATH)).status).toBe(403);
      expect((await api(session, "PUT", PATH, { oiler: "Greaser" })).status).toBe(403);
    }
    expect((await api(null, "PUT", PATH, { oiler: "Greaser" })).status).toBe(401);
    expect(await stored(f.companyId)).toEqual({ oiler: "Wiper", "electro-technical-officer": "ETO" });
  });
});
