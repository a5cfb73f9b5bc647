// Demo Fleet board history: 90 days of invented daily figures per demo vessel, ending at today's
// real ones. Today's row is taken from the worker's rows (takeVesselSnapshot); each earlier day
// drifts a little from the day after it, with a random generator seeded per vessel, so the trend
// charts have something believable to show. Invented figures, for the demo only.
import { asc, and, eq, isNull } from "drizzle-orm";
import type { Db } from "../client";
import * as s from "../schema";
import { trendDays, TREND_DAYS } from "../../server/fleet/figures";
import { takeVesselSnapshot } from "../../server/fleet/snapshot";
import { seededRandom } from "./readings";

const DAY = 86_400_000;

export async function seedSnapshots(db: Db, companyId: string, now: Date): Promise<void> {
  const vessels = await db
    .select({ id: s.vessel.id, code: s.vessel.code })
    .from(s.vessel)
    .where(and(eq(s.vessel.companyId, companyId), isNull(s.vessel.retiredAt)))
    .orderBy(asc(s.vessel.code));
  const days = trendDays(now, TREND_DAYS);
  for (const v of vessels) {
    const today = await takeVesselSnapshot(db, companyId, v.id, now);
    const random = seededRandom([...v.code].reduce((h, c) => h * 31 + c.charCodeAt(0), 7));
    /** A step of -1, 0 or +1, more often 0; `scale` widens it for the larger counts. */
    const step = (scale = 1) => Math.round((random() - 0.5) * 2.4 * scale);
    let d = { ...today };
    const rows: (typeof s.vesselSnapshot.$inferInsert)[] = [];
    for (let back = 1; back < days.length; back++) {
      const outOfTolerance = Math.max(0, d.outOfTolerance + step());
      const late = Math.max(0, d.late + step(1.5));
      const completed90 = Math.max(0, d.completed90 + step(2));
      d = {
        ...d,
        scheduled: Math.max(0, d.scheduled + step(3)),
        windowOpen: Math.max(0, d.windowOpen + step(2)),
        late,
        outOfTolerance,
        deferred: Math.max(0, d.deferred + (random() < 0.05 ? step() : 0)),
        criticalLate: Math.min(late, Math.max(0, d.criticalLate + (random() < 0.15 ? step() : 0))),
        criticalOutOfTolerance: Math.min(
          outOfTolerance,
          Math.max(0, d.criticalOutOfTolerance + (random() < 0.1 ? step() : 0)),
        ),
        classLate: Math.min(late, Math.max(0, d.classLate + (random() < 0.15 ? step() : 0))),
        classOutOfTolerance: Math.min(
          outOfTolerance,
          Math.max(0, d.classOutOfTolerance + (random() < 0.1 ? step() : 0)),
        ),
        pendingDeferrals: Math.max(0, d.pendingDeferrals + (random() < 0.1 ? step() : 0)),
        lastReadingAt: today.lastReadingAt ? new Date(today.lastReadingAt.getTime() - back * DAY) : null,
        completed90,
        onTimeRate:
          completed90 === 0
            ? null
            : Math.round(Math.min(1, Math.max(0.55, (d.onTimeRate ?? 0.85) + (random() - 0.5) * 0.03)) * 10_000) /
              10_000,
      };
      const { id: _id, takenAt: _takenAt, ...figures } = d;
      rows.push({ ...figures, day: days[days.length - 1 - back]!, takenAt: new Date(now.getTime() - back * DAY) });
    }
    // The days before today only: a rerun, or a row the worker already took, stays as it is.
    await db.insert(s.vesselSnapshot).values(rows).onConflictDoNothing();
  }
}
