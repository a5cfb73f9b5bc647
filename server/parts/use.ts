// Parts used on a job: taken from the stores on board in the completion's own transaction, and put
// back when the chief engineer returns the completion. Each part is locked per vessel (the same
// lock as every other movement of it), so two jobs taking the last set at once leave the stock
// right and the second is asked to count.
import "server-only";
import { and, asc, eq, inArray, sql } from "drizzle-orm";
import type { Tx } from "@/db/client";
import { part, stockMovement, storeLocation, type UsedPart } from "@/db/schema";
import type { VesselRef } from "@/server/auth/access";
import type { FieldError } from "@/server/http/problem";
import { amountText, type PartUsedRow } from "./contract";
import { drawFrom, q3, stockByLocation, unitProblem } from "./stock";

/** One writer per vessel and part: the stock read after it is the stock the rows land on. */
export async function lockStock(tx: Tx, vesselId: string, partIds: readonly string[]) {
  // Sorted, so two writers of the same parts wait for each other instead of deadlocking.
  for (const id of [...new Set(partIds)].sort()) {
    await tx.execute(sql`select pg_advisory_xact_lock(hashtext(${`stock:${vesselId}:${id}`}))`);
  }
}

type Job = { companyId: string; vessel: VesselRef; userId: string; workOrderId: string; workOrderNumber: string; now: Date };
type Row = typeof stockMovement.$inferInsert;

/**
 * The parts a job used, checked against the stores: the refusals by row, or the movements to write
 * (a count correction first where one was given, then the use, off the fullest shelf first).
 */
export async function checkPartsUsed(tx: Tx, job: Job, rows: readonly PartUsedRow[]): Promise<{ errors: FieldError[]; write: () => Promise<UsedPart[]> }> {
  if (!rows.length) return { errors: [], write: async () => [] };
  const { companyId, vessel } = job;
  const ids = rows.map((r) => r.partId);
  if (new Set(ids).size !== ids.length) {
    return { errors: [{ field: "partsUsed", message: "Each part once: add up the quantities of a part listed twice." }], write: async () => [] };
  }
  await lockStock(tx, vessel.id, ids);
  const [parts, sums, [firstPlace]] = [
    await tx.select().from(part).where(and(eq(part.companyId, companyId), inArray(part.id, ids))),
    await tx
      .select({ partId: stockMovement.partId, locationId: stockMovement.locationId, quantity: sql<string>`sum(${stockMovement.quantity})` })
      .from(stockMovement)
      .where(and(eq(stockMovement.companyId, companyId), eq(stockMovement.vesselId, vessel.id), inArray(stockMovement.partId, ids)))
      .groupBy(stockMovement.partId, stockMovement.locationId),
    await tx
      .select({ id: storeLocation.id })
      .from(storeLocation)
      .where(and(eq(storeLocation.companyId, companyId), eq(storeLocation.vesselId, vessel.id)))
      .orderBy(asc(storeLocation.store), asc(storeLocation.rack), asc(storeLocation.bin))
      .limit(1),
  ];
  const byId = new Map(parts.map((p) => [p.id, p]));
  const errors: FieldError[] = [];
  const movements: Row[] = [];
  const used: UsedPart[] = [];
  const base = { companyId, vesselId: vessel.id, movedBy: job.userId, movedAt: job.now };
  rows.forEach((row, i) => {
    const field = (name: string) => `partsUsed.${i}.${name}`;
    const p = byId.get(row.partId);
    if (!p) {
      errors.push({ field: field("partId"), message: "There is no such part in the catalogue." });
      return;
    }
    const unitRefusal = unitProblem(p.unit, row.quantity, field("quantity")) ?? (row.counted != null ? unitProblem(p.unit, row.counted, field("counted")) : null);
    if (unitRefusal) {
      errors.push(unitRefusal);
      return;
    }
    const held = stockByLocation(sums.filter((s) => s.partId === p.id).map((s) => ({ locationId: s.locationId, quantity: Number(s.quantity) })));
    const recorded = q3([...held.values()].reduce((a, b) => a + b, 0));
    if (row.counted != null) {
      if (row.counted < row.quantity) {
        errors.push({ field: field("counted"), message: `You counted ${amountText(row.counted, p.unit)} before the job; it cannot have used ${amountText(row.quantity, p.unit)}.` });
        return;
      }
      const diff = q3(row.counted - recorded);
      if (diff > 0) {
        // Found more than recorded: it goes on the fullest shelf (or the vessel's first store).
        const shelf = drawFrom(held, Number.MAX_SAFE_INTEGER)[0]?.locationId ?? firstPlace?.id;
        if (!shelf) {
          errors.push({ field: field("counted"), message: `${vessel.name} has no store location yet: add one on the Stores tab, then count.` });
          return;
        }
        movements.push({ ...base, partId: p.id, locationId: shelf, kind: "counted", quantity: diff, reason: row.reason });
        held.set(shelf, q3((held.get(shelf) ?? 0) + diff));
      } else if (diff < 0) {
        for (const take of drawFrom(held, -diff)) {
          movements.push({ ...base, partId: p.id, locationId: take.locationId, kind: "counted", quantity: -take.quantity, reason: row.reason });
          held.set(take.locationId, q3(held.get(take.locationId)! - take.quantity));
        }
      }
    } else if (recorded < row.quantity) {
      errors.push({
        field: field("quantity"),
        message: `${vessel.name} has ${recorded > 0 ? amountText(recorded, p.unit) : "none"} of ${p.number} on record, not ${amountText(row.quantity, p.unit)}. If more was on board, enter what you counted before the job and why the record differs.`,
      });
      return;
    }
    for (const take of drawFrom(held, row.quantity)) {
      movements.push({ ...base, partId: p.id, locationId: take.locationId, kind: "used", quantity: -take.quantity, workOrderId: job.workOrderId, reason: `Used on ${job.workOrderNumber}` });
    }
    used.push({ partId: p.id, number: p.number, description: p.description, unit: p.unit, quantity: row.quantity });
  });
  return {
    errors,
    write: async () => {
      if (movements.length) await tx.insert(stockMovement).values(movements);
      return used;
    },
  };
}

/** A returned completion's parts go back where they were taken from; counts made meanwhile stay. */
export async function putBackPartsUsed(tx: Tx, job: Job): Promise<void> {
  const { companyId, vessel } = job;
  const mine = and(
    eq(stockMovement.companyId, companyId),
    eq(stockMovement.vesselId, vessel.id),
    eq(stockMovement.workOrderId, job.workOrderId),
    inArray(stockMovement.kind, ["used", "returned"]),
  );
  const touched = await tx.selectDistinct({ partId: stockMovement.partId }).from(stockMovement).where(mine);
  if (!touched.length) return;
  await lockStock(
    tx,
    vessel.id,
    touched.map((t) => t.partId),
  );
  const open = await tx
    .select({ partId: stockMovement.partId, locationId: stockMovement.locationId, quantity: sql<string>`sum(${stockMovement.quantity})` })
    .from(stockMovement)
    .where(mine)
    .groupBy(stockMovement.partId, stockMovement.locationId)
    .having(sql`sum(${stockMovement.quantity}) < 0`);
  if (!open.length) return;
  await tx.insert(stockMovement).values(
    open.map((o) => ({
      companyId,
      vesselId: vessel.id,
      partId: o.partId,
      locationId: o.locationId,
      kind: "returned" as const,
      quantity: q3(-Number(o.quantity)),
      workOrderId: job.workOrderId,
      reason: `Put back: ${job.workOrderNumber} returned for correction`,
      movedBy: job.userId,
      movedAt: job.now,
    })),
  );
}
