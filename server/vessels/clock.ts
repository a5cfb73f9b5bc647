import "server-only";
import { and, desc, eq, sql } from "drizzle-orm";
import type { Db } from "@/db/client";
import { getDb } from "@/db/client";
import { user, vessel, vesselClockChange } from "@/db/schema";
import type { Access, VesselRef } from "@/server/auth/access";
import { can } from "@/server/auth/roles";
import { formatShipTime, instantOfShipTime } from "@/server/format/hours";
import { AppError, invalidInput } from "@/server/http/problem";
import { requestRecompute } from "@/server/jobs/recompute-vessel";
import { clockMoveWords, zoneAtFrom, zoneWords } from "./clock-rules";
import type { ClockChangeValues, ShipClockView } from "./clock-contract";

const WEEK_MS = 7 * 86_400_000;

/** The vessel's clock changes, newest first, and the zone it keeps now. */
export async function loadShipClock(access: Access, target: VesselRef, now = new Date()): Promise<ShipClockView> {
  const rows = await getDb()
    .select({ change: vesselClockChange, by: user.name })
    .from(vesselClockChange)
    .leftJoin(user, eq(user.id, vesselClockChange.enteredBy))
    .where(and(eq(vesselClockChange.companyId, access.company.id), eq(vesselClockChange.vesselId, target.id)))
    .orderBy(desc(vesselClockChange.effectiveAt))
    .limit(50);
  return {
    zone: target.timeZone,
    zoneWords: zoneWords(target.timeZone),
    canSet: can(access.role, "clock:set") && !target.retiredAt,
    changes: rows.map(({ change: c, by }) => ({
      id: c.id,
      effectiveAt: c.effectiveAt.toISOString(),
      effectiveWords: `${formatShipTime(c.effectiveAt, c.fromTimeZone)} (${zoneWords(c.fromTimeZone)})`,
      fromZone: zoneWords(c.fromTimeZone),
      toZone: zoneWords(c.timeZone),
      move: clockMoveWords(c.fromTimeZone, c.timeZone, c.effectiveAt),
      note: c.note,
      by,
      inForce: c.effectiveAt <= now,
    })),
  };
}

/**
 * Enters a change of the ship's clock. The day and time are read on the clock the ship keeps at
 * that moment (the last change before it, else the zone kept now); from then on the ship's days
 * are counted in the new zone. A change already due moves the vessel's zone at once; a later one
 * is moved by the worker when it falls due (`applyDueClockChanges`).
 */
export async function addClockChange(
  access: Access,
  target: VesselRef,
  input: ClockChangeValues,
  now = new Date(),
): Promise<ShipClockView> {
  await getDb().transaction(async (tx) => {
    // One change at a time per vessel: the zone before it must not move under us.
    const [v] = await tx
      .select({ timeZone: vessel.timeZone })
      .from(vessel)
      .where(and(eq(vessel.companyId, access.company.id), eq(vessel.id, target.id)))
      .for("update");
    if (!v) throw new AppError("not-found", "No such vessel.");
    // The day and time are read on the clock kept at that moment, from the history: a change entered
    // between two others, or after one still to come, is read on the clock that one sets.
    const history = await tx
      .select({
        effectiveAt: vesselClockChange.effectiveAt,
        fromTimeZone: vesselClockChange.fromTimeZone,
        timeZone: vesselClockChange.timeZone,
      })
      .from(vesselClockChange)
      .where(and(eq(vesselClockChange.companyId, access.company.id), eq(vesselClockChange.vesselId, target.id)));
    const zoneAt = zoneAtFrom(history, v.timeZone);
    const firstGuess = instantOfShipTime(input.shipDay, input.time, zoneAt(now));
    const effectiveAt = instantOfShipTime(input.shipDay, input.time, zoneAt(firstGuess));
    if (Math.abs(effectiveAt.getTime() - now.getTime()) > WEEK_MS) {
      throw invalidInput([
        { field: "shipDay", message: "Enter a change of the clock within a week before or after today." },
      ]);
    }
    const zoneBefore = zoneAt(effectiveAt);
    if (zoneBefore === input.zone) {
      throw invalidInput([{ field: "zone", message: `The ship already keeps ${zoneWords(input.zone)} then: pick another zone.` }]);
    }
    const inserted = await tx
      .insert(vesselClockChange)
      .values({
        companyId: access.company.id,
        vesselId: target.id,
        effectiveAt,
        fromTimeZone: zoneBefore,
        timeZone: input.zone,
        note: input.note,
        enteredBy: access.user.id,
      })
      .onConflictDoNothing()
      .returning({ id: vesselClockChange.id });
    if (inserted.length === 0) {
      throw new AppError("conflict", `A change of the clock is already entered for ${formatShipTime(effectiveAt, zoneBefore)}.`);
    }
    // The next change, if one comes later, now starts from this zone.
    await tx.execute(sql`
      update vessel_clock_change set from_time_zone = ${input.zone}
       where id = (select id from vessel_clock_change
                    where company_id = ${access.company.id} and vessel_id = ${target.id} and effective_at > ${effectiveAt}
                    order by effective_at limit 1)`);
    if (effectiveAt <= now) {
      await moveToZoneInForce(tx, target.id, now);
      await requestRecompute(tx, access.company.id, target.id);
    }
  });
  return loadShipClock(access, { ...target, timeZone: (await zoneNow(target.id)) ?? target.timeZone }, now);
}

async function zoneNow(vesselId: string): Promise<string | null> {
  const [v] = await getDb().select({ timeZone: vessel.timeZone }).from(vessel).where(eq(vessel.id, vesselId));
  return v?.timeZone ?? null;
}

type Connection = Pick<Db, "execute">;

/** Sets the vessel's zone to the one of its latest change in force; true when it moved. */
async function moveToZoneInForce(db: Connection, vesselId: string, now: Date): Promise<boolean> {
  const { rows } = await db.execute<{ id: string }>(sql`
    update vessel v set time_zone = c.time_zone
      from (select time_zone from vessel_clock_change
             where vessel_id = ${vesselId} and effective_at <= ${now}
             order by effective_at desc limit 1) c
     where v.id = ${vesselId} and v.time_zone <> c.time_zone
     returning v.id`);
  return rows.length > 0;
}

/**
 * The worker's step (every five minutes): every vessel whose latest change in force names another
 * zone than it keeps moves to it, and is recomputed (its ship's days changed).
 */
export async function applyDueClockChanges(db: Db, now = new Date()): Promise<number> {
  return db.transaction(async (tx) => {
    const { rows } = await tx.execute<{ id: string; company_id: string }>(sql`
      update vessel v set time_zone = c.time_zone
        from (select distinct on (vessel_id) vessel_id, time_zone from vessel_clock_change
               where effective_at <= ${now}
               order by vessel_id, effective_at desc) c
       where v.id = c.vessel_id and v.time_zone <> c.time_zone
       returning v.id, v.company_id`);
    for (const r of rows) await requestRecompute(tx, r.company_id, r.id);
    return rows.length;
  });
}

/** The zone the vessel kept at each instant (its clock changes; `zoneAtFrom`). */
export async function vesselZoneAt(companyId: string, target: VesselRef): Promise<(at: Date) => string> {
  const changes = await getDb()
    .select({
      effectiveAt: vesselClockChange.effectiveAt,
      fromTimeZone: vesselClockChange.fromTimeZone,
      timeZone: vesselClockChange.timeZone,
    })
    .from(vesselClockChange)
    .where(and(eq(vesselClockChange.companyId, companyId), eq(vesselClockChange.vesselId, target.id)));
  return zoneAtFrom(changes, target.timeZone);
}
