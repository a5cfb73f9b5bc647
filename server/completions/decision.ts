// The chief engineer's decision on a completion: approve it (the work order is done and the worker
// schedules the next occurrence) or return it with a note for the engineer to correct.
import "server-only";
import { and, eq } from "drizzle-orm";
import { z } from "zod";
import { getDb } from "@/db/client";
import { completion, defect, workOrder, workOrderStateChange } from "@/db/schema";
import { closeProblems } from "@/server/defects/rules";
import type { Access, VesselRef } from "@/server/auth/access";
import { AppError, invalidInput } from "@/server/http/problem";
import { requestRecompute } from "@/server/jobs/recompute-vessel";
import { type CompletionStatus, DecisionInput } from "./contract";
import { lockWorkOrder } from "@/server/work-orders/lock";
import { putBackPartsUsed } from "@/server/parts/use";
import { giveReason } from "@/server/audit/reason";

export type Decision = z.output<typeof DecisionInput>;

export async function decideCompletion(
  access: Access,
  vessel: VesselRef,
  workOrderId: string,
  decision: Decision,
  now = new Date(),
): Promise<{ status: CompletionStatus; workOrderState: string }> {
  const companyId = access.company.id;
  return getDb().transaction(async (tx) => {
    await giveReason(tx, decision.note);
    // Under the worker's lock: a recompute running now must not put a done work order back to late.
    const w = await lockWorkOrder(tx, access, vessel, workOrderId);
    const [c] = await tx
      .select()
      .from(completion)
      .where(and(eq(completion.companyId, companyId), eq(completion.workOrderId, w.id)));
    if (!c || c.status !== "awaiting-approval") {
      throw new AppError(
        "conflict",
        c?.status === "approved"
          ? `${w.number} is already approved.`
          : c?.status === "returned"
            ? `${w.number} was returned for correction and has not been resubmitted.`
            : `${w.number} has no completion awaiting approval.`,
      );
    }

    const decided = { decidedBy: access.user.id, decidedAt: now, decisionNote: decision.note || null };
    if (decision.decision === "return") {
      // The parts the job took go back on the shelves; the corrected record takes them again.
      await putBackPartsUsed(tx, { companyId, vessel, userId: access.user.id, workOrderId: w.id, workOrderNumber: w.number, now });
      await tx
        .update(completion)
        .set({ ...decided, status: "returned" })
        .where(eq(completion.id, c.id));
      return { status: "returned", workOrderState: w.state };
    }
    // A defect's repair approved closes the defect, with its cause and the action against a repeat.
    const [d] = await tx
      .select({ id: defect.id, closedAt: defect.closedAt })
      .from(defect)
      .where(and(eq(defect.companyId, companyId), eq(defect.workOrderId, w.id)));
    if (d && !d.closedAt) {
      const problems = closeProblems(decision);
      if (problems.length) throw invalidInput(problems);
      await tx.update(defect).set({ cause: decision.cause, action: decision.action, closedAt: now, closedBy: access.user.id }).where(eq(defect.id, d.id));
    }
    await tx
      .update(completion)
      .set({ ...decided, status: "approved" })
      .where(eq(completion.id, c.id));
    await tx
      .update(workOrder)
      .set({ state: "done", stateChangedAt: now, completedAt: c.doneAt })
      .where(eq(workOrder.id, w.id));
    await tx
      .insert(workOrderStateChange)
      .values({ companyId, workOrderId: w.id, fromState: w.state, toState: "done", changedAt: now });
    // The worker schedules the next occurrence from the approved completion.
    await requestRecompute(tx, companyId, vessel.id);
    return { status: "approved", workOrderState: "done" };
  });
}
