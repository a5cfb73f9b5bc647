// The demo company of `npm start` (seeded by the test script as by start.sh): the first reminder
// run after seeding queues the morning digests of the vessels past their digest hour and the
// escalations of the work the seed left out of tolerance. This is what the worker's first run
// does; running it here first changes nothing the worker would not.
import { and, eq, isNull } from "drizzle-orm";
import { afterAll, describe, expect, it } from "vitest";
import * as s from "@/db/schema";
import { runReminders } from "@/server/reminders/run";
import { dueDigest } from "@/server/reminders/schedule";
import { closeTestDb, testDb } from "../support/fixtures";

afterAll(async () => {
  await closeTestDb();
});

describe("the demo company", () => {
  it("gets its morning digests and escalations", async () => {
    const db = testDb();
    const [demo] = await db.select().from(s.company).where(eq(s.company.slug, "brightwater"));
    expect(demo).toBeDefined();
    const now = new Date();
    await runReminders(db, now, { companyIds: [demo!.id] });

    const rows = await db.select().from(s.mailOutbox).where(eq(s.mailOutbox.companyId, demo!.id));
    const vessels = await db.select().from(s.vessel).where(eq(s.vessel.companyId, demo!.id));
    // Every demo vessel has engineers and a chief assigned; its zone decides whether the digest
    // hour has come: Singapore is past 06:00 from 22:00 to 16:00 UTC, Amsterdam from 05:00 (04:00
    // in summer) to 23:00 UTC, so at any hour at least one vessel is.
    const crewed = new Set(
      (
        await db
          .select({ vesselId: s.vesselAssignment.vesselId })
          .from(s.vesselAssignment)
          .where(eq(s.vesselAssignment.companyId, demo!.id))
      ).map((r) => r.vesselId),
    );
    const pastHour = vessels.filter((v) => crewed.has(v.id) && dueDigest(now, v.timeZone, demo!.digestHour));
    expect(pastHour.length).toBeGreaterThan(0);
    for (const v of pastHour) {
      const day = dueDigest(now, v.timeZone, demo!.digestHour)!.shipDay;
      const digests = rows.filter((r) => r.dedupeKey.startsWith(`due-digest:${v.id}:${day}:`));
      expect(digests.length, `${v.name}: digest of ${day}`).toBeGreaterThan(0);
      expect(digests[0]!.subject).toContain(`${v.name} — due digest for`);
    }
    expect(rows.filter((r) => r.kind === "escalation").length).toBeGreaterThan(0);
    // Every change into out-of-tolerance the seed made is handled now.
    const open = await db
      .select({ id: s.workOrderStateChange.id })
      .from(s.workOrderStateChange)
      .where(
        and(
          eq(s.workOrderStateChange.companyId, demo!.id),
          eq(s.workOrderStateChange.toState, "out-of-tolerance"),
          isNull(s.workOrderStateChange.escalatedAt),
        ),
      );
    expect(open).toEqual([]);
  });
});
