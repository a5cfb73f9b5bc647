// A believable measurement series for the demo's trends (issue 14): on one vessel, one cylinder's
// liner wear creeps toward its 0.80 mm wear limit over five piston overhauls, so the straight line
// fitted to it reaches the limit before the next overhaul falls due and the work order says so.
// The other measurement of the job (ring groove clearance) stays well inside its limits. Invented
// data for the demo only, seeded: the same vessel gives the same series on every set-up.
import { and, asc, desc, eq, like } from "drizzle-orm";
import type { Tx } from "../client";
import * as s from "../schema";
import { workOrderNumber } from "../../server/scheduling/work-order-writer";
import { seededRandom } from "./readings";

const DAY = 86_400_000;
const OVERHAULS = 5;
/** Wear of the liner at the first overhaul of the series (mm): it was fitted new some hours before. */
const FIRST_WEAR = 0.05;
const WEAR = "Liner wear, top ring TDC";
const GROOVE = "Ring groove clearance";

const round2 = (x: number) => Math.round(x * 100) / 100;

export async function seedLinerWear(
  tx: Tx,
  companyId: string,
  vessel: { id: string; code: string; seed: number },
  crew: { doneBy: string | null; decidedBy: string | null },
  now: Date,
) {
  const random = seededRandom(vessel.seed * 17 + 1);
  const routines = await tx
    .select()
    .from(s.routine)
    .where(
      and(
        eq(s.routine.companyId, companyId),
        eq(s.routine.vesselId, vessel.id),
        like(s.routine.title, "Cylinder unit %: piston overhaul and liner gauging"),
      ),
    )
    .orderBy(asc(s.routine.title));
  const [main] = await tx
    .select({ id: s.counter.id })
    .from(s.counter)
    .where(and(eq(s.counter.companyId, companyId), eq(s.counter.vesselId, vessel.id), eq(s.counter.name, "Main engine")));
  if (!main) return 0;
  const readings = await tx
    .select({ readAt: s.reading.readAt, totalHours: s.reading.totalHours })
    .from(s.reading)
    .where(and(eq(s.reading.companyId, companyId), eq(s.reading.counterId, main.id)))
    .orderBy(desc(s.reading.readAt));
  const latest = readings[0];
  const oldest = readings.at(-1);
  // The overhaul furthest from falling due: its next work order has room for the warning to matter.
  const routine = routines
    .filter((r) => r.intervalHours !== null && r.baselineHours !== null && r.baselineAt !== null)
    .reduce<(typeof routines)[number] | null>((best, r) => (!best || r.baselineHours! > best.baselineHours! ? r : best), null);
  if (!routine || !latest || !oldest || latest === oldest) return 0;

  const baseline = routine.baselineHours!;
  const hoursPerDay = (latest.totalHours - oldest.totalHours) / ((latest.readAt.getTime() - oldest.readAt.getTime()) / DAY);
  const dueHours = baseline + routine.intervalHours!;
  // The line is laid to meet the limit halfway between today's hours and the next due point; the
  // five overhauls spread evenly over the engine's life before the baseline (earlier overhauls came
  // at shorter intervals than today's 16,000 h).
  const meetsAt = latest.totalHours + (dueHours - latest.totalHours) / 2;
  const step = Math.round(baseline / OVERHAULS / 100) * 100;
  const first = baseline - (OVERHAULS - 1) * step;
  const wearLimit = routine.measurements.find((m) => m.name === WEAR)?.upper ?? 0.8;
  const wearAt = (hours: number) => FIRST_WEAR + ((wearLimit - FIRST_WEAR) * (hours - first)) / (meetsAt - first);

  const series = Array.from({ length: OVERHAULS }, (_, k) => {
    const hours = first + k * step;
    return {
      hours,
      doneAt: new Date(routine.baselineAt!.getTime() - ((baseline - hours) / hoursPerDay) * DAY),
      wear: round2(Math.max(0, wearAt(hours) + (random() - 0.5) * 0.02)),
      groove: round2(0.27 + k * 0.01 + (random() - 0.5) * 0.02),
    };
  });
  const measurementsAt = (o: (typeof series)[number]) =>
    routine.measurements.map((m) => ({
      ...m,
      value: m.name === WEAR ? o.wear : m.name === GROOVE ? o.groove : round2(((m.lower ?? 0) + (m.upper ?? 1)) / 2),
      outOfLimits: false,
    }));

  // The history may already hold the overhaul at the baseline (db/seed/history.ts): it becomes the
  // last of the five, the others come before it.
  const existing = await tx
    .select({ id: s.workOrder.id })
    .from(s.workOrder)
    .where(and(eq(s.workOrder.companyId, companyId), eq(s.workOrder.routineId, routine.id)));
  const last = series.at(-1)!;
  for (const w of existing) {
    await tx.update(s.workOrder).set({ occurrence: OVERHAULS }).where(eq(s.workOrder.id, w.id));
    await tx.update(s.completion).set({ measurements: measurementsAt(last) }).where(eq(s.completion.workOrderId, w.id));
  }
  const [v] = await tx.select({ seq: s.vessel.workOrderSeq }).from(s.vessel).where(eq(s.vessel.id, vessel.id));
  let sequence = v?.seq ?? 0;
  const toWrite = existing.length ? series.slice(0, -1) : series;
  for (const [k, o] of toWrite.entries()) {
    sequence++;
    const decidedAt = new Date(Math.min(o.doneAt.getTime() + DAY, now.getTime() - 3_600_000));
    const [w] = await tx
      .insert(s.workOrder)
      .values({
        companyId,
        vesselId: vessel.id,
        routineId: routine.id,
        componentId: routine.componentId,
        counterId: main.id,
        number: workOrderNumber(vessel.code, sequence),
        occurrence: k + 1,
        title: routine.title,
        state: "done",
        stateChangedAt: decidedAt,
        dueDate: o.doneAt,
        dueHours: o.hours,
        governing: "hours",
        rank: routine.rank,
        team: routine.team,
        elapsedHours: routine.elapsedHours,
        estimatedManHours: routine.estimatedManHours,
        needsPort: routine.needsPort,
        needsEngineStop: routine.needsEngineStop,
        critical: routine.critical,
        classRelated: routine.classRelated,
        computedAt: decidedAt,
        completedAt: o.doneAt,
        createdAt: new Date(o.doneAt.getTime() - 20 * DAY),
      })
      .returning({ id: s.workOrder.id });
    await tx.insert(s.completion).values({
      companyId,
      vesselId: vessel.id,
      workOrderId: w!.id,
      doneAt: o.doneAt,
      counterHours: o.hours,
      manHours: routine.estimatedManHours,
      checklist: routine.checklist.map((step) => ({ step, done: true })),
      measurements: measurementsAt(o),
      remarks: `Liner gauged: ${o.wear.toFixed(2)} mm wear at top ring TDC. Rings renewed.`,
      doneBy: crew.doneBy,
      status: "approved",
      decidedBy: crew.decidedBy,
      decidedAt,
    });
  }
  await tx.update(s.vessel).set({ workOrderSeq: sequence }).where(eq(s.vessel.id, vessel.id));
  return toWrite.length;
}
