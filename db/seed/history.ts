// Demo maintenance history: earlier occurrences of the floating routines, done and approved, so
// component histories, the `done` filter and on-time figures have something to show. Each
// routine's last completion lands exactly on its seeded baseline, so the open work orders come
// out the same as without the history. Invented records, for the demo only.
import { and, asc, eq, isNotNull } from "drizzle-orm";
import type { Tx } from "../client";
import * as s from "../schema";
import {
  calendarIntervalDays,
  calendarWindow,
  matchToleranceRule,
  type ToleranceRule,
} from "../../server/scheduling/tolerance";
import { parseCalendarRule } from "../../server/scheduling/calendar-rule";
import { resolveCounters } from "../../server/register/tree";
import { workOrderNumber } from "../../server/scheduling/work-order-writer";
import { seededRandom } from "./readings";
import { toleranceRuleFromRow } from "../../server/tolerance/rows";

function windowOf(rules: ToleranceRule[], rule: string, dueAt: Date, timeZone: string) {
  const parsed = parseCalendarRule(rule);
  const match = matchToleranceRule(rules, { calendarRule: parsed }, "calendar");
  return match ? calendarWindow(dueAt, match.rule, timeZone, calendarIntervalDays(parsed)) : null;
}

const DAY = 86_400_000;
const REMARKS = [
  "",
  "Done as per the maker's instructions; no findings.",
  "Slight carbon deposits, cleaned. Parts from ship's stock.",
  "Gaskets renewed. Test run satisfactory.",
  "Found in good order.",
  "Done during the anchorage stay.",
];

export type HistoryCrew = { doneBy: string | null; decidedBy: string | null };

export async function seedHistory(
  tx: Tx,
  companyId: string,
  vessel: { id: string; code: string; seed: number; timeZone: string },
  crew: HistoryCrew,
  now: Date,
) {
  const random = seededRandom(vessel.seed * 13 + 5);
  const rules = (await tx.select().from(s.toleranceRule).where(eq(s.toleranceRule.companyId, companyId))).map(
    toleranceRuleFromRow,
  );
  const routines = await tx
    .select()
    .from(s.routine)
    .where(and(eq(s.routine.companyId, companyId), eq(s.routine.vesselId, vessel.id), isNotNull(s.routine.baselineAt)))
    .orderBy(asc(s.routine.title));
  const components = await tx
    .select({
      id: s.component.id,
      parentId: s.component.parentId,
      code: s.component.code,
      counterId: s.component.counterId,
    })
    .from(s.component)
    .where(eq(s.component.vesselId, vessel.id));
  const counters = resolveCounters(components);
  const yearAgo = now.getTime() - 365 * DAY;

  type Done = { routine: typeof s.routine.$inferSelect; doneAt: Date; counterHours: number | null; dueAt: Date | null };
  const done: Done[] = [];
  for (const r of routines) {
    if (r.anchored || random() < 0.3) continue;
    const last = r.baselineAt!;
    done.push({ routine: r, doneAt: last, counterHours: r.baselineHours, dueAt: null });
    // Calendar-only routines of up to four months get their earlier occurrences of the year too.
    if (!r.calendarRule || r.intervalHours) continue;
    const period = calendarIntervalDays(parseCalendarRule(r.calendarRule));
    if (period > 120) continue;
    let at = last.getTime();
    while (at - period * DAY > yearAgo) {
      // Done a little before or after the day it fell due; about one in twelve well past its grace.
      const lateBy =
        random() < 0.08
          ? Math.round(period * (0.25 + random() * 0.3) * 10) / 10
          : Math.round((random() * 6 - 2) * 10) / 10;
      const earlier = at - (period + lateBy) * DAY;
      done.push({ routine: r, doneAt: new Date(earlier), counterHours: null, dueAt: new Date(at - lateBy * DAY) });
      at = earlier;
    }
  }
  done.sort((a, b) => a.doneAt.getTime() - b.doneAt.getTime());

  const occurrence = new Map<string, number>();
  const [v] = await tx.select({ seq: s.vessel.workOrderSeq }).from(s.vessel).where(eq(s.vessel.id, vessel.id));
  let sequence = v?.seq ?? 0;
  const workOrders: (typeof s.workOrder.$inferInsert)[] = [];
  const records: Omit<typeof s.completion.$inferInsert, "workOrderId">[] = [];
  for (const d of done) {
    const r = d.routine;
    const n = (occurrence.get(r.id) ?? 0) + 1;
    occurrence.set(r.id, n);
    const eff = counters.get(r.componentId);
    // The window the work order had, by the company's rules, so on-time figures have a grace to judge.
    const window = d.dueAt && r.calendarRule ? windowOf(rules, r.calendarRule, d.dueAt, vessel.timeZone) : null;
    const decidedAt = new Date(Math.min(d.doneAt.getTime() + (0.2 + random()) * DAY, now.getTime() - 3_600_000));
    sequence++;
    workOrders.push({
      companyId,
      vesselId: vessel.id,
      routineId: r.id,
      componentId: r.componentId,
      counterId: eff && eff.kind !== "none" ? eff.counterId : null,
      number: workOrderNumber(vessel.code, sequence),
      occurrence: n,
      title: r.title,
      state: "done",
      stateChangedAt: decidedAt,
      dueDate: d.dueAt ?? d.doneAt,
      calendarDue: d.dueAt,
      governing: r.calendarRule && !r.intervalHours ? "calendar" : "hours",
      rank: r.rank,
      team: r.team,
      elapsedHours: r.elapsedHours,
      estimatedManHours: r.estimatedManHours,
      needsPort: r.needsPort,
      needsEngineStop: r.needsEngineStop,
      critical: r.critical,
      classRelated: r.classRelated,
      computedAt: decidedAt,
      completedAt: d.doneAt,
      windowOpensAt: window?.opensAt ?? null,
      graceEndsAt: window?.graceEndsAt ?? null,
      outOfToleranceAt: window?.graceEndsAt ?? null,
      createdAt: new Date(d.doneAt.getTime() - 20 * DAY),
    });
    records.push({
      companyId,
      vesselId: vessel.id,
      doneAt: d.doneAt,
      counterHours: d.counterHours,
      manHours: Math.max(0.5, Math.round(r.estimatedManHours * (0.8 + random() * 0.5) * 2) / 2),
      checklist: r.checklist.map((step) => ({ step, done: true })),
      measurements: r.measurements.map((m) => {
        const lower = m.lower ?? (m.upper !== null ? m.upper * 0.5 : 0);
        const upper = m.upper ?? lower * 1.5 + 1;
        const value = Math.round((lower + (0.2 + random() * 0.6) * (upper - lower)) * 100) / 100;
        return { ...m, value, outOfLimits: false };
      }),
      remarks: REMARKS[Math.floor(random() * REMARKS.length)]!,
      doneBy: crew.doneBy,
      status: "approved",
      decidedBy: crew.decidedBy,
      decidedAt,
    });
  }
  for (let i = 0; i < workOrders.length; i += 1000) {
    const ids = await tx
      .insert(s.workOrder)
      .values(workOrders.slice(i, i + 1000))
      .returning({ id: s.workOrder.id });
    await tx.insert(s.completion).values(ids.map((w, j) => ({ ...records[i + j]!, workOrderId: w.id })));
  }
  await tx.update(s.vessel).set({ workOrderSeq: sequence }).where(eq(s.vessel.id, vessel.id));
  return workOrders.length;
}
