// The reminder run against the real database: which messages it queues in the outbox, to whom,
// and that a rerun queues nothing again. The scenario is set in March 2031 so that the worker's
// own runs (on the real clock) find nothing of it due: its readings and state changes lie in
// the future for them.
import { and, eq, inArray, like, or } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as s from "@/db/schema";
import { runReminders } from "@/server/reminders/run";
import { askTheWorkerToSend, waitFor } from "../mail/mail-fake";
import { closeTestDb, createCompany, type Fixture, testDb } from "../support/fixtures";

// Wed 5 Mar 2031 06:30 in Singapore (vessel A's zone, UTC+8): 30 minutes after the digest hour.
const NOW = new Date("2031-03-04T22:30:00Z");
const h = (hours: number, from: Date) => new Date(from.getTime() + hours * 3_600_000);

let f: Fixture;
let other: Fixture;
const wo: Record<string, typeof s.workOrder.$inferSelect> = {};
const changeIds: Record<string, string> = {};

async function outbox(companyId: string, kind: (typeof s.mailKind.enumValues)[number]) {
  return testDb()
    .select()
    .from(s.mailOutbox)
    .where(and(eq(s.mailOutbox.companyId, companyId), eq(s.mailOutbox.kind, kind)));
}

async function insertWorkOrders(
  fx: Fixture,
  rows: {
    key: string;
    state: (typeof s.workOrderState.enumValues)[number];
    due: string | null;
    change?: [string, string];
  }[],
) {
  const db = testDb();
  const [component] = await db
    .insert(s.component)
    .values({
      companyId: fx.companyId,
      vesselId: fx.vesselA.id,
      code: "ME",
      name: "Main engine",
      counterId: fx.counters.main.id,
    })
    .returning();
  for (const [i, r] of rows.entries()) {
    const [row] = await db
      .insert(s.workOrder)
      .values({
        companyId: fx.companyId,
        vesselId: fx.vesselA.id,
        componentId: component!.id,
        number: `WO-ALPHA-${String(i + 1).padStart(5, "0")}`,
        occurrence: 1,
        title: `Job ${r.key}`,
        state: r.state,
        dueDate: r.due ? new Date(r.due) : null,
      })
      .returning();
    wo[`${fx.companyId}:${r.key}`] = row!;
    if (r.change) {
      const [sc] = await db
        .insert(s.workOrderStateChange)
        .values({
          companyId: fx.companyId,
          workOrderId: row!.id,
          fromState: "scheduled",
          toState: r.change[0] as (typeof s.workOrderState.enumValues)[number],
          changedAt: new Date(r.change[1]),
        })
        .returning();
      changeIds[`${fx.companyId}:${r.key}`] = sc!.id;
    }
  }
}

beforeAll(async () => {
  [f, other] = await Promise.all([createCompany("reminders", NOW), createCompany("reminders-other", NOW)]);
  // The digest of Wed 5 Mar (vessel A, Asia/Singapore, digest hour 6):
  //   window: after Tue 4 Mar 06:00 SGT (3 Mar 22:00 UTC) up to Wed 5 Mar 06:00 SGT (4 Mar 22:00 UTC);
  //   due: ship's days 5–11 Mar, i.e. 4 Mar 16:00 UTC to 11 Mar 15:59:59.999 UTC.
  const rows = [
    {
      key: "w1",
      state: "out-of-tolerance",
      due: "2031-01-31T15:59:59.999Z",
      change: ["out-of-tolerance", "2031-03-04T10:00:00Z"],
    }, // in the window → listed, escalated
    { key: "w2", state: "late", due: "2031-03-01T15:59:59.999Z", change: ["late", "2031-03-03T21:59:00Z"] }, // before the window (yesterday's digest), due in the past
    {
      key: "w3",
      state: "window-open",
      due: "2031-03-07T15:59:59.999Z",
      change: ["window-open", "2031-03-04T22:00:00Z"],
    }, // exactly at the cut-off → listed once
    { key: "w4", state: "scheduled", due: "2031-03-11T15:59:59.999Z" }, // the end of 11 Mar SGT → due in 7 days
    { key: "w5", state: "scheduled", due: "2031-03-11T16:00:00.000Z" }, // 00:00 on 12 Mar SGT → outside
    { key: "w6", state: "done", due: "2031-03-06T15:59:59.999Z", change: ["window-open", "2031-03-04T08:00:00Z"] }, // done since
    { key: "w7", state: "window-open", due: null, change: ["window-open", "2031-03-04T22:10:00Z"] }, // after the cut-off: tomorrow's
    {
      key: "w8",
      state: "out-of-tolerance",
      due: "2031-01-10T15:59:59.999Z",
      change: ["out-of-tolerance", "2031-02-20T00:00:00Z"],
    }, // 13 days old: marked, not sent
  ] as const;
  await insertWorkOrders(
    f,
    rows.map((r) => ({ ...r, change: "change" in r ? [...r.change] : undefined })),
  );
  // The other company: one job due in 7 days; its chief opted out of digests, its engineer is disabled.
  await insertWorkOrders(other, [
    {
      key: "o1",
      state: "out-of-tolerance",
      due: "2031-03-06T15:59:59.999Z",
      change: ["out-of-tolerance", "2031-03-04T12:00:00Z"],
    },
  ]);
  await testDb()
    .insert(s.mailOptOut)
    .values({ companyId: other.companyId, userId: other.users["chief-engineer"].id, kind: "due-digest" });
  await testDb().update(s.user).set({ banned: true }).where(eq(s.user.id, other.users.engineer.id));
});

afterAll(async () => {
  await closeTestDb();
});

describe("the due digest", () => {
  it("holds exactly the hand-worked work orders, for the vessel's engineer and chief", async () => {
    const counts = await runReminders(testDb(), NOW, { companyIds: [f.companyId, other.companyId] });
    expect(counts.companies).toBe(2);
    const rows = await outbox(f.companyId, "due-digest");
    expect(rows.map((r) => r.toAddress).sort()).toEqual(
      [f.users["chief-engineer"].email, f.users.engineer.email].sort(),
    );
    expect(rows.map((r) => r.dedupeKey).sort()).toEqual(
      [f.users["chief-engineer"].id, f.users.engineer.id]
        .map((u) => `due-digest:${f.vesselA.id}:2031-03-05:${u}`)
        .sort(),
    );
    const mail = rows[0]!;
    expect(mail.subject).toBe(
      `${f.vesselA.name} — due digest for Wed 5 Mar: 1 out of tolerance, 1 window open, 1 due in 7 days`,
    );
    const listed = ["w1", "w3", "w4"].map((k) => wo[`${f.companyId}:${k}`]!);
    const left = ["w2", "w5", "w6", "w7", "w8"].map((k) => wo[`${f.companyId}:${k}`]!);
    for (const w of listed) {
      expect(mail.text).toContain(`${w.number} ${w.title}`);
      expect(mail.text).toContain(`/vessels/${f.vesselA.id}/work-orders/${w.id}`);
      expect(mail.html).toContain(`/vessels/${f.vesselA.id}/work-orders/${w.id}`);
    }
    for (const w of left) expect(mail.text).not.toContain(w.number);
    expect(mail.text).toContain(`/vessels/${f.vesselA.id}/backlog`);
    expect(mail.text).toMatch(/Unsubscribe: http\S+\/unsubscribe\?/);
    // Open now: w1 and w8 out of tolerance, w2 late.
    expect(mail.text).toContain("In all, 1 work order is late and 2 out of tolerance on board.");
  });

  it("is queued once: a rerun the same ship's day adds nothing", async () => {
    const before = await outbox(f.companyId, "due-digest");
    const counts = await runReminders(testDb(), h(3, NOW), { companyIds: [f.companyId] });
    expect(counts.dueDigests).toBe(0);
    expect(await outbox(f.companyId, "due-digest")).toHaveLength(before.length);
  });

  it("skips people who opted out of digests and disabled users", async () => {
    // The other company: its chief opted out of the digest, its engineer is disabled: no digest at all.
    expect(await outbox(other.companyId, "due-digest")).toEqual([]);
    // The opt-out is for one kind: the same chief still gets the escalation, the engineer nothing.
    const escalations = await outbox(other.companyId, "escalation");
    expect(escalations.map((r) => r.toAddress).sort()).toEqual(
      [other.users["chief-engineer"].email, other.users.superintendent.email].sort(),
    );
    const all = await testDb().select().from(s.mailOutbox).where(eq(s.mailOutbox.companyId, other.companyId));
    expect(all.some((r) => r.userId === other.users.engineer.id)).toBe(false);
  });
});

describe("escalation", () => {
  it("sends one message per change to the chief and the superintendents, and marks the change", async () => {
    const rows = await outbox(f.companyId, "escalation");
    const sc1 = changeIds[`${f.companyId}:w1`]!;
    expect(rows.map((r) => r.dedupeKey).sort()).toEqual(
      [f.users["chief-engineer"].id, f.users.superintendent.id].map((u) => `escalation:${sc1}:${u}`).sort(),
    );
    expect(rows[0]!.subject).toBe(`${f.vesselA.name} — ${wo[`${f.companyId}:w1`]!.number} is out of tolerance: Job w1`);
    const changes = await testDb()
      .select()
      .from(s.workOrderStateChange)
      .where(inArray(s.workOrderStateChange.id, [sc1, changeIds[`${f.companyId}:w8`]!]));
    // Both handled: w1 with its messages, w8 (13 days old) without any.
    expect(changes.every((c) => c.escalatedAt?.getTime() === NOW.getTime())).toBe(true);
  });

  it("never sends again on a rerun", async () => {
    const counts = await runReminders(testDb(), h(1, NOW), { companyIds: [f.companyId] });
    expect(counts.escalations).toBe(0);
    expect(counts.escalationsMarkedOnly).toBe(0);
    expect(await outbox(f.companyId, "escalation")).toHaveLength(2);
  });

  it("sends for a new change of the same work order", async () => {
    const w1 = wo[`${f.companyId}:w1`]!;
    const [sc] = await testDb()
      .insert(s.workOrderStateChange)
      .values({
        companyId: f.companyId,
        workOrderId: w1.id,
        fromState: "deferred",
        toState: "out-of-tolerance",
        changedAt: h(2, NOW),
      })
      .returning();
    const counts = await runReminders(testDb(), h(2.5, NOW), { companyIds: [f.companyId] });
    expect(counts.escalations).toBe(2);
    const rows = await testDb()
      .select()
      .from(s.mailOutbox)
      .where(like(s.mailOutbox.dedupeKey, `escalation:${sc!.id}:%`));
    expect(rows).toHaveLength(2);
  });

  it("sends one message per vessel and run for every work order that went out of tolerance in it", async () => {
    // Issue 14: the first start sent the superintendent twenty messages within a minute, one per work order.
    const [a, b] = await testDb()
      .insert(s.workOrderStateChange)
      .values(
        ["w1", "w8"].map((k) => ({
          companyId: f.companyId,
          workOrderId: wo[`${f.companyId}:${k}`]!.id,
          fromState: "deferred" as const,
          toState: "out-of-tolerance" as const,
          changedAt: h(3, NOW),
        })),
      )
      .returning();
    const counts = await runReminders(testDb(), h(3.5, NOW), { companyIds: [f.companyId] });
    // One message each for the chief engineer and the superintendent, not one per work order.
    expect(counts.escalations).toBe(2);
    const rows = await testDb()
      .select()
      .from(s.mailOutbox)
      .where(or(like(s.mailOutbox.dedupeKey, `escalation:${a!.id}:%`), like(s.mailOutbox.dedupeKey, `escalation:${b!.id}:%`)));
    expect(rows.map((r) => r.subject)).toEqual([`${f.vesselA.name} — 2 work orders went out of tolerance`, `${f.vesselA.name} — 2 work orders went out of tolerance`]);
    const handled = await testDb().select().from(s.workOrderStateChange).where(inArray(s.workOrderStateChange.id, [a!.id, b!.id]));
    expect(handled.every((c) => c.escalatedAt !== null)).toBe(true);
  });
});

describe("the missing-readings chain", () => {
  let m: Fixture;
  const sent = async () =>
    (await outbox(m.companyId, "missing-readings")).map((r) => ({ to: r.toAddress, key: r.dedupeKey }));
  const run = (at: Date) => runReminders(testDb(), at, { companyIds: [m.companyId] });

  beforeAll(async () => {
    // Readings of vessel A at `lastReadAt` (24 h before the fixture's now); vessel B has none.
    m = await createCompany("reminders-missing", NOW);
  });

  it("fires engineers, then the chief, then the superintendent, each once", async () => {
    const latest = m.lastReadAt;
    const key = (step: number, userId: string) =>
      `missing-readings:${m.vesselA.id}:${latest.toISOString()}:${step}:${userId}`;
    await run(h(35.9, latest));
    expect(await sent()).toEqual([]);
    await run(h(36, latest)); // default 36 h
    expect(await sent()).toEqual([{ to: m.users.engineer.email, key: key(1, m.users.engineer.id) }]);
    await run(h(59, latest));
    expect(await sent()).toHaveLength(1);
    await run(h(60, latest)); // 36 + 24
    expect((await sent()).map((x) => x.key).sort()).toEqual(
      [key(1, m.users.engineer.id), key(2, m.users["chief-engineer"].id)].sort(),
    );
    await run(h(84, latest)); // 36 + 2 × 24
    await run(h(85, latest));
    await run(h(120, latest));
    const all = await sent();
    expect(all.map((x) => x.key).sort()).toEqual(
      [key(1, m.users.engineer.id), key(2, m.users["chief-engineer"].id), key(3, m.users.superintendent.id)].sort(),
    );
    const third = (await outbox(m.companyId, "missing-readings")).find((r) =>
      r.dedupeKey.endsWith(`:3:${m.users.superintendent.id}`),
    )!;
    expect(third.subject).toBe(`${m.vesselA.name} — still no hour-meter reading after 84 h`);
    expect(third.text).toContain(`/vessels/${m.vesselA.id}/hour-log`);
  });

  it("stops at a new reading and starts a new chain from it", async () => {
    const newReading = h(121, m.lastReadAt);
    await testDb().insert(s.reading).values({
      companyId: m.companyId,
      vesselId: m.vesselA.id,
      counterId: m.counters.main.id,
      readAt: newReading,
      segment: 1,
      meterValue: 1100,
      totalHours: 1100,
    });
    await run(h(10, newReading));
    expect(await sent()).toHaveLength(3);
    await run(h(36, newReading));
    const fresh = (await sent()).filter((x) => x.key.includes(newReading.toISOString()));
    expect(fresh).toEqual([
      {
        to: m.users.engineer.email,
        key: `missing-readings:${m.vesselA.id}:${newReading.toISOString()}:1:${m.users.engineer.id}`,
      },
    ]);
  });
});

describe("the weekly fleet summary", () => {
  it("goes to the superintendents on Monday, once per ISO week", async () => {
    // Mon 10 Mar 2031 06:00 UTC. 1 Jan 2031 is a Wednesday, so week 1 starts Mon 30 Dec 2030;
    // 10 Mar is day 69 of the year, 70 days after 30 Dec: 10 whole weeks → week 11.
    const monday = new Date("2031-03-10T06:00:00Z");
    expect(await outbox(f.companyId, "fleet-summary")).toEqual([]);
    await runReminders(testDb(), monday, { companyIds: [f.companyId] });
    await runReminders(testDb(), h(5, monday), { companyIds: [f.companyId] });
    const rows = await outbox(f.companyId, "fleet-summary");
    expect(rows.map((r) => [r.toAddress, r.dedupeKey])).toEqual([
      [f.users.superintendent.email, `fleet-summary:${f.companyId}:2031-W11:${f.users.superintendent.id}`],
    ]);
    expect(rows[0]!.text).toContain(f.vesselA.name);
    expect(rows[0]!.text).toContain(f.vesselB.name);
    expect(rows[0]!.text).toContain("/fleet");
  });
});

describe("isolation", () => {
  it("each company's messages go to its own people and name only its own vessels", async () => {
    for (const [mine, theirs] of [
      [f, other],
      [other, f],
    ] as const) {
      const rows = await testDb().select().from(s.mailOutbox).where(eq(s.mailOutbox.companyId, mine.companyId));
      expect(rows.length).toBeGreaterThan(0);
      const people = new Set(Object.values(mine.users).map((u) => u.id));
      for (const r of rows) {
        expect(people.has(r.userId!)).toBe(true);
        expect(r.text).not.toContain(theirs.vesselA.id);
        expect(r.text).not.toContain(theirs.vesselA.name);
      }
    }
  });
});

describe("delivery through the SMTP fake", () => {
  const fake = process.env.KEELSON_MAIL_FAKE_URL;
  it.skipIf(!fake)(
    "the worker delivers the queued digest, once",
    async () => {
      const key = `due-digest:${f.vesselA.id}:2031-03-05:${f.users.engineer.id}`;
      const row = async () => (await testDb().select().from(s.mailOutbox).where(eq(s.mailOutbox.dedupeKey, key)))[0]!;
      // The run above asked the worker to send; ask again in case that send ran before this
      // test (its minute's sweep alone may come later than a test should wait).
      await askTheWorkerToSend();
      await waitFor("the worker to send the digest", async () => (await row()).status === "sent", 75_000).catch(
        () => undefined,
      );
      const sent = await row();
      expect(sent.status, `outbox row: ${sent.status}, ${sent.attempts} attempts, ${sent.lastError}`).toBe("sent");
      const response = await fetch(`${fake}/messages?to=${encodeURIComponent(f.users.engineer.email)}`);
      const caught = (await response.json()) as { messageId: string | null; subject: string; text: string }[];
      const mine = caught.filter((m) => m.messageId === sent.messageId);
      expect(mine).toHaveLength(1);
      expect(mine[0]!.subject).toBe(sent.subject);
      expect(mine[0]!.text).toContain(`/vessels/${f.vesselA.id}/work-orders/${wo[`${f.companyId}:w1`]!.id}`);
      // A rerun of the reminders queues nothing, so nothing more reaches the engineer.
      await runReminders(testDb(), NOW, { companyIds: [f.companyId] });
      expect((await row()).attempts).toBe(sent.attempts);
    },
    90_000,
  );
});
