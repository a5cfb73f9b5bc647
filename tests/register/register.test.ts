// The machinery register over HTTP: the tree and its counters, bad input, moves, retiring.
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Problem } from "@/server/http/problem";
import type { RegisterView } from "@/server/register/contract";
import { closeTestDb, createCompany, type Fixture, PASSWORD } from "../support/fixtures";
import { api, type Session, signIn } from "../support/http";
import { componentById, counterById, type Register, registerRows, seedRegister } from "./register-fixture";

let f: Fixture;
let r: Register;
let chief: Session;
const v = () => `/api/vessels/${f.vesselA.id}`;

beforeAll(async () => {
  f = await createCompany("register");
  r = await seedRegister(f);
  chief = await signIn(f.users["chief-engineer"].email, PASSWORD);
});
afterAll(closeTestDb);

/** Sends a bad request as the chief engineer: 422 naming the field, and not a row changed. */
async function expect422(method: string, path: string, body: unknown, field: string, message: RegExp) {
  const before = await registerRows(f.companyId);
  const res = await api<Problem>(chief, method, path, body);
  expect(res.status, JSON.stringify(res.body)).toBe(422);
  expect(res.contentType).toContain("application/problem+json");
  const error = res.body.errors?.find((e) => e.field === field);
  expect(error, JSON.stringify(res.body.errors)).toBeDefined();
  expect(error!.message).toMatch(message);
  expect(await registerRows(f.companyId)).toEqual(before);
}

describe("GET register", () => {
  it("gives each component its own counter, or the nearest ancestor's, or none", async () => {
    const res = await api<RegisterView>(chief, "GET", `${v()}/register`);
    expect(res.status).toBe(200);
    const byCode = new Map(res.body.components.map((c) => [c.code, c]));
    expect(byCode.get("ME")?.effectiveCounter).toEqual({ kind: "own", counterId: f.counters.main.id });
    expect(byCode.get("ME.CYL.3")?.effectiveCounter).toEqual({
      kind: "inherited",
      counterId: f.counters.main.id,
      fromComponentId: r.me.id,
    });
    expect(byCode.has("B.ME")).toBe(false);
    const main = res.body.counters.find((c) => c.id === f.counters.main.id);
    expect(main).toMatchObject({ name: "Main engine", segment: 1, last: { meterValue: 1000, totalHours: 1000 } });
    expect(main?.usedBy.map((u) => u.code)).toEqual(["ME"]);
  });
});

describe("POST components: bad input is 422 on the field, nothing written", () => {
  const post = (body: object, field: string, message: RegExp) =>
    expect422("POST", `${v()}/components`, body, field, message);

  it.each([
    ["a code starting with a dot", { code: ".ME", name: "x" }, "code", /only letters, digits and \. _ -/],
    ["a code with a space", { code: "ME CYL", name: "x" }, "code", /only letters, digits/],
    ["a code of 41 characters", { code: "A".repeat(41), name: "x" }, "code", /keep it to 40 or fewer/],
    ["no code", { name: "x" }, "code", /Enter a code/],
    ["no name", { code: "X1", name: "  " }, "name", /Enter the component’s name/],
    ["a name of 121 characters", { code: "X1", name: "n".repeat(121) }, "name", /120 characters or fewer/],
    ["a malformed parent id", { code: "X1", name: "x", parentId: "ME" }, "parentId", /not a component/],
    ["critical as text", { code: "X1", name: "x", critical: "yes" }, "critical", /yes or no/],
    [
      "a long class item reference",
      { code: "X1", name: "x", classItemRef: "c".repeat(41) },
      "classItemRef",
      /40 characters/,
    ],
  ])("%s", async (_label, body, field, message) => {
    await post(body, field, message);
  });

  it("a parent of another vessel", async () => {
    await post({ code: "X1", name: "x", parentId: r.otherVessel.id }, "parentId", /no such component on Alpha/);
  });

  it("a counter of another vessel, or one that does not exist", async () => {
    await post(
      { code: "X1", name: "x", counterId: f.counters.otherVessel.id },
      "counterId",
      /no such counter on Alpha/,
    );
    await post({ code: "X1", name: "x", counterId: randomUUID() }, "counterId", /no such counter/);
  });

  it("a code already used on the vessel, naming who uses it (whatever its case)", async () => {
    await post(
      { code: "me.cyl.3", name: "Another" },
      "code",
      /^ME\.CYL\.3 is already used on this vessel by Cylinder unit 3\.$/,
    );
  });

  it("a body that is not JSON", async () => {
    await post("{oops" as unknown as object, "(body)", /not valid JSON/);
  });
});

describe("POST components: a good one", () => {
  it("is stored with its code in capitals, under its parent, inheriting the counter", async () => {
    const res = await api<{ id: string; code: string }>(chief, "POST", `${v()}/components`, {
      code: " me.cyl.4 ",
      name: "Cylinder unit 4",
      parentId: r.cyl.id,
      classItemRef: "ME-CYL-4",
      maker: "",
    });
    expect(res.status).toBe(201);
    const row = await componentById(res.body.id);
    expect(row).toMatchObject({
      code: "ME.CYL.4",
      parentId: r.cyl.id,
      classItemRef: "ME-CYL-4",
      maker: null,
      critical: false,
      counterId: null,
    });
    // The same code on vessel B is another vessel's business.
    const other = await api(chief, "POST", `${v()}/components`, { code: "B.ME", name: "Not B's" });
    expect(other.status).toBe(201);
  });
});

describe("PATCH components: edit and move", () => {
  const patch = (id: string, body: object, field: string, message: RegExp) =>
    expect422("PATCH", `${v()}/components/${id}`, body, field, message);

  it("refuses an empty change", async () => {
    await patch(r.cyl3.id, {}, "(body)", /Nothing to change/);
  });

  it("refuses a move under itself or under its own descendant, and leaves it where it was", async () => {
    await patch(r.cyl.id, { parentId: r.cyl.id }, "parentId", /ME\.CYL can’t be put under itself/);
    await patch(
      r.me.id,
      { parentId: r.cyl3.id },
      "parentId",
      /ME can’t be put under ME\.CYL\.3: ME\.CYL\.3 is part of ME/,
    );
    expect((await componentById(r.me.id))?.parentId).toBeNull();
  });

  it("refuses a move under another vessel's component", async () => {
    await patch(r.cyl3.id, { parentId: r.otherVessel.id }, "parentId", /no such component/);
    expect((await componentById(r.cyl3.id))?.parentId).toBe(r.cyl.id);
  });

  it("refuses renaming to a code in use", async () => {
    await patch(r.cyl3.id, { code: "AE.1" }, "code", /AE\.1 is already used on this vessel by Generator set 1/);
  });

  it("moves a component under another; it then uses the new ancestor's counter", async () => {
    const res = await api(chief, "PATCH", `${v()}/components/${r.cyl3.id}`, { parentId: r.ae1.id });
    expect(res.status).toBe(200);
    const view = await api<RegisterView>(chief, "GET", `${v()}/register`);
    const moved = view.body.components.find((c) => c.id === r.cyl3.id);
    expect(moved?.effectiveCounter).toEqual({
      kind: "inherited",
      counterId: f.counters.gen.id,
      fromComponentId: r.ae1.id,
    });
    const back = await api(chief, "PATCH", `${v()}/components/${r.cyl3.id}`, {
      parentId: null,
      code: "me.cyl.3",
      critical: true,
    });
    expect(back.status).toBe(200);
    expect(await componentById(r.cyl3.id)).toMatchObject({ parentId: null, code: "ME.CYL.3", critical: true });
  });
});

describe("counters", () => {
  it.each([
    ["no name", { name: "", plannedHoursPerDay: 4 }, "name", /Enter the counter’s name/],
    ["more than 24 h a day", { name: "Boiler", plannedHoursPerDay: 25 }, "plannedHoursPerDay", /from 0 to 24/],
    ["two decimals", { name: "Boiler", plannedHoursPerDay: "1.25" }, "plannedHoursPerDay", /at most one decimal/],
    ["no planned hours", { name: "Boiler" }, "plannedHoursPerDay", /planned running hours per day/],
    [
      "a name in use, in another case",
      { name: "main ENGINE", plannedHoursPerDay: 4 },
      "name",
      /already a counter named Main engine/,
    ],
  ])("POST refuses %s", async (_label, body, field, message) => {
    await expect422("POST", `${v()}/counters`, body, field, message);
  });

  it("PATCH refuses a bad planned rate and changes nothing", async () => {
    await expect422(
      "PATCH",
      `${v()}/counters/${f.counters.gen.id}`,
      { plannedHoursPerDay: "abc" },
      "plannedHoursPerDay",
      /from 0 to 24/,
    );
    expect((await counterById(f.counters.gen.id))?.plannedHoursPerDay).toBe(12);
  });

  it("retiring a counter a component uses is refused, naming the component", async () => {
    const before = await registerRows(f.companyId);
    const res = await api<Problem>(chief, "DELETE", `${v()}/counters/${f.counters.gen.id}`);
    expect(res.status).toBe(409);
    expect(res.body.detail).toMatch(
      /Generator 1 is still the counter of AE\.1 Generator set 1\. Give it another counter/,
    );
    expect((await counterById(f.counters.gen.id))?.retiredAt).toBeNull();
    expect(await registerRows(f.companyId)).toEqual(before);
  });

  it("an unused counter retires; it then cannot be given to a component or changed", async () => {
    const res = await api(chief, "DELETE", `${v()}/counters/${r.spare.id}`);
    expect(res.status).toBe(200);
    expect((await counterById(r.spare.id))?.retiredAt).toBeInstanceOf(Date);
    await expect422(
      "PATCH",
      `${v()}/components/${r.cyl3.id}`,
      { counterId: r.spare.id },
      "counterId",
      /Spare meter was retired on/,
    );
    const again = await api<Problem>(chief, "PATCH", `${v()}/counters/${r.spare.id}`, { name: "Spare 2" });
    expect(again.status).toBe(409);
    const view = await api<RegisterView>(chief, "GET", `${v()}/register`);
    expect(view.body.counters.find((c) => c.id === r.spare.id)?.retiredAt).not.toBeNull();
  });
});
