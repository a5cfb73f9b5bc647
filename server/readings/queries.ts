import "server-only";
import { and, asc, eq, gte, inArray, isNull, sql } from "drizzle-orm";
import { getDb } from "@/db/client";
import { component, counter, reading, user } from "@/db/schema";
import type { Access, VesselRef } from "@/server/auth/access";
import { can } from "@/server/auth/roles";
import { instantOfShipTime, shipDay } from "@/server/format/hours";
import { requestRecompute } from "@/server/jobs/recompute-vessel";
import { AppError, type FieldError, invalidInput } from "@/server/http/problem";
import type { HourLogView, ReadingBatch, ReadingBatchResult, ReadingHistory } from "./contract";
import { correctionsSince } from "./corrections";
import { dailyRunningHours } from "./daily";
import { loadNeighbours } from "./neighbours";
import { isInFuture, readingProblem, round1 } from "./rules";
import { vesselZoneAt } from "@/server/vessels/clock";

export async function loadHourLog(access: Access, vessel: VesselRef, now = new Date()): Promise<HourLogView> {
  const db = getDb();
  const scope = and(eq(counter.companyId, access.company.id), eq(counter.vesselId, vessel.id), isNull(counter.retiredAt));
  const counters = await db
    .select({
      id: counter.id,
      name: counter.name,
      segment: counter.currentSegment,
      plannedHoursPerDay: counter.plannedHoursPerDay,
      runningRate: counter.runningRate,
      rateBasis: counter.rateBasis,
      lastAt: sql<Date | null>`last.read_at`,
      lastMeter: sql<string | null>`last.meter_value`,
      lastTotal: sql<string | null>`last.total_hours`,
      lastBy: sql<string | null>`last.entered_by_name`,
    })
    .from(counter)
    .leftJoin(
      sql`lateral (
        select r.read_at, r.meter_value, r.total_hours, u.name as entered_by_name
        from ${reading} r left join ${user} u on u.id = r.entered_by
        where r.company_id = "counter"."company_id" and r.counter_id = "counter"."id" and r.segment = "counter"."current_segment"
        order by r.read_at desc limit 1
      ) last`,
      sql`true`,
    )
    .where(scope)
    .orderBy(asc(counter.sortOrder), asc(counter.name));

  const users = await db
    .select({ counterId: component.counterId, code: component.code, name: component.name })
    .from(component)
    .where(and(eq(component.companyId, access.company.id), eq(component.vesselId, vessel.id)))
    .orderBy(asc(component.code));

  return {
    vessel: { id: vessel.id, name: vessel.name, code: vessel.code, timeZone: vessel.timeZone },
    now: now.toISOString(),
    canWrite: can(access.role, "readings:write"),
    counters: counters.map((c) => ({
      id: c.id,
      name: c.name,
      segment: c.segment,
      plannedHoursPerDay: c.plannedHoursPerDay,
      rate: c.runningRate === null ? null : { hoursPerDay: c.runningRate, basis: c.rateBasis ?? "planned" },
      components: users.filter((u) => u.counterId === c.id).map(({ code, name }) => ({ code, name })),
      last:
        c.lastAt === null
          ? null
          : {
              readAt: new Date(c.lastAt).toISOString(),
              meterValue: Number(c.lastMeter),
              totalHours: Number(c.lastTotal),
              enteredBy: c.lastBy,
            },
    })),
  };
}

/**
 * Stores a day's readings all at once or not at all. The counters are locked for the length of
 * the transaction, so two engineers saving at the same moment are checked one after the other.
 */
export async function saveReadingBatch(
  access: Access,
  vessel: VesselRef,
  batch: ReadingBatch,
  now = new Date(),
): Promise<ReadingBatchResult> {
  const readAt = instantOfShipTime(batch.shipDay, batch.time, vessel.timeZone);
  if (isInFuture(readAt, now)) {
    throw invalidInput([
      {
        field: "time",
        message: `${batch.shipDay} ${batch.time} ship's time is in the future: the ship's day is ${shipDay(now, vessel.timeZone)}.`,
      },
    ]);
  }

  const errors: FieldError[] = [];
  const seen = new Map<string, number>();
  batch.entries.forEach((entry, row) => {
    const first = seen.get(entry.counterId);
    if (first !== undefined) {
      errors.push({ field: `entries.${row}.counterId`, row, message: `This counter is already entered in row ${first + 1}.` });
    } else seen.set(entry.counterId, row);
  });
  if (errors.length) throw invalidInput(errors);

  const ids = batch.entries.map((e) => e.counterId);
  return getDb().transaction(async (tx) => {
    const owned = await tx
      .select({ id: counter.id })
      .from(counter)
      .where(
        and(
          eq(counter.companyId, access.company.id),
          eq(counter.vesselId, vessel.id),
          isNull(counter.retiredAt),
          inArray(counter.id, ids),
        ),
      )
      .orderBy(counter.id)
      .for("update");
    const ownedIds = new Set(owned.map((o) => o.id));

    const byId = await loadNeighbours(tx, access.company.id, [...ownedIds], readAt);

    const rows: (typeof reading.$inferInsert)[] = [];
    batch.entries.forEach((entry, row) => {
      const c = byId.get(entry.counterId);
      if (!c) {
        errors.push({ field: `entries.${row}.counterId`, row, message: `There is no such counter on ${vessel.name}.` });
        return;
      }
      const problem = readingProblem(c.context, entry.value, readAt, vessel.timeZone);
      if (problem) {
        errors.push({ field: `entries.${row}.value`, row, message: `${c.name}: ${problem}` });
        return;
      }
      rows.push({
        companyId: access.company.id,
        vesselId: vessel.id,
        counterId: c.id,
        readAt,
        segment: c.segment,
        meterValue: entry.value,
        totalHours: round1(entry.value + c.offsetHours),
        enteredBy: access.user.id,
        remark: entry.remark || null,
      });
    });
    if (errors.length) throw invalidInput(errors);

    await tx.insert(reading).values(rows);
    await requestRecompute(tx, access.company.id, vessel.id);
    return { saved: rows.length, readAt: readAt.toISOString() };
  });
}

export async function readingHistory(
  access: Access,
  vessel: VesselRef,
  counterId: string,
  days: number,
  now = new Date(),
): Promise<ReadingHistory> {
  const db = getDb();
  const [found] = await db
    .select({ id: counter.id, name: counter.name, segment: counter.currentSegment })
    .from(counter)
    .where(and(eq(counter.companyId, access.company.id), eq(counter.vesselId, vessel.id), eq(counter.id, counterId)));
  if (!found) throw new AppError("not-found", "There is no such counter on this vessel.");

  const since = new Date(now.getTime() - days * 86_400_000);
  // One reading before the window, so the first day of the window has a difference to show.
  const [before] = await db
    .select()
    .from(reading)
    .where(and(eq(reading.companyId, access.company.id), eq(reading.counterId, counterId), sql`${reading.readAt} < ${since}`))
    .orderBy(sql`${reading.readAt} desc`)
    .limit(1);
  const inWindow = await db
    .select()
    .from(reading)
    .where(and(eq(reading.companyId, access.company.id), eq(reading.counterId, counterId), gte(reading.readAt, since)))
    .orderBy(asc(reading.readAt));
  const all = before ? [before, ...inWindow] : inWindow;
  const sinceDay = shipDay(since, vessel.timeZone);

  const audit = await correctionsSince(access.company.id, counterId, since);
  const zoneAt = await vesselZoneAt(access.company.id, vessel);

  return {
    counter: found,
    readings: inWindow.map((r) => ({
      id: r.id,
      readAt: r.readAt.toISOString(),
      shipDay: shipDay(r.readAt, zoneAt(r.readAt)),
      zone: zoneAt(r.readAt),
      meterValue: r.meterValue,
      totalHours: r.totalHours,
      segment: r.segment,
      remark: r.remark,
      corrections: audit.filter((a) => a.readingId === r.id).map(withoutReadingId),
    })),
    removals: audit.filter((a) => a.kind === "removed").map(withoutReadingId),
    daily: dailyRunningHours(all, vessel.timeZone, since).filter((d) => d.day >= sinceDay),
  };
}

function withoutReadingId<T extends { readingId: string | null }>({ readingId: _, ...entry }: T): Omit<T, "readingId"> {
  return entry;
}
