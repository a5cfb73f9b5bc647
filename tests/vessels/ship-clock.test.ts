// The ship's clock on passage (issue 14): changes entered by the chief engineer, the vessel's zone
// following them, the worker applying one entered ahead, and a reading across a retarded clock (a
// 25-hour ship's day) accepted. Real PostgreSQL and the running app; figures hand-worked.
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as s from "@/db/schema";
import { shipClock, shipDay } from "@/server/format/hours";
import { applyDueClockChanges } from "@/server/vessels/clock";
import type { ReadingHistory } from "@/server/readings/contract";
import type { ShipClockView } from "@/server/vessels/clock-contract";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { api, type Session, signIn } from "../support/http";

const HOUR = 3_600_000;
let f: Fixture;
let other: Fixture;
let chief: Session;
let engineer: Session;
let otherChief: Session;
let admin: Session;
/** The fixture's reading: 1,000 h on the main engine at L, four days ago (Asia/Singapore, UTC+8). */
let L: Date;

const zoneOf = async (vesselId: string) =>
  (await testDb().select({ z: s.vessel.timeZone }).from(s.vessel).where(eq(s.vessel.id, vesselId)))[0]!.z;

beforeAll(async () => {
  f = await createCompany("ship-clock", new Date(Date.now() - 3 * 24 * HOUR));
  other = await createCompany("ship-clock-other");
  L = f.lastReadAt;
  [chief, engineer, otherChief, admin] = await Promise.all([
    signIn(f.users["chief-engineer"].email, PASSWORD),
    signIn(f.users.engineer.email, PASSWORD),
    signIn(other.users["chief-engineer"].email, PASSWORD),
    signIn(f.users.admin.email, PASSWORD),
  ]);
});
afterAll(closeTestDb);

describe("a change of the ship's clock", () => {
  it("is refused to the engineer (403), on another company's vessel (404), and for a zone that is none (422)", async () => {
    const body = { shipDay: shipDay(L, "Asia/Singapore"), time: "23:00", zone: "UTC+7" };
    expect((await api(engineer, "POST", `/api/vessels/${f.vesselA.id}/clock`, body)).status).toBe(403);
    expect((await api(otherChief, "POST", `/api/vessels/${f.vesselA.id}/clock`, body)).status).toBe(404);
    const bad = await api(chief, "POST", `/api/vessels/${f.vesselA.id}/clock`, { ...body, zone: "Mars/Olympus" });
    expect(bad.status).toBe(422);
    expect(JSON.stringify(bad.body)).toMatch(/zone/);
    const same = await api(chief, "POST", `/api/vessels/${f.vesselA.id}/clock`, { ...body, zone: "Asia/Singapore" });
    expect(same.status).toBe(422);
    expect(JSON.stringify(same.body)).toMatch(/already keeps Asia\/Singapore/);
    expect(await zoneOf(f.vesselA.id)).toBe("Asia/Singapore");
  });

  it("moves the vessel to the new zone from its time: clocks back 1 h, Singapore to UTC+7", async () => {
    // 12 h after the fixture's reading, on the Singapore clock.
    const at = new Date(L.getTime() + 12 * HOUR);
    const res = await api<ShipClockView>(chief, "POST", `/api/vessels/${f.vesselA.id}/clock`, {
      shipDay: shipDay(at, "Asia/Singapore"),
      time: shipClock(at, "Asia/Singapore"),
      zone: "UTC+7",
      note: "Westbound",
    });
    expect(res.status).toBe(201);
    expect(res.body.zone).toBe("Etc/GMT-7");
    expect(res.body.changes[0]).toMatchObject({ move: "Clocks go back 1 h", fromZone: "Asia/Singapore", toZone: "UTC+7", inForce: true });
    expect(await zoneOf(f.vesselA.id)).toBe("Etc/GMT-7");
  });

  it("accepts a reading across the retarded clock: 25 h run in a 25-hour ship's day", async () => {
    // The same ship's time a day after L is 25 h later once the clock went back 1 h: 1,025 h is
    // 25 h in 25 h (SOURCES.md, running-hour facts: at most 24 h in 24 h — here 1 h an hour).
    const next = new Date(L.getTime() + 25 * HOUR);
    const res = await api(chief, "POST", `/api/vessels/${f.vesselA.id}/readings`, {
      shipDay: shipDay(next, "Etc/GMT-7"),
      time: shipClock(next, "Etc/GMT-7"),
      entries: [{ counterId: f.counters.main.id, value: 1025 }],
    });
    expect(res.status).toBe(201);
    expect(shipClock(next, "Etc/GMT-7")).toBe(shipClock(L, "Asia/Singapore"));

    // Each reading is shown on the clock it was read by: both at the same ship's time, a day apart.
    const history = await api<ReadingHistory>(chief, "GET", `/api/vessels/${f.vesselA.id}/readings?counterId=${f.counters.main.id}&days=10`);
    const byValue = new Map(history.body.readings.map((r) => [r.meterValue, r]));
    expect(byValue.get(1000)).toMatchObject({ zone: "Asia/Singapore", shipDay: shipDay(L, "Asia/Singapore") });
    expect(byValue.get(1025)).toMatchObject({ zone: "Etc/GMT-7", shipDay: shipDay(next, "Etc/GMT-7") });
  });

  it("one entered ahead waits, then the worker's step moves the zone when it falls due", async () => {
    const ahead = new Date(Date.now() + 2 * HOUR);
    const res = await api<ShipClockView>(chief, "POST", `/api/vessels/${f.vesselA.id}/clock`, {
      shipDay: shipDay(ahead, "Etc/GMT-7"),
      time: shipClock(ahead, "Etc/GMT-7"),
      zone: "UTC+6",
    });
    expect(res.status).toBe(201);
    expect(res.body.changes[0]).toMatchObject({ inForce: false, toZone: "UTC+6" });
    expect(await zoneOf(f.vesselA.id)).toBe("Etc/GMT-7");
    await applyDueClockChanges(testDb(), new Date(Date.now() + 3 * HOUR));
    expect(await zoneOf(f.vesselA.id)).toBe("Etc/GMT-6");
  });

  it("a zone the administrator sets under Company → Vessels is kept: the worker's step follows the history", async () => {
    // Bravo keeps UTC; a change to UTC+1 an hour ago, then the administrator sets Europe/Oslo.
    const hourAgo = new Date(Date.now() - HOUR);
    const change = await api(admin, "POST", `/api/vessels/${f.vesselB.id}/clock`, {
      shipDay: shipDay(hourAgo, "UTC"),
      time: shipClock(hourAgo, "UTC"),
      zone: "UTC+1",
    });
    expect(change.status).toBe(201);
    expect((await api(admin, "PATCH", `/api/admin/vessels/${f.vesselB.id}`, { timeZone: "Europe/Oslo" })).status).toBe(200);
    await applyDueClockChanges(testDb(), new Date(Date.now() + HOUR));
    expect(await zoneOf(f.vesselB.id)).toBe("Europe/Oslo");
  });
});
