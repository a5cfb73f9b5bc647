// The access door's refusals of a hostile or careless client, before anything is read or written:
// a state-changing request from another origin (or none), a body not declared as JSON, a body too
// large to be a Keelson request, and a name echoed back cut short.
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as s from "@/db/schema";
import { shipClock, shipDay } from "@/server/format/hours";
import type { Problem } from "@/server/http/problem";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { BASE_URL, type Session, signIn } from "../support/http";

let f: Fixture;
let engineer: Session;

beforeAll(async () => {
  f = await createCompany("door");
  engineer = await signIn(f.users.engineer.email, PASSWORD);
});
afterAll(closeTestDb);

const readingsPath = () => `/api/vessels/${f.vesselA.id}/readings`;

function goodBatch() {
  const now = new Date();
  const tz = f.vesselA.timeZone;
  return { shipDay: shipDay(now, tz), time: shipClock(now, tz), entries: [{ counterId: f.counters.main.id, value: 1005 }] };
}

async function send(path: string, headers: Record<string, string>, body: string, method = "POST") {
  const response = await fetch(`${BASE_URL}${path}`, { method, headers: { cookie: engineer.cookie, ...headers }, body });
  const text = await response.text();
  return { status: response.status, type: response.headers.get("content-type"), body: (text ? JSON.parse(text) : null) as Problem };
}

async function readingCount(): Promise<number> {
  return (await testDb().select({ id: s.reading.id }).from(s.reading).where(eq(s.reading.vesselId, f.vesselA.id))).length;
}

describe("a state-changing request from outside Keelson's pages", () => {
  it.each([
    ["a foreign Origin", { origin: "https://elsewhere.example" }],
    ["Origin: null (a sandboxed frame, a file)", { origin: "null" }],
    ["no Origin at all", {}],
    ["our Origin but a cross-site fetch", { origin: BASE_URL, "sec-fetch-site": "cross-site" }],
  ])("is refused with 403 and writes nothing: %s", async (_label, headers) => {
    const before = await readingCount();
    const res = await send(readingsPath(), { "content-type": "application/json", ...headers }, JSON.stringify(goodBatch()));
    expect(res.status).toBe(403);
    expect(res.type).toBe("application/problem+json");
    expect(res.body.detail).toMatch(/did not come from Keelson/);
    expect(await readingCount()).toBe(before);
  });

  it("a GET from anywhere still reads (a link followed from a mail client)", async () => {
    const response = await fetch(`${BASE_URL}/api/vessels/${f.vesselA.id}/hour-log`, {
      headers: { cookie: engineer.cookie, origin: "https://elsewhere.example" },
    });
    expect(response.status).toBe(200);
  });
});

describe("a body the door does not parse", () => {
  it("JSON sent as text/plain (what a cross-site form can send) is 415, nothing written", async () => {
    const before = await readingCount();
    const res = await send(readingsPath(), { origin: BASE_URL, "content-type": "text/plain" }, JSON.stringify(goodBatch()));
    expect(res.status).toBe(415);
    expect(res.body.detail).toMatch(/Content-Type: application\/json/);
    expect(await readingCount()).toBe(before);
  });

  it("a body over the limit is 413 before it is parsed", async () => {
    const huge = JSON.stringify({ ...goodBatch(), remark: "x".repeat(2 * 1024 * 1024) });
    const res = await send(readingsPath(), { origin: BASE_URL, "content-type": "application/json" }, huge);
    expect(res.status).toBe(413);
    expect(res.body.detail).toMatch(/larger than 256 kB/);
  });

  it("a long value the contract names in its message comes back cut short, not whole", async () => {
    const state = "x".repeat(10_000);
    const response = await fetch(`${BASE_URL}/api/vessels/${f.vesselA.id}/backlog?state=${state}`, {
      headers: { cookie: engineer.cookie },
    });
    const text = await response.text();
    expect(response.status).toBe(422);
    expect((JSON.parse(text) as Problem).errors?.[0]?.field).toBe("query.state");
    expect(text.length).toBeLessThan(2_000);
  });
});

describe("a NUL character, which PostgreSQL cannot store in text", () => {
  it("is a 422 naming the field, before any query, and nothing is written", async () => {
    const before = await readingCount();
    const batch = goodBatch();
    const body = { ...batch, entries: [{ ...batch.entries[0], remark: "oil\u0000leak" }] };
    const res = await send(readingsPath(), { origin: BASE_URL, "content-type": "application/json" }, JSON.stringify(body));
    expect(res.status).toBe(422);
    expect(res.body.errors).toEqual([{ field: "entries.0.remark", message: expect.stringMatching(/NUL character/) }]);
    expect(await readingCount()).toBe(before);
  });

  it("in a query too", async () => {
    const response = await fetch(`${BASE_URL}/api/vessels/${f.vesselA.id}/backlog?q=pump%00`, {
      headers: { cookie: engineer.cookie },
    });
    expect(response.status).toBe(422);
    expect(((await response.json()) as Problem).errors?.[0]?.field).toBe("query.q");
  });
});

describe("the valid request still goes through", () => {
  it("with our Origin and JSON declared", async () => {
    const res = await send(readingsPath(), { origin: BASE_URL, "content-type": "application/json" }, JSON.stringify(goodBatch()));
    expect(res.status).toBe(201);
  });
});
