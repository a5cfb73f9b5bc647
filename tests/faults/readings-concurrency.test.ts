// Readings sent at the same moment through HTTP, as fifty tablets on a bad link retrying would:
// the same batch fifty times stores one copy, and fifty batches of one counter at increasing times
// leave a series that still obeys the reading rules (server/readings/rules.ts), each acknowledged
// batch stored exactly once.
//
// What the code answers for a copy: 422 on `entries.0.value`, "There is already a reading at …",
// from the domain's own check (saveReadingBatch locks the batch's counters, so the copies are
// checked one after another and each sees the first one's row). The unique constraint
// `reading_counterId_readAt_unique` would give a 409 only to a writer that skipped the lock; none
// should reach it, and the test says so if one does.
import { and, asc, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as s from "@/db/schema";
import { shipClock, shipDay } from "@/server/format/hours";
import type { Problem } from "@/server/http/problem";
import type { ReadingBatchResult } from "@/server/readings/contract";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { api, type ApiResult, type Session, signIn } from "../support/http";

const COPIES = 50;
const MINUTE = 60_000;

let f: Fixture;
let engineer: Session;
const path = () => `/api/vessels/${f.vesselA.id}/readings`;
const at = (instant: Date) => ({ shipDay: shipDay(instant, f.vesselA.timeZone), time: shipClock(instant, f.vesselA.timeZone) });

async function readingsOf(counterId: string) {
  return testDb()
    .select({ readAt: s.reading.readAt, meterValue: s.reading.meterValue })
    .from(s.reading)
    .where(and(eq(s.reading.companyId, f.companyId), eq(s.reading.counterId, counterId)))
    .orderBy(asc(s.reading.readAt));
}

/** All requests leave before any answer is read: the server sees them together. */
function together<T>(bodies: unknown[]): Promise<ApiResult<T | Problem>[]> {
  return Promise.all(bodies.map((body) => api<T | Problem>(engineer, "POST", path(), body)));
}

beforeAll(async () => {
  f = await createCompany("faults-readings");
  engineer = await signIn(f.users.engineer.email, PASSWORD);
});
afterAll(closeTestDb);

describe("the same readings batch sent fifty times at once", () => {
  it("stores it once; the other 49 get a 422 saying a reading is already there", async () => {
    // Two hours after the fixture's reading of 24 h ago: 1 h run on the main engine, 2 h on the generator.
    const readAt = new Date(f.lastReadAt.getTime() + 120 * MINUTE);
    const batch = {
      ...at(readAt),
      entries: [
        { counterId: f.counters.main.id, value: 1001 },
        { counterId: f.counters.gen.id, value: 502 },
      ],
    };
    const answers = await together<ReadingBatchResult>(Array.from({ length: COPIES }, () => batch));

    const stored = answers.filter((a) => a.status === 201);
    const refused = answers.filter((a) => a.status !== 201);
    expect(stored).toHaveLength(1);
    expect((stored[0]!.body as ReadingBatchResult).saved).toBe(2);
    // 409 would mean a copy got past the counters' lock to the unique constraint.
    expect(refused.map((a) => a.status)).toEqual(Array.from({ length: COPIES - 1 }, () => 422));
    for (const answer of refused) {
      expect(answer.contentType).toContain("application/problem+json");
      const problem = answer.body as Problem;
      // The first row refused names its counter and the reading already there; the whole batch is refused.
      expect(problem.errors?.[0]).toMatchObject({ field: "entries.0.value", row: 0 });
      expect(problem.errors?.[0]?.message).toMatch(/^Main engine: There is already a reading at .+ \(1,001 h\)\.$/);
    }

    for (const [counterId, value] of [
      [f.counters.main.id, 1001],
      [f.counters.gen.id, 502],
    ] as const) {
      const rows = (await readingsOf(counterId)).filter((r) => r.readAt.getTime() === readAt.getTime());
      expect(rows).toEqual([{ readAt, meterValue: value }]);
    }
  }, 60_000);
});

describe("fifty batches of one counter at increasing times, sent at once", () => {
  it("stores every acknowledged batch exactly once, and the series never goes back nor outruns the clock", async () => {
    // The generator, from 502 h at +2 h (above): one batch every 10 minutes, 0.1 h more each time
    // (an engine can add at most 10 min = 0.17 h in 10 min: SOURCES.md "Running-hour facts").
    const start = f.lastReadAt.getTime() + 120 * MINUTE;
    const batches = Array.from({ length: COPIES }, (_, i) => {
      const readAt = new Date(start + (i + 1) * 10 * MINUTE);
      const value = Math.round((502 + (i + 1) * 0.1) * 10) / 10;
      return { readAt, value, body: { ...at(readAt), entries: [{ counterId: f.counters.gen.id, value }] } };
    });
    // Shuffled, so back-filled days (a later reading stored first) are checked too.
    const order = batches.map((_, i) => i).sort(() => Math.random() - 0.5);
    const answers = await together<ReadingBatchResult>(order.map((i) => batches[i]!.body));

    const acknowledged = new Set<number>();
    const refused: string[] = [];
    answers.forEach((answer, n) => {
      const batch = batches[order[n]!]!;
      if (answer.status === 201) acknowledged.add(batch.readAt.getTime());
      else refused.push(`${batch.body.shipDay} ${batch.body.time} ${batch.value} h: ${answer.status} ${JSON.stringify(answer.body)}`);
    });
    // Every batch fits the series whichever order they are stored in, so none may be refused.
    expect(refused, "refused batches").toEqual([]);

    const series = (await readingsOf(f.counters.gen.id)).filter((r) => r.readAt.getTime() > start);
    const times = series.map((r) => r.readAt.getTime());
    expect(new Set(times).size).toBe(times.length);
    expect(new Set(times)).toEqual(acknowledged);
    for (const batch of batches) {
      expect(series.find((r) => r.readAt.getTime() === batch.readAt.getTime())?.meterValue).toBe(batch.value);
    }

    // The whole stored series of the counter, fixture's reading included, obeys the rules pairwise.
    const all = await readingsOf(f.counters.gen.id);
    for (let i = 1; i < all.length; i++) {
      const [prev, next] = [all[i - 1]!, all[i]!];
      const elapsedHours = (next.readAt.getTime() - prev.readAt.getTime()) / 3_600_000;
      expect(next.meterValue).toBeGreaterThanOrEqual(prev.meterValue);
      expect(next.meterValue - prev.meterValue).toBeLessThanOrEqual(elapsedHours + 0.05);
    }
  }, 60_000);
});
