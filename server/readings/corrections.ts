// Correcting or removing a mistyped reading. The reading row itself changes (or goes); every change
// leaves a `reading_correction` row with who, when, the old and new value and the reason, which
// outlives the reading. Only readings of the meter fitted now may change: an older meter's readings
// are what its offset was worked out from.
import "server-only";
import { and, desc, eq, gte } from "drizzle-orm";
import { getDb, type Tx } from "@/db/client";
import { counter, reading, readingCorrection, user } from "@/db/schema";
import type { Access, VesselRef } from "@/server/auth/access";
import { formatHours, formatShipDate, formatShipTime } from "@/server/format/hours";
import { requestRecompute } from "@/server/jobs/recompute-vessel";
import { AppError, invalidInput } from "@/server/http/problem";
import type { ReadingCorrection, ReadingCorrectionEntry, ReadingCorrectionResult } from "./contract";
import { loadNeighbours } from "./neighbours";
import { readingProblem, removalProblem, round1 } from "./rules";
import { giveReason } from "@/server/audit/reason";

type Scope = { access: Access; vessel: VesselRef };
type Locked = {
  reading: typeof reading.$inferSelect;
  counter: { id: string; name: string; currentSegment: number };
};

export async function correctReading(
  { access, vessel }: Scope,
  readingId: string,
  input: ReadingCorrection,
): Promise<ReadingCorrectionResult> {
  return getDb().transaction(async (tx) => {
    await giveReason(tx, input.reason);
    const locked = await lockReading(tx, { access, vessel }, readingId);
    const { reading: old } = locked;
    const remark = input.remark === undefined ? old.remark : input.remark || null;
    if (input.value === old.meterValue && remark === old.remark) {
      throw invalidInput([
        { field: "value", message: `The reading already shows ${formatHours(old.meterValue)}: nothing to correct.` },
      ]);
    }

    const neighbours = (await loadNeighbours(tx, access.company.id, [old.counterId], old.readAt, old.id)).get(
      old.counterId,
    );
    if (!neighbours) throw noSuchReading();
    const problem = readingProblem(neighbours.context, input.value, old.readAt, vessel.timeZone);
    if (problem) throw invalidInput([{ field: "value", message: problem }]);

    const [updated] = await tx
      .update(reading)
      .set({ meterValue: input.value, totalHours: round1(input.value + neighbours.offsetHours), remark })
      .where(and(eq(reading.companyId, access.company.id), eq(reading.id, old.id)))
      .returning();
    const correction = await writeAudit(tx, { access, vessel }, old, {
      kind: "corrected",
      newMeterValue: input.value,
      newRemark: remark,
      reason: input.reason,
    });
    await requestRecompute(tx, access.company.id, vessel.id);
    return {
      reading: {
        id: updated!.id,
        readAt: updated!.readAt.toISOString(),
        meterValue: updated!.meterValue,
        totalHours: updated!.totalHours,
        remark: updated!.remark,
      },
      correction,
    };
  });
}

export async function removeReading(
  { access, vessel }: Scope,
  readingId: string,
  reason: string,
): Promise<ReadingCorrectionResult> {
  return getDb().transaction(async (tx) => {
    await giveReason(tx, reason);
    const { reading: old } = await lockReading(tx, { access, vessel }, readingId);
    const neighbours = (await loadNeighbours(tx, access.company.id, [old.counterId], old.readAt, old.id)).get(
      old.counterId,
    );
    if (!neighbours) throw noSuchReading();
    const problem = removalProblem(neighbours.context, vessel.timeZone);
    if (problem) throw invalidInput([{ field: "reading", message: problem }]);

    // The audit row first, while the reading it names still exists; the delete then sets its
    // reading_id to null and the row keeps the counter, the instant and the value.
    const correction = await writeAudit(tx, { access, vessel }, old, {
      kind: "removed",
      newMeterValue: null,
      newRemark: null,
      reason,
    });
    await tx.delete(reading).where(and(eq(reading.companyId, access.company.id), eq(reading.id, old.id)));
    await requestRecompute(tx, access.company.id, vessel.id);
    return { reading: null, correction };
  });
}

/**
 * The reading of this vessel, with its counter locked FOR UPDATE as a new reading locks it, so a
 * correction and a new reading of the same counter are checked one after the other. One counter
 * only, so the id-order rule for several counters holds trivially.
 */
async function lockReading(tx: Tx, { access, vessel }: Scope, readingId: string): Promise<Locked> {
  const scope = and(
    eq(reading.companyId, access.company.id),
    eq(reading.vesselId, vessel.id),
    eq(reading.id, readingId),
  );
  const [found] = await tx.select({ counterId: reading.counterId }).from(reading).where(scope);
  if (!found) throw noSuchReading();

  const [c] = await tx
    .select({
      id: counter.id,
      name: counter.name,
      currentSegment: counter.currentSegment,
      retiredAt: counter.retiredAt,
    })
    .from(counter)
    .where(
      and(eq(counter.companyId, access.company.id), eq(counter.vesselId, vessel.id), eq(counter.id, found.counterId)),
    )
    .for("update");
  // Read again under the lock: another correction may have removed it meanwhile.
  const [row] = await tx.select().from(reading).where(scope);
  if (!c || !row) throw noSuchReading();
  if (c.retiredAt) {
    throw new AppError(
      "conflict",
      `${c.name} was retired on ${formatShipDate(c.retiredAt, vessel.timeZone)}; its readings are kept as they were.`,
    );
  }
  if (row.segment !== c.currentSegment) {
    throw invalidInput([
      {
        field: "reading",
        message: `This reading (${formatHours(row.meterValue)} on ${formatShipTime(row.readAt, vessel.timeZone)}) belongs to meter ${row.segment} of ${c.name}, which has since been replaced; only readings of the meter fitted now can be corrected or removed.`,
      },
    ]);
  }
  return { reading: row, counter: c };
}

async function writeAudit(
  tx: Tx,
  { access, vessel }: Scope,
  old: typeof reading.$inferSelect,
  change: { kind: "corrected" | "removed"; newMeterValue: number | null; newRemark: string | null; reason: string },
): Promise<ReadingCorrectionEntry> {
  const [row] = await tx
    .insert(readingCorrection)
    .values({
      companyId: access.company.id,
      vesselId: vessel.id,
      readingId: old.id,
      counterId: old.counterId,
      readAt: old.readAt,
      segment: old.segment,
      kind: change.kind,
      oldMeterValue: old.meterValue,
      newMeterValue: change.newMeterValue,
      oldRemark: old.remark,
      newRemark: change.newRemark,
      reason: change.reason,
      correctedBy: access.user.id,
    })
    .returning();
  return toEntry({ ...row!, by: access.user.name });
}

function toEntry(row: typeof readingCorrection.$inferSelect & { by: string | null }): ReadingCorrectionEntry {
  return {
    id: row.id,
    kind: row.kind,
    readAt: row.readAt.toISOString(),
    oldMeterValue: row.oldMeterValue,
    newMeterValue: row.newMeterValue,
    reason: row.reason,
    by: row.by,
    at: row.correctedAt.toISOString(),
  };
}

/** The audit trail of a counter's readings from `since` on (the history's window), newest first. */
export async function correctionsSince(
  companyId: string,
  counterId: string,
  since: Date,
): Promise<(ReadingCorrectionEntry & { readingId: string | null })[]> {
  const rows = await getDb()
    .select({ correction: readingCorrection, by: user.name })
    .from(readingCorrection)
    .leftJoin(user, eq(user.id, readingCorrection.correctedBy))
    .where(
      and(
        eq(readingCorrection.companyId, companyId),
        eq(readingCorrection.counterId, counterId),
        gte(readingCorrection.readAt, since),
      ),
    )
    .orderBy(desc(readingCorrection.correctedAt));
  return rows.map((r) => ({ ...toEntry({ ...r.correction, by: r.by }), readingId: r.correction.readingId }));
}

function noSuchReading(): AppError {
  return new AppError("not-found", "There is no such reading on this vessel.");
}
