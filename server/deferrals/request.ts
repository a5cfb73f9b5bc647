// The chief engineer asks to postpone a work order's limit, and may withdraw the request while it
// waits. The request records whether it needs the office, from the work and the company's rule.
import "server-only";
import { and, eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { deferral, workOrder } from "@/db/schema";
import type { Access, VesselRef } from "@/server/auth/access";
import { formatShipDate, shipDay } from "@/server/format/hours";
import { AppError, invalidInput } from "@/server/http/problem";
import type { DeferralRequest, DeferralRequestResult, DeferralResult } from "./contract";
import { chiefDecidesDeferrals, limitInForce, needsOfficeDecision, routineIntervalHours } from "./queries";
import { deferralLimitProblems } from "./rules";
import { giveReason } from "@/server/audit/reason";

const NO_WORK_ORDER = "There is no such work order on this vessel.";
const NO_DEFERRAL = "There is no such deferral request on this vessel.";

export async function requestDeferral(
  access: Access,
  vessel: VesselRef,
  workOrderId: string,
  input: DeferralRequest,
  now = new Date(),
): Promise<DeferralRequestResult> {
  const companyId = access.company.id;
  return getDb().transaction(async (tx) => {
    await giveReason(tx, input.reason);
    // The row lock makes two requests for the same work order wait for each other.
    const [w] = await tx
      .select()
      .from(workOrder)
      .where(and(eq(workOrder.companyId, companyId), eq(workOrder.vesselId, vessel.id), eq(workOrder.id, workOrderId)))
      .for("update");
    if (!w) throw new AppError("not-found", NO_WORK_ORDER);
    if (w.state === "done") throw new AppError("conflict", `${w.number} is done: there is nothing to defer.`);

    const [pending] = await tx
      .select({ requestedAt: deferral.requestedAt })
      .from(deferral)
      .where(and(eq(deferral.companyId, companyId), eq(deferral.workOrderId, w.id), eq(deferral.status, "pending")));
    if (pending) {
      throw new AppError(
        "conflict",
        `${w.number} already has a deferral request awaiting a decision (asked on ${formatShipDate(pending.requestedAt, vessel.timeZone)}): wait for the decision or withdraw that request first.`,
      );
    }

    const limit = limitInForce(w);
    const problems = deferralLimitProblems(input, {
      today: shipDay(now, vessel.timeZone),
      currentDueDay: limit.dueDate ? shipDay(limit.dueDate, vessel.timeZone) : null,
      currentDueHours: limit.dueHours,
      intervalHours: await routineIntervalHours(companyId, w.routineId),
    });
    if (problems.length) throw invalidInput(problems);

    const needsOffice = needsOfficeDecision(w, await chiefDecidesDeferrals(companyId));
    const [created] = await tx
      .insert(deferral)
      .values({
        companyId,
        vesselId: vessel.id,
        workOrderId: w.id,
        status: "pending",
        reason: input.reason,
        proposedDueDay: input.proposedDueDay,
        proposedDueHours: input.proposedDueHours,
        needsOffice,
        requestedBy: access.user.id,
        requestedAt: now,
      })
      .returning({ id: deferral.id });
    return { id: created!.id, status: "pending", workOrderState: w.state, needsOffice };
  });
}

/** The chief takes back a request nobody has decided yet; who withdrew it is kept. */
export async function withdrawDeferral(
  access: Access,
  vessel: VesselRef,
  deferralId: string,
  now = new Date(),
): Promise<DeferralResult> {
  const companyId = access.company.id;
  return getDb().transaction(async (tx) => {
    const [row] = await tx
      .select({ d: deferral, number: workOrder.number, state: workOrder.state })
      .from(deferral)
      .innerJoin(workOrder, eq(workOrder.id, deferral.workOrderId))
      .where(and(eq(deferral.companyId, companyId), eq(deferral.vesselId, vessel.id), eq(deferral.id, deferralId)))
      .for("update", { of: deferral });
    if (!row) throw new AppError("not-found", NO_DEFERRAL);
    if (row.d.status !== "pending") {
      throw new AppError("conflict", `The deferral request for ${row.number} is ${row.d.status} already.`);
    }
    await tx
      .update(deferral)
      .set({ status: "withdrawn", decidedBy: access.user.id, decidedAt: now })
      .where(eq(deferral.id, row.d.id));
    return { id: row.d.id, status: "withdrawn", workOrderState: row.state };
  });
}
