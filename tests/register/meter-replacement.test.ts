// A new hour meter on a counter: a new segment whose offset keeps the counter's total continuous,
// checked end to end with a reading entered on the Hour log afterwards.
import { and, asc, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as s from "@/db/schema";
import { shipClock, shipDay } from "@/server/format/hours";
import type { Problem } from "@/server/http/problem";
import type { MeterReplacementResult, RegisterView } from "@/server/register/contract";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { api, type Session, signIn } from "../support/http";
import { counterById, registerRows } from "./register-fixture";

let f: Fixture;
let chief: Session;
let engineer: Session;
let now: Date;
const HOUR = 3_600_000;
const replacements = (counterId: string) => `/api/vessels/${f.vesselA.id}/counters/${counterId}/replacements`;
const shipTime = (instant: Date) => ({
  shipDay: shipDay(instant, f.vesselA.timeZone),
  time: shipClock(instant, f.vesselA.timeZone),
});

beforeAll(async () => {
  now = new Date(Math.floor(Date.now() / 60_000) * 60_000);
  f = await createCompany("meter-replacement", now);
  chief = await signIn(f.users["chief-engineer"].email, PASSWORD);
  engineer = await signIn(f.users.engineer.email, PASSWORD);
});
afterAll(closeTestDb);

async function readingsOf(counterId: string) {
  return testDb().select().from(s.reading).where(eq(s.reading.counterId, counterId)).orderBy(asc(s.reading.readAt));
}

describe("bad replacements are 422 on the field, and change nothing", () => {
  // The fixture's Main engine was last read 24 h ago at 1,000 h.
  const twelveHoursAgo = () => shipTime(new Date(now.getTime() - 12 * HOUR));

  it.each([
    [
      "no reason",
      () => ({ replacedAt: twelveHoursAgo(), oldMeterFinal: 1005, reason: " " }),
      "reason",
      /Enter the reason/,
    ],
    ["no time", () => ({ oldMeterFinal: 1005, reason: "Meter failed" }), "replacedAt", /ship’s day and time/],
    [
      "a time that is not HH:MM",
      () => ({ replacedAt: { shipDay: "2026-03-01", time: "9am" }, reason: "x" }),
      "replacedAt.time",
      /HH:MM/,
    ],
    [
      "a time in the future",
      () => ({ replacedAt: shipTime(new Date(now.getTime() + 48 * HOUR)), reason: "Meter failed" }),
      "replacedAt.time",
      /is in the future/,
    ],
    [
      "a time before the old meter's last reading",
      () => ({ replacedAt: shipTime(new Date(now.getTime() - 30 * HOUR)), reason: "Meter failed" }),
      "replacedAt.time",
      /old meter was still read at .* \(1,000 h\)/,
    ],
    [
      "a final value below the last reading",
      () => ({ replacedAt: twelveHoursAgo(), oldMeterFinal: 999, reason: "Meter failed" }),
      "oldMeterFinal",
      /Final value on the old meter: reading is lower than the previous one \(1,000 h on /,
    ],
    [
      "a final value that ran more hours than passed (20 h in 12 h)",
      () => ({ replacedAt: twelveHoursAgo(), oldMeterFinal: 1020, reason: "Meter failed" }),
      "oldMeterFinal",
      /advances 20 h but only 12 h passed/,
    ],
    [
      "a final value with two decimals",
      () => ({ replacedAt: twelveHoursAgo(), oldMeterFinal: "1005.25", reason: "Meter failed" }),
      "oldMeterFinal",
      /Final value on the old meter: .*at most one decimal/,
    ],
    [
      "a new meter value that is not a number",
      () => ({ replacedAt: twelveHoursAgo(), newMeterStart: "new", reason: "Meter failed" }),
      "newMeterStart",
      /Value shown by the new meter/,
    ],
  ])("%s", async (_label, body, field, message) => {
    const before = await registerRows(f.companyId);
    const res = await api<Problem>(chief, "POST", replacements(f.counters.main.id), body());
    expect(res.status, JSON.stringify(res.body)).toBe(422);
    expect(res.body.errors?.find((e) => e.field === field)?.message, JSON.stringify(res.body.errors)).toMatch(message);
    expect(await registerRows(f.companyId)).toEqual(before);
    expect((await counterById(f.counters.main.id))?.currentSegment).toBe(1);
  });
});

describe("a replacement with the old meter's final value", () => {
  it("stores the final reading, starts segment 2, and the next reading's total carries on", async () => {
    const replacedAt = new Date(now.getTime() - 12 * HOUR);
    const res = await api<MeterReplacementResult>(chief, "POST", replacements(f.counters.main.id), {
      replacedAt: shipTime(replacedAt),
      oldMeterFinal: "1,010",
      reason: "Meter display failed; new meter fitted",
    });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    // Worked example: total at replacement 1,010 h, new meter shows 0 h → offset 1,010 h.
    expect(res.body).toMatchObject({ segment: 2, startMeter: 0, offsetHours: 1010, finalReadingStored: true });
    expect((await counterById(f.counters.main.id))?.currentSegment).toBe(2);

    const [segment] = await testDb()
      .select()
      .from(s.counterSegment)
      .where(and(eq(s.counterSegment.counterId, f.counters.main.id), eq(s.counterSegment.segment, 2)));
    expect(segment).toMatchObject({
      startedAt: replacedAt,
      startMeter: 0,
      offsetHours: 1010,
      createdBy: f.users["chief-engineer"].id,
    });

    // The second engineer logs the new meter at 5 h, 12 h after the change: total 1,015 h.
    const reading = await api(engineer, "POST", `/api/vessels/${f.vesselA.id}/readings`, {
      ...shipTime(now),
      entries: [{ counterId: f.counters.main.id, value: 5 }],
    });
    expect(reading.status, JSON.stringify(reading.body)).toBe(201);
    const rows = await readingsOf(f.counters.main.id);
    expect(rows.map((r) => [r.segment, r.meterValue, r.totalHours])).toEqual([
      [1, 1000, 1000],
      [1, 1010, 1010],
      [2, 5, 1015],
    ]);

    const view = await api<RegisterView>(chief, "GET", `/api/vessels/${f.vesselA.id}/register`);
    const main = view.body.counters.find((c) => c.id === f.counters.main.id);
    expect(main).toMatchObject({
      segment: 2,
      segmentStartedAt: replacedAt.toISOString(),
      last: { meterValue: 5, totalHours: 1015 },
    });
  });

  it("a reading of the new meter is checked against its start, not the old meter", async () => {
    // The new meter was fitted at 0 h twelve hours ago: 7 h six hours later is more than it can have run.
    const res = await api<Problem>(engineer, "POST", `/api/vessels/${f.vesselA.id}/readings`, {
      ...shipTime(new Date(now.getTime() - 6 * HOUR)),
      entries: [{ counterId: f.counters.main.id, value: 7 }],
    });
    expect(res.status).toBe(422);
    expect(res.body.errors?.[0]?.message).toMatch(/advances 7 h but only 6 h passed/);
  });
});

describe("a replacement without a final value, onto a meter that does not start at 0", () => {
  it("carries the last total on: offset = 500 − 250", async () => {
    const res = await api<MeterReplacementResult>(chief, "POST", replacements(f.counters.gen.id), {
      replacedAt: shipTime(new Date(now.getTime() - 2 * HOUR)),
      oldMeterFinal: "",
      newMeterStart: "250",
      reason: "Second-hand meter from the spares",
    });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body).toMatchObject({ segment: 2, startMeter: 250, offsetHours: 250, finalReadingStored: false });

    const reading = await api(engineer, "POST", `/api/vessels/${f.vesselA.id}/readings`, {
      ...shipTime(now),
      entries: [{ counterId: f.counters.gen.id, value: "251.5" }],
    });
    expect(reading.status, JSON.stringify(reading.body)).toBe(201);
    const last = (await readingsOf(f.counters.gen.id)).at(-1);
    expect(last).toMatchObject({ segment: 2, meterValue: 251.5, totalHours: 501.5 });
  });
});

describe("a replacement at the very instant of the old meter's last reading", () => {
  // After the first test, Main engine's meter 2 shows 5 h at `now` (total 1,015 h).
  it("refuses a different final value: that instant already has its reading", async () => {
    const before = await registerRows(f.companyId);
    const res = await api<Problem>(chief, "POST", replacements(f.counters.main.id), {
      replacedAt: shipTime(now),
      oldMeterFinal: 6,
      reason: "Meter renewed",
    });
    expect(res.status).toBe(422);
    expect(res.body.errors?.[0]).toMatchObject({ field: "oldMeterFinal" });
    expect(res.body.errors?.[0]?.message).toMatch(/there is already a reading at .* \(5 h\)/);
    expect(await registerRows(f.companyId)).toEqual(before);
  });

  it("takes that reading as the final value: nothing new stored, the total carries on from it", async () => {
    const before = await registerRows(f.companyId);
    const res = await api<MeterReplacementResult>(chief, "POST", replacements(f.counters.main.id), {
      replacedAt: shipTime(now),
      oldMeterFinal: 5,
      reason: "Meter renewed",
    });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body).toMatchObject({ segment: 3, offsetHours: 1015, finalReadingStored: false });
    expect(await registerRows(f.companyId)).toEqual({ ...before, segments: before.segments + 1 });
  });
});
