// Measurement trends from the database: a routine's approved completions (the newest SERIES_LIMIT),
// its counter's latest reading and running rate, and its open work order's limits, put through the
// pure trend.ts. Scoped by company and vessel; the route and the daily digest read the same.
import "server-only";
import { and, desc, eq, inArray, isNull, lte, ne, sql } from "drizzle-orm";
import { type Db, getDb, type Tx } from "@/db/client";
import { completion, counter, reading, routine, workOrder } from "@/db/schema";
import type { Access, VesselRef } from "@/server/auth/access";
import { isoInstant } from "@/server/format/iso";
import { AppError } from "@/server/http/problem";
import type { MeasurementTrendView, RoutineTrends, TrendWarning } from "./contract";
import {
  type DueLimits,
  measurementTrends,
  reachesBeforeDue,
  SERIES_LIMIT,
  type TrendCompletion,
  type TrendCounter,
} from "./trend";
import { trendCaption, warningSentence } from "./trend-words";

type RoutineRow = Pick<typeof routine.$inferSelect, "id" | "title" | "intervalHours" | "measurements">;
type WorkOrderRow = Pick<
  typeof workOrder.$inferSelect,
  | "id"
  | "number"
  | "title"
  | "state"
  | "routineId"
  | "counterId"
  | "dueHours"
  | "dueDate"
  | "calendarDue"
  | "deferredDueHours"
  | "deferredDueDate"
>;
type CounterNow = TrendCounter & { name: string };

const routineColumns = {
  id: routine.id,
  title: routine.title,
  intervalHours: routine.intervalHours,
  measurements: routine.measurements,
};
const workOrderColumns = {
  id: workOrder.id,
  number: workOrder.number,
  title: workOrder.title,
  state: workOrder.state,
  routineId: workOrder.routineId,
  counterId: workOrder.counterId,
  dueHours: workOrder.dueHours,
  dueDate: workOrder.dueDate,
  calendarDue: workOrder.calendarDue,
  deferredDueHours: workOrder.deferredDueHours,
  deferredDueDate: workOrder.deferredDueDate,
};

/**
 * The limits the work order falls due at. A deferral's limit replaces the routine's of its kind; a
 * deferral of the hours alone leaves the calendar limit (the stored due date is the first of the
 * routine's own two, so it is no longer a limit then).
 */
function dueLimits(w: WorkOrderRow): DueLimits {
  return {
    hours: w.deferredDueHours ?? w.dueHours,
    date: w.deferredDueDate ?? (w.deferredDueHours !== null ? w.calendarDue : w.dueDate),
  };
}

/** Each routine's approved completions, the newest SERIES_LIMIT of each. */
async function loadSeries(db: Db | Tx, companyId: string, vesselId: string, routineIds: string[]) {
  const series = new Map<string, TrendCompletion[]>();
  if (routineIds.length === 0) return series;
  const ranked = db
    .select({
      routineId: workOrder.routineId,
      doneAt: completion.doneAt,
      counterHours: completion.counterHours,
      measurements: completion.measurements,
      n: sql<number>`row_number() over (partition by ${workOrder.routineId} order by ${completion.doneAt} desc)`.as("n"),
    })
    .from(completion)
    .innerJoin(workOrder, and(eq(workOrder.id, completion.workOrderId), eq(workOrder.companyId, companyId)))
    .where(
      and(
        eq(completion.companyId, companyId),
        eq(completion.vesselId, vesselId),
        eq(completion.status, "approved"),
        inArray(workOrder.routineId, routineIds),
      ),
    )
    .as("ranked");
  const rows = await db.select().from(ranked).where(lte(ranked.n, SERIES_LIMIT));
  for (const r of rows) {
    const list = series.get(r.routineId!) ?? [];
    list.push({ doneAt: r.doneAt, counterHours: r.counterHours, measurements: r.measurements });
    series.set(r.routineId!, list);
  }
  return series;
}

/** Each counter's name, running rate (the worker's) and latest reading. */
async function loadCounters(db: Db | Tx, companyId: string, counterIds: string[]) {
  const out = new Map<string, CounterNow>();
  if (counterIds.length === 0) return out;
  const rows = await db
    .select({ id: counter.id, name: counter.name, runningRate: counter.runningRate })
    .from(counter)
    .where(and(eq(counter.companyId, companyId), inArray(counter.id, counterIds)));
  const latest = await db
    .selectDistinctOn([reading.counterId], { counterId: reading.counterId, readAt: reading.readAt, totalHours: reading.totalHours })
    .from(reading)
    .where(and(eq(reading.companyId, companyId), inArray(reading.counterId, counterIds)))
    .orderBy(reading.counterId, desc(reading.readAt));
  for (const c of rows) {
    const last = latest.find((l) => l.counterId === c.id);
    if (last) out.set(c.id, { name: c.name, totalHours: last.totalHours, readAt: last.readAt, hoursPerDay: c.runningRate });
  }
  return out;
}

/** The trends of one routine, with the warning against its open work order (`next`) where there is one. */
function trendsOf(
  r: RoutineRow,
  next: WorkOrderRow | null,
  completions: TrendCompletion[],
  counterNow: CounterNow | null,
  timeZone: string,
): MeasurementTrendView[] {
  const basis = r.intervalHours !== null ? "hours" : "days";
  const due = next ? dueLimits(next) : null;
  return measurementTrends({ measurements: r.measurements, basis, completions, counter: counterNow }).map((t) => ({
    ...t,
    caption: trendCaption(t, timeZone),
    warning: due && reachesBeforeDue(t.projection, due) ? warningSentence(t, due, timeZone) : null,
  }));
}

/** GET …/routines/[routineId]/trends: every measurement the routine defines, charted and projected. */
export async function loadRoutineTrends(access: Access, vessel: VesselRef, routineId: string): Promise<RoutineTrends> {
  const db = getDb();
  const companyId = access.company.id;
  const [r] = await db
    .select(routineColumns)
    .from(routine)
    .where(and(eq(routine.companyId, companyId), eq(routine.vesselId, vessel.id), eq(routine.id, routineId)));
  if (!r) throw new AppError("not-found", "There is no such routine on this vessel.");
  // The newest occurrence: the open work order when there is one, and the counter the routine is read on now.
  const [latest] = await db
    .select(workOrderColumns)
    .from(workOrder)
    .where(and(eq(workOrder.companyId, companyId), eq(workOrder.vesselId, vessel.id), eq(workOrder.routineId, r.id)))
    .orderBy(desc(workOrder.occurrence))
    .limit(1);
  const next = latest && latest.state !== "done" ? latest : null;
  const counters = latest?.counterId ? await loadCounters(db, companyId, [latest.counterId]) : new Map<string, CounterNow>();
  const counterNow = latest?.counterId ? (counters.get(latest.counterId) ?? null) : null;
  const series = r.measurements.length ? await loadSeries(db, companyId, vessel.id, [r.id]) : new Map<string, TrendCompletion[]>();
  const due = next ? dueLimits(next) : null;
  return {
    routine: { id: r.id, title: r.title, basis: r.intervalHours !== null ? "hours" : "days" },
    counter: counterNow
      ? {
          name: counterNow.name,
          totalHours: counterNow.totalHours,
          readAt: counterNow.readAt.toISOString(),
          hoursPerDay: counterNow.hoursPerDay,
        }
      : null,
    next:
      next && due ? { workOrderId: next.id, number: next.number, dueHours: due.hours, dueDate: isoInstant(due.date) } : null,
    measurements: trendsOf(r, next, series.get(r.id) ?? [], counterNow, vessel.timeZone),
  };
}

/**
 * The digest's lines: open work orders of the vessel's routines whose measurement reaches its limit
 * before they fall due. A vessel's routines with measurements, each with at most SERIES_LIMIT
 * completions: bounded work, once a day.
 */
export async function loadTrendWarnings(
  db: Db | Tx,
  companyId: string,
  vessel: { id: string; timeZone: string },
): Promise<TrendWarning[]> {
  const rows = await db
    .select({ r: routineColumns, w: workOrderColumns })
    .from(routine)
    .innerJoin(
      workOrder,
      and(eq(workOrder.companyId, routine.companyId), eq(workOrder.routineId, routine.id), ne(workOrder.state, "done")),
    )
    .where(
      and(
        eq(routine.companyId, companyId),
        eq(routine.vesselId, vessel.id),
        isNull(routine.retiredAt),
        sql`jsonb_array_length(${routine.measurements}) > 0`,
      ),
    )
    .orderBy(workOrder.number);
  if (rows.length === 0) return [];
  const series = await loadSeries(db, companyId, vessel.id, rows.map((x) => x.r.id));
  const counterIds = [...new Set(rows.flatMap((x) => (x.w.counterId ? [x.w.counterId] : [])))];
  const counters = await loadCounters(db, companyId, counterIds);
  return rows.flatMap(({ r, w }) => {
    const counterNow = w.counterId ? (counters.get(w.counterId) ?? null) : null;
    return trendsOf(r, w, series.get(r.id) ?? [], counterNow, vessel.timeZone).flatMap((t) =>
      t.warning ? [{ workOrderId: w.id, number: w.number, title: w.title, sentence: t.warning }] : [],
    );
  });
}
