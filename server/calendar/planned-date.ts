// The chief engineer's planned day for a work order: kept beside the computed due date, never in
// its place, and only on a day inside the work order's tolerance window.
import "server-only";
import { eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { workOrder } from "@/db/schema";
import type { Access, VesselRef } from "@/server/auth/access";
import { lockWorkOrder } from "@/server/work-orders/lock";
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
  return getDb().transaction(async (tx) => {
    // Under the worker's lock: a recompute must not write planFrom/planUntil while we check against them.
    const w = await lockWorkOrder(tx, access, vessel, workOrderId);
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
