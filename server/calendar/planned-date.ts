// The chief engineer's planned day for a work order: kept beside the computed due date, never in
// its place, and only on a day inside the work order's tolerance window.
import "server-only";
import { and, eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { workOrder } from "@/db/schema";
import type { Access, VesselRef } from "@/server/auth/access";
import { lockVesselWorkOrders } from "@/server/completions/follow-up";
import { isUuid } from "@/server/completions/queries";
import { shipDayKey } from "@/server/format/ship-day";
import { AppError, invalidInput } from "@/server/http/problem";
import type { PlannedDateInput, PlannedDateResult } from "./contract";
import { dayInWords, isPlannable, outsideWindowMessage } from "./plannable-days";

export async function setPlannedDate(
  access: Access,
  vessel: VesselRef,
  workOrderId: string,
  input: PlannedDateInput,
): Promise<PlannedDateResult> {
  if (!isUuid(workOrderId)) throw new AppError("not-found", "There is no such work order on this vessel.");
  const companyId = access.company.id;
  return getDb().transaction(async (tx) => {
    // The worker's lock: a recompute must not write planFrom/planUntil while we check against them.
    await lockVesselWorkOrders(tx, vessel.id);
    const [w] = await tx
      .select()
      .from(workOrder)
      .where(and(eq(workOrder.companyId, companyId), eq(workOrder.vesselId, vessel.id), eq(workOrder.id, workOrderId)))
      .for("update");
    if (!w) throw new AppError("not-found", "There is no such work order on this vessel.");
    if (w.state === "done") throw new AppError("conflict", `${w.number} is done; a done work order is not planned.`);
    const day = input.plannedDate;
    const today = shipDayKey(Date.now(), vessel.timeZone);
    if (day !== null && day < today) {
      const message = `A planned day is today or later; ${dayInWords(day)} has passed on board.`;
      throw invalidInput([{ field: "plannedDate", message }], message);
    }
    if (day !== null && !isPlannable(day, w)) {
      const message = outsideWindowMessage(w.number, day, w);
      throw invalidInput([{ field: "plannedDate", message }], message);
    }
    await tx.update(workOrder).set({ plannedDate: day }).where(eq(workOrder.id, w.id));
    const due = w.deferredDueDate ?? w.dueDate;
    return {
      id: w.id,
      number: w.number,
      plannedDate: day,
      dueDay: due ? shipDayKey(due.getTime(), vessel.timeZone) : null,
    };
  });
}
