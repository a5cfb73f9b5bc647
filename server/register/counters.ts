// Counters of the register: add, edit, retire, and the replacement of a counter's hour meter.
import "server-only";
import { and, asc, desc, eq, max, sql } from "drizzle-orm";
import { getDb, type Tx } from "@/db/client";
import { component, counter, counterSegment, reading } from "@/db/schema";
import type { Access, VesselRef } from "@/server/auth/access";
import { formatHours, formatShipDate, formatShipTime, instantOfShipTime, shipDay } from "@/server/format/hours";
import { AppError, invalidInput } from "@/server/http/problem";
import { requestRecompute } from "@/server/jobs/recompute-vessel";
import { isInFuture, readingProblem, round1 } from "@/server/readings/rules";
import type { CounterChange, MeterReplacement, MeterReplacementResult, NewCounter, RegisterCounter } from "./contract";
import { counterScope, lockRegister, noSuch, type RegisterScope } from "./register-scope";

export type CounterSummary = Pick<RegisterCounter, "id" | "name" | "plannedHoursPerDay" | "segment" | "retiredAt">;

function toSummary(row: typeof counter.$inferSelect): CounterSummary {
  return {
    id: row.id,
    name: row.name,
    plannedHoursPerDay: row.plannedHoursPerDay,
    segment: row.currentSegment,
    retiredAt: row.retiredAt?.toISOString() ?? null,
  };
}

/** Names are compared without case: "Main Engine" beside "Main engine" would only confuse the Hour log. */
async function checkNameFree(tx: Tx, scope: RegisterScope, name: string, exceptId: string | null): Promise<void> {
  const [holder] = await tx
    .select({ id: counter.id, name: counter.name, retiredAt: counter.retiredAt })
    .from(counter)
    .where(and(counterScope(scope), sql`lower(${counter.name}) = lower(${name})`));
  if (!holder || holder.id === exceptId) return;
  throw invalidInput([
    {
      field: "name",
      message: holder.retiredAt
        ? `A retired counter of this vessel is named ${holder.name}; choose another name.`
        : `There is already a counter named ${holder.name} on this vessel.`,
    },
  ]);
}

/** The counter, locked until the transaction ends so that readings and a replacement queue up. */
async function lockCounter(tx: Tx, scope: RegisterScope, counterId: string, purpose: string) {
  const [row] = await tx
    .select()
    .from(counter)
    .where(and(counterScope(scope), eq(counter.id, counterId)))
    .for("update");
  if (!row) throw noSuch("counter", scope.vessel);
  if (row.retiredAt) {
    const on = formatShipDate(row.retiredAt, scope.vessel.timeZone);
    throw new AppError("conflict", `${row.name} was retired on ${on}; ${purpose}.`);
  }
  return row;
}

export async function createCounter(
  access: Access,
  vessel: VesselRef,
  input: NewCounter,
  now = new Date(),
): Promise<CounterSummary> {
  const scope = { access, vessel };
  return getDb().transaction(async (tx) => {
    await lockRegister(tx, vessel);
    await checkNameFree(tx, scope, input.name, null);
    const [last] = await tx
      .select({ sortOrder: max(counter.sortOrder) })
      .from(counter)
      .where(counterScope(scope));
    const [row] = await tx
      .insert(counter)
      .values({
        companyId: access.company.id,
        vesselId: vessel.id,
        name: input.name,
        plannedHoursPerDay: input.plannedHoursPerDay,
        sortOrder: (last?.sortOrder ?? -1) + 1,
      })
      .returning();
    // The first meter is a segment like any other, so a later replacement has its start to show.
    await tx.insert(counterSegment).values({
      companyId: access.company.id,
      counterId: row!.id,
      segment: 1,
      startedAt: now,
      startMeter: 0,
      offsetHours: 0,
      createdBy: access.user.id,
    });
    await requestRecompute(tx, access.company.id, vessel.id);
    return toSummary(row!);
  });
}

export async function updateCounter(
  access: Access,
  vessel: VesselRef,
  counterId: string,
  change: CounterChange,
): Promise<CounterSummary> {
  const scope = { access, vessel };
  return getDb().transaction(async (tx) => {
    await lockRegister(tx, vessel);
    const current = await lockCounter(tx, scope, counterId, "a retired counter is kept as it was");
    if (change.name !== undefined) await checkNameFree(tx, scope, change.name, current.id);
    const [row] = await tx
      .update(counter)
      .set({ name: change.name, plannedHoursPerDay: change.plannedHoursPerDay })
      .where(and(counterScope(scope), eq(counter.id, current.id)))
      .returning();
    // A planned rate stands in for a short history: the due dates it projects change with it.
    if (change.plannedHoursPerDay !== undefined) await requestRecompute(tx, access.company.id, vessel.id);
    return toSummary(row!);
  });
}

/**
 * Takes a counter out of use; its readings stay for the records. Refused while a component still
 * has it as its own counter, since that component (and those below it) would lose its hours.
 */
export async function retireCounter(
  access: Access,
  vessel: VesselRef,
  counterId: string,
  now = new Date(),
): Promise<CounterSummary> {
  const scope = { access, vessel };
  return getDb().transaction(async (tx) => {
    await lockRegister(tx, vessel);
    const current = await lockCounter(tx, scope, counterId, "it is already out of use");
    const users = await tx
      .select({ code: component.code, name: component.name })
      .from(component)
      .where(
        and(
          eq(component.companyId, access.company.id),
          eq(component.vesselId, vessel.id),
          eq(component.counterId, current.id),
        ),
      )
      .orderBy(asc(component.code));
    if (users.length) {
      const named = users.slice(0, 5).map((u) => `${u.code} ${u.name}`);
      const more = users.length > 5 ? ` and ${users.length - 5} more` : "";
      throw new AppError(
        "conflict",
        `${current.name} is still the counter of ${named.join(", ")}${more}. Give ${users.length === 1 ? "it" : "them"} another counter, or none, before retiring it.`,
      );
    }
    const [row] = await tx
      .update(counter)
      .set({ retiredAt: now })
      .where(and(counterScope(scope), eq(counter.id, current.id)))
      .returning();
    return toSummary(row!);
  });
}

/**
 * A new hour meter on a counter (PRODUCT.md: "a replaced meter starts a new segment with an offset
 * so totals stay continuous"). In one transaction: the old meter's final value is stored as its
 * last reading, the new segment starts at the replacement instant, and
 * offset = total at replacement − value shown by the new meter.
 */
export async function replaceMeter(
  access: Access,
  vessel: VesselRef,
  counterId: string,
  input: MeterReplacement,
  now = new Date(),
): Promise<MeterReplacementResult> {
  const { timeZone } = vessel;
  const replacedAt = instantOfShipTime(input.replacedAt.shipDay, input.replacedAt.time, timeZone);
  if (isInFuture(replacedAt, now)) {
    throw invalidInput([
      {
        field: "replacedAt.time",
        message: `${input.replacedAt.shipDay} ${input.replacedAt.time} ship’s time is in the future: the ship’s day is ${shipDay(now, timeZone)}.`,
      },
    ]);
  }
  const scope = { access, vessel };
  return getDb().transaction(async (tx) => {
    const current = await lockCounter(tx, scope, counterId, "its meter can no longer be replaced");
    const [segment] = await tx
      .select()
      .from(counterSegment)
      .where(
        and(
          eq(counterSegment.companyId, access.company.id),
          eq(counterSegment.counterId, current.id),
          eq(counterSegment.segment, current.currentSegment),
        ),
      );
    const [last] = await tx
      .select({ readAt: reading.readAt, meterValue: reading.meterValue, totalHours: reading.totalHours })
      .from(reading)
      .where(
        and(
          eq(reading.companyId, access.company.id),
          eq(reading.counterId, current.id),
          eq(reading.segment, current.currentSegment),
        ),
      )
      .orderBy(desc(reading.readAt))
      .limit(1);
    const offset = segment?.offsetHours ?? 0;
    // Segment 1's start is when the counter was set up, not a meter change: readings may predate it.
    const fittedAt = current.currentSegment > 1 && segment ? segment.startedAt : null;

    if (last && last.readAt > replacedAt) {
      throw invalidInput([
        {
          field: "replacedAt.time",
          message: `The old meter was still read at ${formatShipTime(last.readAt, timeZone)} (${formatHours(last.meterValue)}); the replacement must come after its last reading.`,
        },
      ]);
    }
    if (fittedAt && replacedAt <= fittedAt) {
      throw invalidInput([
        {
          field: "replacedAt.time",
          message: `The meter fitted now was fitted on ${formatShipTime(fittedAt, timeZone)}; its replacement must come after that.`,
        },
      ]);
    }

    let totalAtReplacement = last?.totalHours ?? round1((segment?.startMeter ?? 0) + offset);
    let finalReadingStored = false;
    const final = input.oldMeterFinal;
    const sameInstant = last && last.readAt.getTime() === replacedAt.getTime() ? last : null;
    // The final value read at the instant of the last reading is that reading: nothing to store.
    if (final !== null && sameInstant?.meterValue !== final) {
      const fittedStart = fittedAt && segment ? { readAt: fittedAt, meterValue: segment.startMeter } : null;
      const previous = sameInstant ? null : (last ?? fittedStart);
      const problem = readingProblem(
        { name: current.name, segmentStartedAt: fittedAt, previous, next: null, existingAtSameInstant: sameInstant },
        final,
        replacedAt,
        timeZone,
      );
      if (problem) {
        const reason = `${problem[0]!.toLowerCase()}${problem.slice(1)}`;
        throw invalidInput([{ field: "oldMeterFinal", message: `Final value on the old meter: ${reason}` }]);
      }
      totalAtReplacement = round1(final + offset);
      await tx.insert(reading).values({
        companyId: access.company.id,
        vesselId: vessel.id,
        counterId: current.id,
        readAt: replacedAt,
        segment: current.currentSegment,
        meterValue: final,
        totalHours: totalAtReplacement,
        enteredBy: access.user.id,
        remark: "Final value of the old meter, read at its replacement",
      });
      finalReadingStored = true;
    }

    const next = current.currentSegment + 1;
    const offsetHours = round1(totalAtReplacement - input.newMeterStart);
    await tx.insert(counterSegment).values({
      companyId: access.company.id,
      counterId: current.id,
      segment: next,
      startedAt: replacedAt,
      startMeter: input.newMeterStart,
      offsetHours,
      reason: input.reason,
      createdBy: access.user.id,
    });
    await tx
      .update(counter)
      .set({ currentSegment: next })
      .where(and(counterScope(scope), eq(counter.id, current.id)));
    await requestRecompute(tx, access.company.id, vessel.id);
    return {
      segment: next,
      startedAt: replacedAt.toISOString(),
      startMeter: input.newMeterStart,
      offsetHours,
      finalReadingStored,
    };
  });
}
