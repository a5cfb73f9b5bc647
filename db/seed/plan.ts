// Seeds the demo maintenance plan: the tolerance presets, and each vessel's routines with a
// baseline chosen so the Backlog shows every state (most work well ahead, some inside the window,
// a few late or out of tolerance). Invented history, for the demo only.
import { addDays, format } from "date-fns";
import type { Tx } from "../client";
import * as s from "../schema";
import { TOLERANCE_PRESETS } from "../../server/scheduling/presets";
import { calendarIntervalDays } from "../../server/scheduling/tolerance";
import { parseCalendarRule } from "../../server/scheduling/calendar-rule";
import { presetRow } from "../../server/tolerance/rows";
import { seededRandom } from "./readings";
import { type DemoRoutine, routinesFor } from "./routines";
import { componentsFor, type DemoVessel } from "./scenario";

export async function seedTolerancePresets(tx: Tx, companyId: string) {
  await tx.insert(s.toleranceRule).values(TOLERANCE_PRESETS.map((_, i) => presetRow(companyId, i)));
}

/** How far through its interval a routine is at the seed: mostly ahead, some due, a few overdue. */
function progress(random: () => number): number {
  const x = random();
  if (x < 0.68) return 0.05 + random() * 0.8;
  if (x < 0.82) return 0.91 + random() * 0.08;
  if (x < 0.91) return 1.005 + random() * 0.03;
  return 1.07 + random() * 0.12;
}

export async function seedRoutines(
  tx: Tx,
  companyId: string,
  vesselId: string,
  v: DemoVessel,
  componentIds: Map<string, string>,
  counterTotals: Map<string, { total: number; hoursPerDay: number }>,
  now: Date,
) {
  const random = seededRandom(v.seed * 7 + 3);
  const components = componentsFor(v);
  const parentOf = new Map(components.map((c) => [c.code, c.parent]));
  const ownCounter = new Map(components.map((c) => [c.code, c.counter]));
  const counterOf = (code: string): string | undefined => {
    for (let at: string | undefined = code; at; at = parentOf.get(at)) {
      const own = ownCounter.get(at);
      if (own) return own;
    }
    return undefined;
  };

  const rows: (typeof s.routine.$inferInsert)[] = [];
  for (const r of routinesFor(6, v.generators)) {
    const componentId = componentIds.get(r.component);
    if (!componentId) continue;
    const f = progress(random);
    let baselineAt: Date | null = null;
    let baselineHours: number | null = null;
    let anchorDate: string | null = null;
    if (r.intervalHours) {
      const counter = counterTotals.get(counterOf(r.component) ?? "");
      const total = counter?.total ?? 0;
      baselineHours = Math.max(0, Math.round((total - f * r.intervalHours) * 10) / 10);
      const days = (f * r.intervalHours) / Math.max(counter?.hoursPerDay ?? 12, 0.5);
      baselineAt = new Date(now.getTime() - Math.min(days, 3650) * 86_400_000);
    } else if (r.calendarRule) {
      const periodDays = calendarIntervalDays(parseCalendarRule(r.calendarRule));
      if (r.anchored) anchorDate = format(addDays(now, Math.round((1 - f) * periodDays)), "yyyy-MM-dd");
      else baselineAt = new Date(now.getTime() - f * periodDays * 86_400_000);
    }
    rows.push({
      companyId,
      vesselId,
      componentId,
      title: r.title,
      checklist: r.checklist,
      intervalHours: r.intervalHours ?? null,
      calendarRule: r.calendarRule ?? null,
      anchored: r.anchored ?? false,
      anchorDate,
      ...labourOf(r),
      needsPort: r.needsPort ?? false,
      portEvent: r.portEvent?.event ?? null,
      portEventHours: r.portEvent?.withinHours ?? null,
      needsEngineStop: r.engineStop ?? false,
      critical: r.critical ?? false,
      classRelated: r.classRelated ?? false,
      measurements: r.measurements ?? [],
      spareParts: r.spareParts ?? "",
      cautions: r.cautions ?? [],
      baselineAt,
      baselineHours,
    });
  }
  await tx.insert(s.routine).values(rows);
}

/** The team and its hours: as given, or one person of the rank for the man-hours' length. */
function labourOf(r: DemoRoutine) {
  const team = r.team ?? [{ rank: r.rank, count: 1 }];
  const elapsedHours = r.team ? (r.elapsedHours ?? r.manHours) : r.manHours;
  const heads = team.reduce((sum, t) => sum + t.count, 0);
  return { team, elapsedHours, rank: team[0]!.rank, estimatedManHours: Math.round(elapsedHours * heads * 10) / 10 };
}
