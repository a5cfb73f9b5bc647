import { randomUUID } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as s from "@/db/schema";
import { shipClock, shipDay } from "@/server/format/hours";
import type { Problem } from "@/server/http/problem";
import type { ReadingHistory } from "@/server/readings/contract";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { api, type Session, signIn } from "../support/http";

let f: Fixture;
let engineer: Session;
let now: Date;
const path = () => `/api/vessels/${f.vesselA.id}/readings`;
const at = () => ({ shipDay: shipDay(now, f.vesselA.timeZone), time: shipClock(now, f.vesselA.timeZone) });

async function readingCount(): Promise<number> {
  const rows = await testDb().select().from(s.reading).where(eq(s.reading.vesselId, f.vesselA.id));
  return rows.length;
}

beforeAll(async () => {
  now = new Date();
  f = await createCompany("readings", now);
  engineer = await signIn(f.users.engineer.email, PASSWORD);
});
afterAll(closeTestDb);

describe("POST /api/vessels/[vesselId]/readings: bad input gets 422 and writes nothing", () => {
  async function expect422(body: unknown, field: RegExp, message: RegExp) {
    const before = await readingCount();
    const res = await api<Problem>(engineer, "POST", path(), body);
    expect(res.status).toBe(422);
    expect(res.contentType).toContain("application/problem+json");
    const error = res.body.errors?.find((e) => field.test(e.field));
    expect(error?.message).toMatch(message);
    expect(await readingCount()).toBe(before);
    return res.body;
  }

  it("a reading that goes backwards, even beside a good one", async () => {
    const body = await expect422(
      { ...at(), entries: [{ counterId: f.counters.gen.id, value: 510 }, { counterId: f.counters.main.id, value: 999.5 }] },
      /^entries\.1\.value$/,
      /Main engine: Reading is lower than the previous one \(1,000 h on /,
    );
    expect(body.errors).toHaveLength(1);
    expect(body.errors![0]!.row).toBe(1);
  });

  it("a reading that advances more hours than elapsed (30 h in about 24 h)", async () => {
    await expect422(
      { ...at(), entries: [{ counterId: f.counters.main.id, value: 1030 }] },
      /^entries\.0\.value$/,
      /Reading advances 30 h but only 2[34](\.\d)? h passed since the previous reading/,
    );
  });

  it("an unknown counter", async () => {
    await expect422(
      { ...at(), entries: [{ counterId: randomUUID(), value: 1 }] },
      /^entries\.0\.counterId$/,
      /There is no such counter on Alpha/,
    );
  });

  it("a counter of another vessel is unknown here", async () => {
    await expect422(
      { ...at(), entries: [{ counterId: f.counters.otherVessel.id, value: 1 }] },
      /^entries\.0\.counterId$/,
      /no such counter/,
    );
  });

  it("a date in the future", async () => {
    const tomorrow = new Date(now.getTime() + 26 * 3_600_000);
    await expect422(
      { shipDay: shipDay(tomorrow, f.vesselA.timeZone), time: "10:00", entries: [{ counterId: f.counters.main.id, value: 1010 }] },
      /^time$/,
      /is in the future/,
    );
  });

  it.each([
    ["two decimals", "1010.25"],
    ["letters", "ten"],
    ["a negative number", "-3"],
  ])("a malformed value: %s", async (_label, value) => {
    await expect422({ ...at(), entries: [{ counterId: f.counters.main.id, value }] }, /^entries\.0\.value$/, /at most one decimal/);
  });

  it("a malformed date and time", async () => {
    await expect422({ shipDay: "2026-02-30", time: "7am", entries: [{ counterId: f.counters.main.id, value: 1 }] }, /^shipDay$/, /ship's day/);
  });

  it("the same counter twice", async () => {
    await expect422(
      { ...at(), entries: [{ counterId: f.counters.main.id, value: 1010 }, { counterId: f.counters.main.id, value: 1011 }] },
      /^entries\.1\.counterId$/,
      /already entered in row 1/,
    );
  });

  it("a body that is not JSON", async () => {
    await expect422("{not json", /^\(body\)$/, /not valid JSON/);
  });

  it("an empty batch", async () => {
    await expect422({ ...at(), entries: [] }, /^entries$/, /at least one reading/);
  });
});

describe("POST /api/vessels/[vesselId]/readings: a valid batch", () => {
  it("is stored exactly once, with who entered it, and the worker refreshes the running rate", async () => {
    const before = await readingCount();
    const batch = { ...at(), entries: [{ counterId: f.counters.main.id, value: "1,020.5" }, { counterId: f.counters.gen.id, value: 512 }] };
    const res = await api<{ saved: number; readAt: string }>(engineer, "POST", path(), batch);
    expect(res.status).toBe(201);
    expect(res.body.saved).toBe(2);
    expect(await readingCount()).toBe(before + 2);

    const [stored] = await testDb()
      .select()
      .from(s.reading)
      .where(and(eq(s.reading.counterId, f.counters.main.id), eq(s.reading.readAt, new Date(res.body.readAt))));
    expect(stored).toMatchObject({ meterValue: 1020.5, totalHours: 1020.5, enteredBy: f.users.engineer.id, segment: 1 });

    // Sending it again is refused: a reading already exists at that instant.
    const again = await api<Problem>(engineer, "POST", path(), batch);
    expect(again.status).toBe(422);
    expect(again.body.errors?.[0]?.message).toMatch(/already a reading/);
    expect(await readingCount()).toBe(before + 2);

    // The worker picks up the recompute job and writes the counter's rate.
    let rateAt: Date | null = null;
    for (let i = 0; i < 40 && !rateAt; i++) {
      const [c] = await testDb().select().from(s.counter).where(eq(s.counter.id, f.counters.main.id));
      rateAt = c?.rateComputedAt ?? null;
      if (!rateAt) await new Promise((r) => setTimeout(r, 500));
    }
    expect(rateAt).not.toBeNull();
  });
});

describe("GET /api/vessels/[vesselId]/readings", () => {
  it("gives a counter's history and daily running hours", async () => {
    const res = await api<ReadingHistory>(engineer, "GET", `${path()}?counterId=${f.counters.main.id}&days=30`);
    expect(res.status).toBe(200);
    expect(res.body.counter.name).toBe("Main engine");
    expect(res.body.readings.length).toBeGreaterThanOrEqual(1);
    expect(res.body.daily.every((d) => d.hours >= 0 && d.hours <= 24)).toBe(true);
  });

  it("answers 422 for a bad query", async () => {
    const res = await api<Problem>(engineer, "GET", `${path()}?counterId=nope&days=0`);
    expect(res.status).toBe(422);
    expect(res.body.errors?.map((e) => e.field)).toEqual(expect.arrayContaining(["query.counterId", "query.days"]));
  });

  it("answers 404 for a counter of another vessel", async () => {
    const res = await api<Problem>(engineer, "GET", `${path()}?counterId=${f.counters.otherVessel.id}`);
    expect(res.status).toBe(404);
  });
});
