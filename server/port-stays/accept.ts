// Accepting a port stay's work package as the chief edited it: every item is checked against the
// work order, the stay's days, the work order's plannable days, the crew's hours per rank and day
// and the immobilisation time, all under the vessel's work-order lock; any problem refuses the whole
// package (422, one entry per item) and nothing is written.
import "server-only";
import { and, eq, inArray } from "drizzle-orm";
import { getDb } from "@/db/client";
import { portStay, workOrder, workPackageItem } from "@/db/schema";
import type { Access, VesselRef } from "@/server/auth/access";
import { lockVesselWorkOrders } from "@/server/work-orders/lock";
import { AppError, type FieldError, invalidInput } from "@/server/http/problem";
import type { PackageInput, PackageResult } from "./contract";
import { capacityProblems, type PackageJob, packageDay as day } from "./capacity";
import { clearPlannedDates, findStay, packagedElsewhere } from "./queries";
import { stayDays } from "./stay-days";

/** Said when the chief put a job in by hand, not from the proposal. */
export const ADDED_BY_HAND = "Added to the package by the chief engineer.";

export async function acceptPackage(
  access: Access,
  vessel: VesselRef,
  stayId: string,
  input: PackageInput,
  now = new Date(),
): Promise<PackageResult> {
  const companyId = access.company.id;
  return getDb().transaction(async (tx) => {
    await lockVesselWorkOrders(tx, vessel.id);
    const stay = await findStay(tx, access, vessel, stayId);
    if (stay.departsAt <= now) {
      throw new AppError("conflict", `${stay.port} is over: its package can no longer be changed.`);
    }
    const ids = input.items.map((i) => i.workOrderId);
    const orders = ids.length
      ? await tx
          .select()
          .from(workOrder)
          .where(and(eq(workOrder.companyId, companyId), eq(workOrder.vesselId, vessel.id), inArray(workOrder.id, ids)))
      : [];
    const byId = new Map(orders.map((o) => [o.id, o]));
    const elsewhere = await packagedElsewhere(tx, companyId, vessel.id, stay.id, now, ids);

    const days = new Set(stayDays(stay.arrivesAt, stay.departsAt, vessel.timeZone));
    const errors: FieldError[] = [];
    const at = (n: number, field: string, message: string) => errors.push({ field: `items.${n}.${field}`, row: n, message });
    // The items that pass the checks of their own, with their place in the input.
    const fitting: { n: number; job: PackageJob }[] = [];

    input.items.forEach((item, n) => {
      const w = byId.get(item.workOrderId);
      if (!w) return at(n, "workOrderId", "There is no such work order on this vessel.");
      if (w.state === "done") return at(n, "workOrderId", `${w.number} is done already.`);
      const other = elsewhere.get(w.id);
      if (other) {
        return at(n, "workOrderId", `${w.number} is in the package of ${other.port} on ${day(other.date)}; take it out there first.`);
      }
      if (!days.has(item.date)) return at(n, "date", `${day(item.date)} is not a day of this stay (${[...days].map(day).join(", ")}).`);
      if ((w.planFrom && item.date < w.planFrom) || (w.planUntil && item.date > w.planUntil)) {
        return at(
          n,
          "date",
          `${w.number} may be planned only ${w.planFrom ? `from ${day(w.planFrom)} ` : ""}${w.planUntil ? `until ${day(w.planUntil)}` : ""}, inside its tolerance window.`,
        );
      }
      fitting.push({
        n,
        job: { number: w.number, rank: w.rank, manHours: w.estimatedManHours, needsEngineStop: w.needsEngineStop, date: item.date },
      });
    });
    for (const p of capacityProblems(stay, fitting.map((f) => f.job))) {
      at(fitting[p.index]!.n, p.kind === "crew" ? "date" : "workOrderId", p.message);
    }
    errors.sort((a, b) => (a.row ?? 0) - (b.row ?? 0));
    if (errors.length) throw invalidInput(errors, errors.length === 1 ? undefined : `${errors.length} items of the package need correcting; nothing was saved.`);

    // Work taken out of the package loses the planned date this stay gave it.
    const previous = await tx
      .select({ workOrderId: workPackageItem.workOrderId, date: workPackageItem.plannedDate })
      .from(workPackageItem)
      .where(and(eq(workPackageItem.companyId, companyId), eq(workPackageItem.portStayId, stay.id)));
    const keep = new Set(ids);
    const cleared = await clearPlannedDates(tx, companyId, previous.filter((p) => !keep.has(p.workOrderId)));

    await tx.delete(workPackageItem).where(and(eq(workPackageItem.companyId, companyId), eq(workPackageItem.portStayId, stay.id)));
    if (input.items.length) {
      await tx.insert(workPackageItem).values(
        input.items.map((item, position) => ({
          companyId,
          vesselId: vessel.id,
          portStayId: stay.id,
          workOrderId: item.workOrderId,
          plannedDate: item.date,
          reason: item.reason || ADDED_BY_HAND,
          position,
        })),
      );
      for (const item of input.items) {
        await tx
          .update(workOrder)
          .set({ plannedDate: item.date })
          .where(and(eq(workOrder.companyId, companyId), eq(workOrder.id, item.workOrderId)));
      }
    }
    const [stamped] = await tx
      .update(portStay)
      .set({ packageAcceptedAt: now, packageAcceptedBy: access.user.id, updatedAt: now })
      .where(and(eq(portStay.companyId, companyId), eq(portStay.id, stay.id)))
      .returning({ at: portStay.packageAcceptedAt });
    return { acceptedAt: stamped!.at!.toISOString(), items: input.items.length, cleared };
  });
}
