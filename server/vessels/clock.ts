import "server-only";
import { and, desc, eq, sql } from "drizzle-orm";
import { type Db, getDb, type Tx } from "@/db/client";
import { user, vessel, vesselClockChange } from "@/db/schema";
import type { Access, VesselRef } from "@/server/auth/access";
import { can } from "@/server/auth/roles";
import { formatShipTime, instantOfShipTime } from "@/server/format/hours";
import { AppError, invalidInput } from "@/server/http/problem";
import { requestRecompute } from "@/server/jobs/recompute-vessel";
import { type ClockChangePoint, clockMoveWords, zoneAtFrom, zoneWords } from "./clock-rules";
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
  const zoneAfter = await getDb().transaction(async (tx) => {
    // One change at a time per vessel: the zone before it must not move under us.
    const [v] = await tx
      .select({ timeZone: vessel.timeZone })
      .from(vessel)
      .where(and(eq(vessel.companyId, access.company.id), eq(vessel.id, target.id)))
      .for("update");
    if (!v) throw new AppError("not-found", "No such vessel.");
    // The day and time are read on the clock kept at that moment, from the history: a change entered
    // between two others, or after one still to come, is read on the clock that one sets.
    const zoneAt = zoneAtFrom(await clockHistory(tx, access.company.id, target.id), v.timeZone);
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
    const moved = effectiveAt <= now ? await moveToZonesInForce(tx, now, target.id) : [];
    return moved[0]?.time_zone ?? v.timeZone;
  });
  return loadShipClock(access, { ...target, timeZone: zoneAfter }, now);
}

/**
 * Moves every vessel (or the one given) whose latest clock change in force names another zone than
 * it keeps to that zone, and asks for its recompute (its ship's days changed).
 */
async function moveToZonesInForce(tx: Tx, now: Date, vesselId?: string) {
  const { rows } = await tx.execute<{ id: string; company_id: string; time_zone: string }>(sql`
    update vessel v set time_zone = c.time_zone
      from (select distinct on (vessel_id) vessel_id, time_zone from vessel_clock_change
             where effective_at <= ${now} ${vesselId ? sql`and vessel_id = ${vesselId}` : sql``}
             order by vessel_id, effective_at desc) c
     where v.id = c.vessel_id and v.time_zone <> c.time_zone
     returning v.id, v.company_id, v.time_zone`);
  for (const r of rows) await requestRecompute(tx, r.company_id, r.id);
  return rows;
}

/** The worker's step (every five minutes): a change entered ahead takes effect when it falls due. */
export async function applyDueClockChanges(db: Db, now = new Date()): Promise<number> {
  return (await db.transaction((tx) => moveToZonesInForce(tx, now))).length;
}

function clockHistory(db: Db | Tx, companyId: string, vesselId: string): Promise<ClockChangePoint[]> {
  return db
    .select({
      effectiveAt: vesselClockChange.effectiveAt,
      fromTimeZone: vesselClockChange.fromTimeZone,
      timeZone: vesselClockChange.timeZone,
    })
    .from(vesselClockChange)
    .where(and(eq(vesselClockChange.companyId, companyId), eq(vesselClockChange.vesselId, vesselId)));
}

/** The zone the vessel kept at each instant (its clock changes; `zoneAtFrom`). */
export async function vesselZoneAt(companyId: string, target: VesselRef): Promise<(at: Date) => string> {
  return zoneAtFrom(await clockHistory(getDb(), companyId, target.id), target.timeZone);
}
