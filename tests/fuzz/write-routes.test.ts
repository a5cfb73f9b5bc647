// Property-based fuzzing of every write route (issue 10): each POST, PUT, PATCH and DELETE that
// the access matrix finds in app/api/**/route.ts gets the issue's named hostile inputs and
// fast-check's generated ones, sent by a role the route allows on the fuzz company's own vessel.
// A case the route's contract refuses must be a 4xx problem+json naming the field, within the
// timeout, and leave every table as it was; a case the contract accepts may write (2xx), never 5xx.
// Replay: FUZZ_SEED=<seed> (and FUZZ_RUNS=<n>) give the same cases again.
import { randomUUID } from "node:crypto";
import { sql } from "drizzle-orm";
import fc from "fast-check";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { reading, workOrder } from "@/db/schema";
import { can, type Permission, type Role } from "@/server/auth/roles";
import { shipClock, shipDay } from "@/server/format/hours";
import {
  discoverRoutes,
  NOT_SENT_WHEN_ALLOWED,
  type RouteMethod,
  STATE_CHANGING,
  WRITES_WITHOUT_BODY,
} from "../access/matrix-routes";
import { changedTables, snapshotTables } from "../access/matrix-snapshot";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { api, type Session, signIn } from "../support/http";
import { type Answer, answerWords, contractAccepts, describeCase, refusalProblems, send } from "./write-answers";
import { casesFor, type FuzzCase, namedCases } from "./write-cases";
import { type Contract, contractOf, EXAMPLES, type ExampleContext, portStay, toleranceRule } from "./write-contracts";

const SEED = Number(process.env.FUZZ_SEED ?? 20_261_204);
const RUNS = Number(process.env.FUZZ_RUNS ?? 15);
/**
 * Contract-valid cases sent per route. Each may write and queue a recompute, so beyond a few the
 * time goes to the route's own rules rather than to the door; the rest are counted, not sent.
 */
const ACCEPTED_SENT = 8;
const REPLAY = `replay with FUZZ_SEED=${SEED} FUZZ_RUNS=${RUNS}`;

const discovery = discoverRoutes();
const keyOf = (r: RouteMethod) => `${r.method} ${r.pattern}`;
const writes = discovery.routes.filter((r) => STATE_CHANGING.has(r.method));
/** Routes that read no input and write with any request: nothing to fuzz, and sending one writes. */
const noInputWriters = (r: RouteMethod) =>
  !r.ids.length && (keyOf(r) in WRITES_WITHOUT_BODY || keyOf(r) in NOT_SENT_WHEN_ALLOWED);
const fuzzed = writes.filter((r) => !noInputWriters(r));

// The roles the fixture signs in, in the order tried: the administrator wherever the permission allows.
const ROLE_ORDER: Role[] = ["admin", "chief-engineer", "superintendent", "engineer"];
const roleFor = (permission: Permission) => ROLE_ORDER.find((role) => can(role, permission))!;

let f: Fixture;
let ctx: ExampleContext;
const sessions = new Map<Role, Session>();
const contracts = new Map<string, Contract>();
/** Path ids that exist in the fuzz company, used where a route reads input (else fresh uuids: 404). */
const realIds: Record<string, string> = {};
const acceptedByContract = new Map<string, FuzzCase[]>();
/** One line per route of how its refused cases were answered, printed at the end. */
const refusals: string[] = [];

/** Each route's own seed, so that adding a route does not change the cases of the others. */
function seedOf(key: string): number {
  let h = SEED | 0;
  for (const ch of key) h = (Math.imul(h, 31) + ch.charCodeAt(0)) | 0;
  return h;
}

async function created(session: Session, path: string, body: unknown): Promise<string> {
  const res = await api<{ id?: string }>(session, "POST", path, body);
  if (res.status !== 201 || !res.body.id) throw new Error(`setup ${path}: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body.id;
}

/** Waits until the worker has run the company's queued jobs (the setup's recomputes), so tables hold still. */
async function jobsSettled(companyId: string): Promise<void> {
  for (let i = 0; i < 150; i++) {
    const pending = await testDb().execute<{ n: number }>(
      sql`select count(*)::int as n from pgboss.job
          where data->>'companyId' = ${companyId} and state in ('created', 'retry', 'active')`,
    );
    if (pending.rows[0]!.n === 0) return;
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
  throw new Error("the worker did not run the setup's jobs within 30 s");
}

beforeAll(async () => {
  f = await createCompany("fuzz");
  for (const role of ROLE_ORDER) sessions.set(role, await signIn(f.users[role].email, PASSWORD));
  const anHourAgo = new Date(Date.now() - 3_600_000);
  const day = (ahead: number) => shipDay(new Date(Date.now() + ahead * 86_400_000), f.vesselA.timeZone);
  const base = {
    companyId: f.companyId,
    userId: f.users.viewer.id,
    counterId: f.counters.main.id,
    shipDay: shipDay(anHourAgo, f.vesselA.timeZone),
    time: shipClock(anHourAgo, f.vesselA.timeZone),
    plannedDay: day(10),
    laterDay: day(12),
    tag: randomUUID().slice(0, 8),
  };
  const admin = sessions.get("admin")!;
  const chief = sessions.get("chief-engineer")!;
  const vessel = `/api/vessels/${f.vesselA.id}`;
  const componentId = await created(admin, `${vessel}/components`, {
    code: "FZ.SETUP",
    name: "Fuzz setup pump",
    counterId: f.counters.main.id,
  });
  ctx = { ...base, componentId };
  const [mainReading] = await testDb()
    .select({ id: reading.id })
    .from(reading)
    .where(sql`${reading.counterId} = ${f.counters.main.id}`);
  Object.assign(realIds, {
    userId: f.users.viewer.id,
    counterId: f.counters.gen.id,
    readingId: mainReading!.id,
    componentId,
    ruleId: await created(admin, "/api/admin/tolerance-rules", toleranceRule(`Fuzz setup ${base.tag}`)),
    routineId: await created(chief, `${vessel}/routines`, EXAMPLES["POST /api/vessels/[vesselId]/routines"]!(ctx).body),
    stayId: await created(chief, `${vessel}/port-stays`, portStay(ctx)),
  });
  for (const route of fuzzed) contracts.set(keyOf(route), await contractOf(route));
  await jobsSettled(f.companyId);
  // The routine's first work order, planned by the worker's recompute: completions, planned days
  // and deferrals then reach the domain with a valid body instead of stopping at "no such work order".
  const [firstOrder] = await testDb()
    .select({ id: workOrder.id })
    .from(workOrder)
    .where(sql`${workOrder.companyId} = ${f.companyId}`);
  if (firstOrder) realIds.workOrderId = firstOrder.id;
}, 90_000);
afterAll(closeTestDb);

function pathOf(route: RouteMethod, readsInput: boolean): string {
  let path = route.pattern.replace("[vesselId]", f.vesselA.id);
  for (const id of route.ids) path = path.replace(`[${id.name}]`, (readsInput && realIds[id.name]) || randomUUID());
  return path;
}

/** Runs `work` over `items` four at a time (the shared machine has two cores). */
async function inLanes<T>(items: T[], work: (item: T) => Promise<void>): Promise<void> {
  let next = 0;
  const lane = async () => {
    while (next < items.length) await work(items[next++]!);
  };
  await Promise.all(Array.from({ length: 4 }, lane));
}

describe("fuzzing every write route", () => {
  it("finds the write routes, and each that reads input has a valid example its contract takes", async () => {
    expect(discovery.problems, "route methods the access matrix cannot read").toEqual([]);
    expect(fuzzed.length, "write routes found").toBeGreaterThan(20);
    const missing: string[] = [];
    for (const route of fuzzed) {
      const key = keyOf(route);
      const contract = contracts.get(key)!;
      if (!contract.bodyName && !contract.queryName) continue;
      const example = EXAMPLES[key]?.(ctx);
      if (!example) {
        missing.push(
          `${key}: reads ${contract.bodyName ?? contract.queryName} but has no example in tests/fuzz/write-contracts.ts`,
        );
        continue;
      }
      for (const [part, schema, value] of [
        ["body", contract.body, example.body],
        ["query", contract.query, example.query ?? {}],
      ] as const) {
        const result = schema?.safeParse(value);
        if (result && !result.success)
          missing.push(`${key}: the example's ${part} no longer passes: ${result.error.message}`);
      }
    }
    const listed = new Set(Object.keys(EXAMPLES));
    const stale = [...listed].filter((k) => !fuzzed.some((r) => keyOf(r) === k));
    expect([...missing, ...stale.map((k) => `example for ${k}, which is no write route`)]).toEqual([]);
    console.info(
      `fuzz: ${fuzzed.length} write routes; not sent (no input, every request writes): ${writes.filter(noInputWriters).map(keyOf).join("; ")}`,
    );
  });

  it.each(fuzzed.map((route) => [keyOf(route), route] as const))(
    "%s refuses what its contract refuses, as a 4xx naming the field, writing nothing",
    { timeout: 60_000 },
    async (key, route) => {
      const contract = contracts.get(key)!;
      const readsInput = !!(contract.bodyName || contract.queryName);
      // Only a contract the test can import decides that a case may pass; otherwise each must be refused.
      const decidable =
        readsInput && (!contract.bodyName || !!contract.body) && (!contract.queryName || !!contract.query);
      const example = EXAMPLES[key]?.(ctx) ?? {};
      const exampleKeys = Object.keys(example.body && typeof example.body === "object" ? example.body : {});
      const cases = [...namedCases(example), ...fc.sample(casesFor(example), { seed: seedOf(key), numRuns: RUNS })];
      const session = route.door.kind === "session" ? sessions.get(roleFor(route.door.permission))! : null;
      const path = pathOf(route, readsInput);

      const db = testDb();
      const before = await snapshotTables(db, [f.companyId]);
      const wrong: string[] = [];
      const accepted: FuzzCase[] = [];
      const answers: Answer[] = [];
      await inLanes(cases, async (c) => {
        if (decidable && contractAccepts(c, contract.body, contract.query)) {
          accepted.push(c);
          return;
        }
        let answer: Answer;
        try {
          answer = await send(session, route.method, path, c);
        } catch (error) {
          wrong.push(`${describeCase(c)} → ${String(error)}`);
          return;
        }
        answers.push(answer);
        const problems = refusalProblems(answer, c, { input: readsInput, refusedByContract: decidable, exampleKeys });
        if (problems.length)
          wrong.push(`${describeCase(c)} → ${answer.status} ${answer.text.slice(0, 300)}: ${problems.join("; ")}`);
      });
      acceptedByContract.set(key, accepted);
      refusals.push(`${key}: ${answerWords(answers)}; ${accepted.length} passed the contract`);
      const changed = changedTables(before, await snapshotTables(db, [f.companyId]));

      expect.soft(wrong, `refusals that were not right (${cases.length} cases; ${REPLAY})`).toEqual([]);
      expect.soft(changed, `tables changed by refused requests (${REPLAY})`).toEqual([]);
    },
  );

  it("answers the cases its contract accepts without a 5xx (they may write)", { timeout: 120_000 }, async () => {
    const wrong: string[] = [];
    const tally: string[] = [];
    for (const route of fuzzed) {
      const key = keyOf(route);
      const cases = acceptedByContract.get(key) ?? [];
      if (!cases.length || route.door.kind !== "session") continue;
      const session = sessions.get(roleFor(route.door.permission))!;
      const answers: Answer[] = [];
      for (const c of cases.slice(0, ACCEPTED_SENT)) {
        const answer = await send(session, route.method, pathOf(route, true), c).catch((error: unknown) =>
          String(error),
        );
        if (typeof answer === "string") {
          wrong.push(`${key}: ${describeCase(c)} → ${answer}`);
          continue;
        }
        answers.push(answer);
        const refusal =
          answer.status >= 400
            ? refusalProblems(answer, c, { input: false, refusedByContract: false, exampleKeys: [] })
            : [];
        if (answer.status >= 500 || refusal.length) {
          wrong.push(
            `${key}: ${describeCase(c)} → ${answer.status} ${answer.text.slice(0, 300)} ${refusal.join("; ")}`,
          );
        }
      }
      const unsent = cases.length - answers.length;
      tally.push(`${key}: ${answerWords(answers)}${unsent > 0 ? `; ${unsent} more not sent` : ""}`);
    }
    console.info(`fuzz: refused cases, by answer (${REPLAY}):\n  ${refusals.join("\n  ")}`);
    console.info(`fuzz: cases the contracts accept, by answer:\n  ${tally.join("\n  ")}`);
    expect(wrong, `accepted cases answered wrongly (${REPLAY})`).toEqual([]);
  });
});
