// The decision on a deferral request: the superintendent decides any; the chief engineer only
// work neither critical nor class-related, and only where the company lets him. An approval puts
// the work order in `deferred` with the new limit; the worker then applies the tolerance rules to it.
import "server-only";
import { and, eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { deferral, workOrder, workOrderStateChange } from "@/db/schema";
import type { Access, VesselRef } from "@/server/auth/access";
import { lockVesselWorkOrders } from "@/server/work-orders/lock";
import { requestRecompute } from "@/server/jobs/recompute-vessel";
import { AppError } from "@/server/http/problem";
import { endOfShipDate, shipDateFromKey } from "@/server/scheduling/ship-date";
import { COMPANY_OFFICE_MESSAGE, type DeferralDecision, type DeferralResult, OFFICE_ONLY_MESSAGE } from "./contract";
import { chiefDecidesDeferrals } from "./queries";
import { giveReason } from "@/server/audit/reason";

export async function decideDeferral(
  access: Access,
  vessel: VesselRef,
  deferralId: string,
  decision: DeferralDecision,
  now = new Date(),
): Promise<DeferralResult> {
  const companyId = access.company.id;
  const chiefDecides = await chiefDecidesDeferrals(companyId);
  return getDb().transaction(async (tx) => {
    await giveReason(tx, decision.note);
    // The worker's lock: a recompute running now must not write the old state over the new one.
    await lockVesselWorkOrders(tx, vessel.id);
    const [row] = await tx
      .select({ d: deferral, w: workOrder })
      .from(deferral)
      .innerJoin(workOrder, eq(workOrder.id, deferral.workOrderId))
      .where(
        and(
          eq(deferral.companyId, companyId),
          eq(deferral.vesselId, vessel.id),
          eq(workOrder.companyId, companyId),
          eq(deferral.id, deferralId),
        ),
      )
      .for("update");
    if (!row) throw new AppError("not-found", "There is no such deferral request on this vessel.");
    const { d, w } = row;

    if (access.role !== "superintendent") {
      // The work's flags as they are now, too: a component marked critical since the request counts.
      if (w.critical || w.classRelated) throw new AppError("forbidden", OFFICE_ONLY_MESSAGE);
      // Asked while the company had the office decide (d.needsOffice), or the office decides now.
      if (d.needsOffice || !chiefDecides) throw new AppError("forbidden", COMPANY_OFFICE_MESSAGE);
    }
    if (d.status !== "pending") {
      throw new AppError("conflict", `The deferral request for ${w.number} is ${d.status} already.`);
    }

    const decided = { decidedBy: access.user.id, decidedAt: now, decisionNote: decision.note || null };
    if (decision.decision === "reject") {
      await tx
        .update(deferral)
        .set({ ...decided, status: "rejected" })
        .where(eq(deferral.id, d.id));
      return { id: d.id, status: "rejected", workOrderState: w.state };
    }
    if (w.state === "done") {
      throw new AppError("conflict", `${w.number} is done already: withdraw or reject this request instead.`);
    }

    await tx
      .update(deferral)
      .set({ ...decided, status: "approved" })
      .where(eq(deferral.id, d.id));
    // A limit the request leaves out stays as it is in force (an earlier deferral's, or none).
    await tx
      .update(workOrder)
      .set({
        deferredDueDate: d.proposedDueDay
          ? endOfShipDate(shipDateFromKey(d.proposedDueDay), vessel.timeZone)
          : w.deferredDueDate,
        deferredDueHours: d.proposedDueHours ?? w.deferredDueHours,
        state: "deferred",
        stateChangedAt: w.state === "deferred" ? w.stateChangedAt : now,
      })
      .where(eq(workOrder.id, w.id));
    if (w.state !== "deferred") {
      await tx
        .insert(workOrderStateChange)
        .values({ companyId, workOrderId: w.id, fromState: w.state, toState: "deferred", changedAt: now });
    }
    // The worker measures the tolerance windows from the new limit.
    await requestRecompute(tx, companyId, vessel.id);
    return { id: d.id, status: "approved", workOrderState: "deferred" };
  });
}
