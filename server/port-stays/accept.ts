// Accepting a port stay's work package as the chief edited it: every item is checked against the
// work order, the stay's days, the work order's plannable days, the crew's hours per rank and day
// and the immobilisation time, all under the vessel's work-order lock; any problem refuses the whole
// package (422, one entry per item) and nothing is written.
import "server-only";
import { format, parseISO } from "date-fns";
import { and, eq, inArray } from "drizzle-orm";
import { getDb } from "@/db/client";
import { portStay, workOrder, workPackageItem } from "@/db/schema";
import type { Access, VesselRef } from "@/server/auth/access";
import { lockVesselWorkOrders } from "@/server/completions/follow-up";
import { formatHours } from "@/server/format/hours";
import { AppError, type FieldError, invalidInput } from "@/server/http/problem";
import type { PackageInput, PackageResult } from "./contract";
import { clearPlannedDates, findStay, packagedElsewhere } from "./queries";
import { stayDays } from "./stay-days";

/** Said when the chief put a job in by hand, not from the proposal. */
export const ADDED_BY_HAND = "Added to the package by the chief engineer.";

// Hours in tenths, as the planner counts them (server/planning/proposal.ts): capacity rounded down,
// work rounded up, so sums of decimals never let a day run over.
const capacityTenths = (h: number) => (h > 0 ? Math.floor(h * 10 + 1e-6) : 0);
const needTenths = (h: number) => (h > 0 ? Math.ceil(h * 10 - 1e-6) : 0);

const rankWords = (rank: string) => rank.replaceAll("-", " ");
const day = (d: string) => format(parseISO(d), "d MMM yyyy");

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
    const perDay = new Map<string, number>();
    for (const { rank, manHoursPerDay } of stay.crew) perDay.set(rank, (perDay.get(rank) ?? 0) + capacityTenths(manHoursPerDay));
    const allowedStop = stay.engineMayStop ? capacityTenths(stay.immobilisationHours) : 0;
    const used = new Map<string, number>();
    let stopUsed = 0;
    const errors: FieldError[] = [];

    input.items.forEach((item, n) => {
      const at = (field: string, message: string) => errors.push({ field: `items.${n}.${field}`, row: n, message });
      const w = byId.get(item.workOrderId);
      if (!w) return at("workOrderId", "There is no such work order on this vessel.");
      if (w.state === "done") return at("workOrderId", `${w.number} is done already.`);
      const other = elsewhere.get(w.id);
      if (other) {
        return at("workOrderId", `${w.number} is in the package of ${other.port} on ${day(other.date)}; take it out there first.`);
      }
      if (!days.has(item.date)) return at("date", `${day(item.date)} is not a day of this stay (${[...days].map(day).join(", ")}).`);
      if ((w.planFrom && item.date < w.planFrom) || (w.planUntil && item.date > w.planUntil)) {
        return at(
          "date",
          `${w.number} may be planned only ${w.planFrom ? `from ${day(w.planFrom)} ` : ""}${w.planUntil ? `until ${day(w.planUntil)}` : ""}, inside its tolerance window.`,
        );
      }
      const key = `${item.date}|${w.rank}`;
      const need = needTenths(w.estimatedManHours);
      const total = (used.get(key) ?? 0) + need;
      const available = perDay.get(w.rank) ?? 0;
      if (total > available) {
        return at(
          "date",
          `On ${day(item.date)} the ${rankWords(w.rank)} would have ${formatHours(total / 10)} of work, more than the ${formatHours(available / 10)} on board.`,
        );
      }
      used.set(key, total);
      if (w.needsEngineStop) {
        if (stopUsed + need > allowedStop) {
          return at(
            "workOrderId",
            allowedStop === 0
              ? `${w.number} needs the engine stopped, and no immobilisation is allowed in this stay.`
              : `${w.number} needs the engine stopped: with it the package would take ${formatHours((stopUsed + need) / 10)} of the ${formatHours(allowedStop / 10)} immobilisation allowed.`,
          );
        }
        stopUsed += need;
      }
    });
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
