// Correcting and removing a mistyped reading, against the running stack. The 24-hours-in-24-hours
// limit the neighbours are checked with is SOURCES.md, "Running-hour facts" (physical limit); the
// figures below are hand-worked.
import { randomUUID } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as s from "@/db/schema";
import type { Problem } from "@/server/http/problem";
import type { ReadingCorrectionResult, ReadingHistory } from "@/server/readings/contract";
import { round1 } from "@/server/readings/rules";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { api, type Session, signIn } from "../support/http";

const HOUR = 3_600_000;
const DAY = 24 * HOUR;

let f: Fixture;
let other: Fixture;
let engineer: Session;
let chief: Session;
let viewer: Session;
let superintendent: Session;
let otherEngineer: Session;
/** The instant of the fixture's reading, 24 h ago, on the minute. */
let L: Date;

type Row = typeof s.reading.$inferSelect;
const ids: Record<string, string> = {};

const url = (readingId: string, vesselId = f.vesselA.id) => `/api/vessels/${vesselId}/readings/${readingId}`;

async function addReading(
  counterId: string,
  readAt: Date,
  meterValue: number,
  segment = 1,
  offset = 0,
  vesselId = f.vesselA.id,
) {
  const [row] = await testDb()
    .insert(s.reading)
    .values({
      companyId: f.companyId,
      vesselId,
      counterId,
      readAt,
      segment,
      meterValue,
      totalHours: round1(meterValue + offset),
    })
    .returning();
  return row!.id;
}

async function readingById(id: string): Promise<Row | undefined> {
  const [row] = await testDb().select().from(s.reading).where(eq(s.reading.id, id));
  return row;
}

async function auditRows(counterId: string) {
  return testDb().select().from(s.readingCorrection).where(eq(s.readingCorrection.counterId, counterId));
}

async function fixtureReading(counterId: string): Promise<string> {
  const [row] = await testDb()
    .select({ id: s.reading.id })
    .from(s.reading)
    .where(and(eq(s.reading.counterId, counterId), eq(s.reading.readAt, L)));
  return row!.id;
}

beforeAll(async () => {
  const now = new Date();
  f = await createCompany("corrections", now);
  other = await createCompany("corrections-other", now);
  L = f.lastReadAt;
  [engineer, chief, viewer, superintendent, otherEngineer] = await Promise.all([
    signIn(f.users.engineer.email, PASSWORD),
    signIn(f.users["chief-engineer"].email, PASSWORD),
    signIn(f.users.viewer.email, PASSWORD),
    signIn(f.users.superintendent.email, PASSWORD),
    signIn(other.users.engineer.email, PASSWORD),
  ]);

  // Main engine: 900 h nine days before today's reading, 1,000 h (the fixture's) yesterday, and
  // today 1,020 h — mistyped for 1,012 h. Rate with the typo (1,020 − 900) / 9 = 13.3 h/day.
  ids.mainOld = await addReading(f.counters.main.id, new Date(L.getTime() - 8 * DAY), 900);
  ids.mainL = await fixtureReading(f.counters.main.id);
  ids.mainToday = await addReading(f.counters.main.id, new Date(L.getTime() + DAY), 1020);

  // Generator 1: each step runs 24.1 h in 24 h 4 min (inside the tenth's rounding allowance), so
  // without the middle one the last would run 48.2 h in 48 h 8 min — more than the allowance.
  const step = DAY + 4 * 60_000;
  ids.genFirst = await addReading(f.counters.gen.id, new Date(L.getTime() - 2 * step), 451.8);
  ids.genMiddle = await addReading(f.counters.gen.id, new Date(L.getTime() - step), 475.9);
  ids.genLast = await fixtureReading(f.counters.gen.id);

  // Boiler feed pump: meter 1 read 3,000 h at its replacement five days ago; meter 2 started at
  // 0 h with an offset of 3,000 h and showed 50 h two days later and 70 h yesterday.
  const db = testDb();
  const [boiler] = await db
    .insert(s.counter)
    .values({
      companyId: f.companyId,
      vesselId: f.vesselA.id,
      name: "Boiler feed pump",
      sortOrder: 2,
      currentSegment: 2,
    })
    .returning();
  ids.boiler = boiler!.id;
  const replacedAt = new Date(L.getTime() - 4 * DAY);
  await db.insert(s.counterSegment).values([
    {
      companyId: f.companyId,
      counterId: boiler!.id,
      segment: 1,
      startedAt: new Date(L.getTime() - 40 * DAY),
      startMeter: 2800,
      offsetHours: 0,
    },
    {
      companyId: f.companyId,
      counterId: boiler!.id,
      segment: 2,
      startedAt: replacedAt,
      startMeter: 0,
      offsetHours: 3000,
    },
  ]);
  ids.boilerOldMeter = await addReading(boiler!.id, replacedAt, 3000, 1, 0);
  ids.boilerNew = await addReading(boiler!.id, new Date(L.getTime() - 2 * DAY), 50, 2, 3000);
  ids.boilerLatest = await addReading(boiler!.id, L, 70, 2, 3000);

  ids.vesselB = await addReading(f.counters.otherVessel.id, L, 10, 1, 0, f.vesselB.id);
});
afterAll(closeTestDb);

describe("PATCH /api/vessels/[vesselId]/readings/[readingId]: a correction", () => {
  it("stores the new value with its audit row, and the worker's rate follows it", async () => {
    const res = await api<ReadingCorrectionResult>(engineer, "PATCH", url(ids.mainToday!), {
      value: "1,012",
      remark: "Re-read at the meter",
      reason: "Typed 1,020 for 1,012",
    });
    expect(res.status).toBe(200);
    expect(res.body.reading).toMatchObject({ meterValue: 1012, totalHours: 1012, remark: "Re-read at the meter" });

    expect(await readingById(ids.mainToday!)).toMatchObject({
      meterValue: 1012,
      totalHours: 1012,
      remark: "Re-read at the meter",
    });
    const audit = await auditRows(f.counters.main.id);
    expect(audit).toHaveLength(1);
    expect(audit[0]).toMatchObject({
      companyId: f.companyId,
      vesselId: f.vesselA.id,
      readingId: ids.mainToday,
      kind: "corrected",
      oldMeterValue: 1020,
      newMeterValue: 1012,
      oldRemark: null,
      newRemark: "Re-read at the meter",
      reason: "Typed 1,020 for 1,012",
      correctedBy: f.users.engineer.id,
      segment: 1,
    });

    // The recompute the route asked for: (1,012 − 900) / 9 days = 12.44 h/day (13.33 with the typo),
    // kept at full precision.
    const expected = (1012 - 900) / 9;
    const near = (r: number | null) => r !== null && Math.abs(r - expected) < 1e-6;
    let rate: number | null = null;
    for (let i = 0; i < 40 && !near(rate); i++) {
      const [c] = await testDb().select().from(s.counter).where(eq(s.counter.id, f.counters.main.id));
      rate = c?.runningRate ?? null;
      if (!near(rate)) await new Promise((r) => setTimeout(r, 500));
    }
    expect(rate).toBeCloseTo(expected, 6);
  });

  it("shows in the counter's history: the reading's audit trail", async () => {
    const res = await api<ReadingHistory>(
      engineer,
      "GET",
      `/api/vessels/${f.vesselA.id}/readings?counterId=${f.counters.main.id}&days=30`,
    );
    expect(res.status).toBe(200);
    const today = res.body.readings.find((r) => r.id === ids.mainToday);
    expect(today?.meterValue).toBe(1012);
    expect(today?.corrections).toEqual([
      expect.objectContaining({
        kind: "corrected",
        oldMeterValue: 1020,
        newMeterValue: 1012,
        reason: "Typed 1,020 for 1,012",
      }),
    ]);
    expect(today?.corrections[0]?.by).toMatch(/^engineer /);
    expect(res.body.readings.find((r) => r.id === ids.mainL)?.corrections).toEqual([]);
  });

  it("is checked against its neighbours, leaving itself out: 1,012 → 1,011 is fine for the chief engineer", async () => {
    const res = await api<ReadingCorrectionResult>(chief, "PATCH", url(ids.mainToday!), {
      value: 1011,
      reason: "Second look at the meter",
    });
    expect(res.status).toBe(200);
    expect((await readingById(ids.mainToday!))?.meterValue).toBe(1011);
    expect((await readingById(ids.mainToday!))?.remark).toBe("Re-read at the meter"); // no remark sent: kept
    expect(await auditRows(f.counters.main.id)).toHaveLength(2);
  });

  it("keeps total_hours = meter + the meter's offset on a replaced counter: 50 → 40 on meter 2 is 3,040 h", async () => {
    const res = await api<ReadingCorrectionResult>(engineer, "PATCH", url(ids.boilerNew!), {
      value: 40,
      reason: "Read the wrong dial",
    });
    expect(res.status).toBe(200);
    expect(await readingById(ids.boilerNew!)).toMatchObject({ meterValue: 40, totalHours: 3040, segment: 2 });
    expect((await auditRows(ids.boiler!))[0]).toMatchObject({ segment: 2, oldMeterValue: 50, newMeterValue: 40 });
  });
});

describe("refused corrections get 422 naming the field and write nothing", () => {
  async function expect422(
    session: Session,
    method: string,
    readingId: string,
    body: unknown,
    field: string,
    message: RegExp,
  ) {
    const before = await readingById(readingId);
    const counterId = before!.counterId;
    const auditBefore = (await auditRows(counterId)).length;
    const res = await api<Problem>(session, method, url(readingId), body);
    expect(res.status).toBe(422);
    expect(res.contentType).toContain("application/problem+json");
    expect(res.body.errors?.map((e) => e.field)).toEqual([field]);
    expect(res.body.errors?.[0]?.message).toMatch(message);
    expect(await readingById(readingId)).toEqual(before);
    expect(await auditRows(counterId)).toHaveLength(auditBefore);
  }

  it("a value below the previous reading (900 h)", async () => {
    await expect422(
      engineer,
      "PATCH",
      ids.mainL!,
      { value: 899, reason: "Typed the wrong number" },
      "value",
      /lower than the previous one \(900 h on /,
    );
  });

  it("a value above the next reading (1,011 h)", async () => {
    await expect422(
      engineer,
      "PATCH",
      ids.mainL!,
      { value: 1013, reason: "Typed the wrong number" },
      "value",
      /higher than the next one \(1,011 h on /,
    );
  });

  it("a value the reading already has", async () => {
    await expect422(
      engineer,
      "PATCH",
      ids.mainL!,
      { value: 1000, reason: "Typed the wrong number" },
      "value",
      /nothing to correct/,
    );
  });

  it("a malformed value", async () => {
    await expect422(
      engineer,
      "PATCH",
      ids.mainL!,
      { value: "10.05", reason: "Typed the wrong number" },
      "value",
      /at most one decimal/,
    );
  });

  it.each([
    ["missing", undefined],
    ["too short", "typo"],
  ])("a reason that is %s, on a correction and on a removal", async (_label, reason) => {
    await expect422(engineer, "PATCH", ids.mainL!, { value: 1001, reason }, "reason", /Say why/);
    await expect422(engineer, "DELETE", ids.genLast!, { reason }, "reason", /Say why/);
  });

  it("a reading of a meter since replaced, for a correction and for a removal", async () => {
    const replaced = /belongs to meter 1 of Boiler feed pump, which has since been replaced/;
    await expect422(
      engineer,
      "PATCH",
      ids.boilerOldMeter!,
      { value: 2999, reason: "Old meter misread" },
      "reading",
      replaced,
    );
    await expect422(engineer, "DELETE", ids.boilerOldMeter!, { reason: "Old meter misread" }, "reading", replaced);
  });

  it("a removal after which the next reading would run more hours than elapsed, naming both", async () => {
    await expect422(
      engineer,
      "DELETE",
      ids.genMiddle!,
      { reason: "Entered twice by mistake" },
      "reading",
      /next one \(500 h on .+\) would advance 48\.2 h in only 48\.1 h since the one before it \(451\.8 h on /,
    );
  });
});

describe("DELETE /api/vessels/[vesselId]/readings/[readingId]: a removal", () => {
  it("deletes the reading; the audit row keeps counter, instant and value", async () => {
    const res = await api<ReadingCorrectionResult>(engineer, "DELETE", url(ids.genLast!), {
      reason: "Belongs to generator 2",
    });
    expect(res.status).toBe(200);
    expect(res.body.reading).toBeNull();
    expect(await readingById(ids.genLast!)).toBeUndefined();
    const audit = await auditRows(f.counters.gen.id);
    expect(audit).toEqual([
      expect.objectContaining({
        readingId: null,
        counterId: f.counters.gen.id,
        readAt: L,
        kind: "removed",
        oldMeterValue: 500,
        newMeterValue: null,
        reason: "Belongs to generator 2",
        correctedBy: f.users.engineer.id,
      }),
    ]);

    const history = await api<ReadingHistory>(
      engineer,
      "GET",
      `/api/vessels/${f.vesselA.id}/readings?counterId=${f.counters.gen.id}&days=30`,
    );
    expect(history.body.readings.map((r) => r.meterValue)).toEqual([451.8, 475.9]);
    expect(history.body.removals).toEqual([
      expect.objectContaining({ oldMeterValue: 500, reason: "Belongs to generator 2" }),
    ]);
  });

  it("a second removal of the same reading is 404", async () => {
    const res = await api<Problem>(engineer, "DELETE", url(ids.genLast!), { reason: "Belongs to generator 2" });
    expect(res.status).toBe(404);
  });
});

describe("who may correct", () => {
  it.each([
    ["viewer", () => viewer],
    ["superintendent", () => superintendent],
  ])("the %s gets 403 and nothing changes", async (_role, session) => {
    const patch = await api<Problem>(session(), "PATCH", url(ids.boilerLatest!), {
      value: 71,
      reason: "Not my job to change",
    });
    const del = await api<Problem>(session(), "DELETE", url(ids.boilerLatest!), { reason: "Not my job to change" });
    expect([patch.status, del.status]).toEqual([403, 403]);
    expect((await readingById(ids.boilerLatest!))?.meterValue).toBe(70);
  });

  it("anonymous gets 401", async () => {
    const patch = await api<Problem>(null, "PATCH", url(ids.boilerLatest!), { value: 71, reason: "No session at all" });
    const del = await api<Problem>(null, "DELETE", url(ids.boilerLatest!), { reason: "No session at all" });
    expect([patch.status, del.status]).toEqual([401, 401]);
  });
});

describe("isolation: a reading outside what the user may open is 404", () => {
  const cases: [string, () => [Session, string]][] = [
    [
      "another company's engineer, through their own vessel",
      () => [otherEngineer, url(ids.boilerLatest!, other.vesselA.id)],
    ],
    ["another company's engineer, through this vessel", () => [otherEngineer, url(ids.boilerLatest!)]],
    ["a reading of another vessel of the company", () => [engineer, url(ids.vesselB!)]],
    ["the same, through that vessel (not assigned to the engineer)", () => [engineer, url(ids.vesselB!, f.vesselB.id)]],
    ["an unknown reading id", () => [engineer, url(randomUUID())]],
    ["a malformed reading id", () => [engineer, url("not-a-uuid")]],
  ];
  it.each(cases)("%s", async (_label, target) => {
    const [session, path] = target();
    const patch = await api<Problem>(session, "PATCH", path, { value: 71, reason: "Trying someone else's" });
    const del = await api<Problem>(session, "DELETE", path, { reason: "Trying someone else's" });
    expect([patch.status, del.status]).toEqual([404, 404]);
    expect((await readingById(ids.boilerLatest!))?.meterValue).toBe(70);
    expect((await readingById(ids.vesselB!))?.meterValue).toBe(10);
  });
});
