// The access matrix (issue 10): every method of every app/api/**/route.ts, found at test time,
// called as anonymous and as each role on each kind of vessel, must answer what
// server/auth/roles.ts and the door (server/http/with-access.ts) say: 401, 403, 404 or through the
// door; and the refused requests must leave every table as it was.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { can, ROLES, type Role, seesWholeFleet } from "@/server/auth/roles";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { api, type Session, signIn } from "../support/http";
import {
  discoverRoutes,
  NOT_SENT_WHEN_ALLOWED,
  type RouteMethod,
  STATE_CHANGING,
  WRITES_WITHOUT_BODY,
} from "./matrix-routes";
import { changedTables, snapshotTables } from "./matrix-snapshot";

// The door's own words for each refusal (server/http/with-access.ts).
const SIGN_IN = "Sign in to continue.";
const NO_ROLE = "Your role does not allow this action.";
const NO_VESSEL = "No such vessel.";

type Who = Role | "anonymous";
const WHO: Who[] = ["anonymous", ...ROLES];

const VESSEL_TARGETS = [
  "assigned vessel",
  "unassigned vessel of the same company",
  "another company's vessel",
  "malformed vessel id",
] as const;
type Target = (typeof VESSEL_TARGETS)[number] | "the company" | "malformed path id";

type Expected = { status: 401 | 403 | 404; detail: string } | { through: true };
type Cell = { route: RouteMethod; who: Who; target: Target; expected: Expected };
type Answer = { status: number; detail: string | null };

const discovery = discoverRoutes();
const cells = discovery.routes.flatMap((route) =>
  targetsOf(route).flatMap((target) => WHO.map((who) => cellOf(route, who, target))),
);

function targetsOf(route: RouteMethod): Target[] {
  const vessel = route.door.kind === "session" && route.door.vessel;
  return [
    ...(vessel ? VESSEL_TARGETS : ["the company" as const]),
    ...(route.ids.length ? ["malformed path id" as const] : []),
  ];
}

function cellOf(route: RouteMethod, who: Who, target: Target): Cell {
  return { route, who, target, expected: expectedOf(route, who, target) };
}

/** The door's order: session, then the vessel (404 hides it), then the role, then the path's ids. */
function expectedOf(route: RouteMethod, who: Who, target: Target): Expected {
  if (route.door.kind === "public") return { through: true };
  if (who === "anonymous") return { status: 401, detail: SIGN_IN };
  if (route.door.vessel && !opens(who, target)) return { status: 404, detail: NO_VESSEL };
  if (!can(who, route.door.permission)) return { status: 403, detail: NO_ROLE };
  if (target === "malformed path id") return { status: 404, detail: route.malformedDetail ?? "" };
  return { through: true };
}

/** The malformed path id target is on the assigned vessel, so only that id is wrong. */
function opens(role: Role, target: Target): boolean {
  if (target === "assigned vessel" || target === "malformed path id") return true;
  return target === "unassigned vessel of the same company" && seesWholeFleet(role);
}

const key = (cell: Cell) => `${cell.route.method} ${cell.route.pattern}`;
const refused = cells.filter((c) => !("through" in c.expected));
const notSent = cells.filter((c) => "through" in c.expected && key(c) in NOT_SENT_WHEN_ALLOWED);
const writers = cells.filter((c) => "through" in c.expected && key(c) in WRITES_WITHOUT_BODY);
const through = cells.filter((c) => "through" in c.expected && !notSent.includes(c) && !writers.includes(c));

let f: Fixture;
let other: Fixture;
const sessions = new Map<Who, Session | null>([["anonymous", null]]);

beforeAll(async () => {
  [f, other] = await Promise.all([createCompany("matrix"), createCompany("matrix-other")]);
  for (const role of ROLES) sessions.set(role, await signIn(f.users[role].email, PASSWORD));
});
afterAll(closeTestDb);

function urlOf(cell: Cell): string {
  const vesselId = {
    "assigned vessel": f.vesselA.id,
    "malformed path id": f.vesselA.id,
    "the company": "",
    "unassigned vessel of the same company": f.vesselB.id,
    "another company's vessel": other.vesselA.id,
    "malformed vessel id": "not-a-uuid",
  }[cell.target];
  let url = cell.route.pattern.replace("[vesselId]", vesselId);
  for (const id of cell.route.ids)
    url = url.replace(`[${id.name}]`, cell.target === "malformed path id" ? id.malformed : id.good);
  return url;
}

async function call(cell: Cell): Promise<Answer> {
  // State-changing methods carry an empty JSON object: the door's checks come before the contract,
  // so an allowed request is then refused by the contract (422) and writes nothing.
  const body = STATE_CHANGING.has(cell.route.method) ? {} : undefined;
  const res = await api<unknown>(sessions.get(cell.who) ?? null, cell.route.method, urlOf(cell), body);
  const detail = res.body && typeof res.body === "object" && "detail" in res.body ? String(res.body.detail) : null;
  return { status: res.status, detail };
}

function answersAsExpected(expected: Expected, got: Answer): boolean {
  if ("through" in expected) {
    const doorRefused = got.status === 401 || got.status === 403 || (got.status === 404 && got.detail === NO_VESSEL);
    return !doorRefused && got.status < 500;
  }
  return got.status === expected.status && got.detail === expected.detail;
}

function describeCell(cell: Cell, got: Answer): string {
  const expected =
    "through" in cell.expected
      ? "through the door (not 401/403/vessel 404, no 5xx)"
      : `${cell.expected.status} "${cell.expected.detail}"`;
  return `${key(cell)} as ${cell.who} on ${cell.target} (${urlOf(cell)}): expected ${expected}, got ${got.status} "${got.detail ?? ""}"`;
}

/** Runs the cells eight at a time and returns a line for each that answered otherwise. */
async function mismatches(batch: Cell[]): Promise<string[]> {
  const found: string[] = [];
  let next = 0;
  const lane = async () => {
    while (next < batch.length) {
      const cell = batch[next++]!;
      const got = await call(cell);
      if (!answersAsExpected(cell.expected, got)) found.push(describeCell(cell, got));
    }
  };
  await Promise.all(Array.from({ length: 8 }, lane));
  return found.sort();
}

describe("the access matrix", () => {
  it("reads every route file: each method's door and options, or a named exception", () => {
    expect(discovery.problems, "route methods the matrix cannot classify: say what they expect").toEqual([]);
    // Each of the door's answers occurs, so a misreading that put every cell in one kind fails here.
    const kinds = new Set(
      cells.map((c) => ("through" in c.expected ? "through" : `${c.expected.status} ${c.expected.detail}`)),
    );
    for (const kind of ["through", `401 ${SIGN_IN}`, `403 ${NO_ROLE}`, `404 ${NO_VESSEL}`])
      expect([...kinds]).toContain(kind);
  });

  it(
    `answers as roles.ts says, and refused requests change no table (${cells.length} cells)`,
    { timeout: 120_000 },
    async () => {
      const db = testDb();
      const companies = [f.companyId, other.companyId];

      const beforeRefused = await snapshotTables(db, companies);
      // The snapshot reads the fixtures' rows: two readings for each company (tests/support/fixtures.ts).
      expect(beforeRefused.get("reading")).toMatch(/^4 rows,/);
      const refusedWrong = await mismatches(refused);
      const changedByRefused = changedTables(beforeRefused, await snapshotTables(db, companies));

      const beforeThrough = await snapshotTables(db, companies);
      const throughWrong = await mismatches(through);
      const changedByThrough = changedTables(beforeThrough, await snapshotTables(db, companies));

      // Last: they write on purpose (a retired vessel would turn later writes into 409s).
      const writersWrong = await mismatches(writers);

      // Soft: one run names every wrong cell and every changed table, not only the first kind found.
      expect.soft([...refusedWrong, ...throughWrong, ...writersWrong], "cells that answered otherwise").toEqual([]);
      expect.soft(changedByRefused, `tables changed by the ${refused.length} refused requests`).toEqual([]);
      expect
        .soft(changedByThrough, `tables changed by the ${through.length} allowed requests with an empty body`)
        .toEqual([]);
      expect(refused.length + through.length + writers.length + notSent.length).toBe(cells.length);
    },
  );
});
