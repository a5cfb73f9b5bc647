// Recording a completion (and resubmitting one the chief returned): checked like a reading
// against the counter, written with its follow-up in one transaction, then awaiting approval.
import "server-only";
import { and, eq, max, ne, sql } from "drizzle-orm";
import { getDb, type Tx } from "@/db/client";
import { completion, component, counter, routine, workOrder } from "@/db/schema";
import type { Access, VesselRef } from "@/server/auth/access";
import { formatShipTime, instantOfShipTime, shipDay } from "@/server/format/hours";
import { requestRecompute } from "@/server/jobs/recompute-vessel";
import { AppError, type FieldError, invalidInput } from "@/server/http/problem";
import { isInFuture, readingProblem } from "@/server/readings/rules";
import { assessMeasurements, type Completion, type CompletionResult, measurementMismatches } from "./contract";
import { lockVesselWorkOrders } from "@/server/work-orders/lock";
import { checkPartsUsed } from "@/server/parts/use";
import { createFollowUp } from "./follow-up";
import { responsibleChoices } from "./queries";

type Mode = "record" | "resubmit";

type CounterNeighbours = {
  name: string;
  prev_at: Date | null;
  prev_total: string | null;
  next_at: Date | null;
  next_total: string | null;
};

export async function recordCompletion(
  access: Access,
  vessel: VesselRef,
  workOrderId: string,
  input: Completion,
  now = new Date(),
) {
  return writeCompletion(access, vessel, workOrderId, input, "record", now);
}

export async function resubmitCompletion(
  access: Access,
  vessel: VesselRef,
  workOrderId: string,
  input: Completion,
  now = new Date(),
) {
  return writeCompletion(access, vessel, workOrderId, input, "resubmit", now);
}

async function writeCompletion(
  access: Access,
  vessel: VesselRef,
  workOrderId: string,
  input: Completion,
  mode: Mode,
  now: Date,
): Promise<CompletionResult> {
  const companyId = access.company.id;
  const doneAt = instantOfShipTime(input.doneOn, input.time, vessel.timeZone);
  if (isInFuture(doneAt, now)) {
    throw invalidInput([
      {
        field: "doneOn",
        message: `${input.doneOn} ${input.time} ship’s time is in the future: the ship’s day is ${shipDay(now, vessel.timeZone)}.`,
      },
    ]);
  }

  return getDb().transaction(async (tx) => {
    // Under the worker's lock: it must not rewrite this work order while it is being completed.
    await lockVesselWorkOrders(tx, vessel.id);
    const [found] = await tx
      .select({ w: workOrder, componentCode: component.code })
      .from(workOrder)
      .innerJoin(component, eq(component.id, workOrder.componentId))
      .where(and(eq(workOrder.companyId, companyId), eq(workOrder.vesselId, vessel.id), eq(workOrder.id, workOrderId)))
      .for("update", { of: workOrder });
    if (!found) throw new AppError("not-found", "There is no such work order on this vessel.");
    const { w } = found;
    if (w.state === "done") throw new AppError("conflict", `${w.number} is already done.`);

    const [existing] = await tx
      .select({ id: completion.id, status: completion.status })
      .from(completion)
      .where(and(eq(completion.companyId, companyId), eq(completion.workOrderId, w.id)));
    if (mode === "record" && existing) {
      throw new AppError(
        "conflict",
        existing.status === "returned"
          ? `${w.number} has a completion returned for correction: correct and resubmit it.`
          : `${w.number} already has a completion awaiting approval.`,
      );
    }
    if (mode === "resubmit" && existing?.status !== "returned") {
      throw new AppError(
        "conflict",
        existing
          ? `${w.number} has a completion awaiting approval already.`
          : `${w.number} has no completion to resubmit.`,
      );
    }

    const [r] = w.routineId
      ? await tx
          .select()
          .from(routine)
          .where(and(eq(routine.companyId, companyId), eq(routine.id, w.routineId)))
      : [];
    const errors: FieldError[] = [];
    if (
      r &&
      !sameSteps(
        r.checklist,
        input.checklist.map((t) => t.step),
      )
    ) {
      errors.push({
        field: "checklist",
        message: "The checklist does not match the routine’s steps; reload the page and tick them again.",
      });
    }
    errors.push(...measurementMismatches(r?.measurements ?? [], input.measurements));
    errors.push(
      ...(await counterErrors(tx, w, r?.intervalHours ?? null, input.counterHours ?? null, doneAt, vessel.timeZone)),
    );
    if (w.routineId) {
      const last = await lastCompletionOfRoutine(tx, companyId, w.routineId, w.id);
      if (last && doneAt < last) {
        errors.push({
          field: "doneOn",
          message: `This routine was last done on ${formatShipTime(last, vessel.timeZone)}; a later job cannot be done before it.`,
        });
      }
    }
    const responsibleId = input.responsibleId ?? access.user.id;
    const choices = await responsibleChoices(tx, companyId, vessel.id);
    if (responsibleId !== access.user.id && !choices.some((c) => c.id === responsibleId)) {
      errors.push({
        field: "responsibleId",
        message: "The person responsible is a chief engineer or engineer of this company assigned to this vessel.",
      });
    }
    const parts = await checkPartsUsed(
      tx,
      { companyId, vessel, userId: access.user.id, workOrderId: w.id, workOrderNumber: w.number, now },
      input.partsUsed,
    );
    errors.push(...parts.errors);
    if (errors.length) throw invalidInput(errors);

    // The stores on board lose the parts in this same transaction.
    const partsUsed = await parts.write();
    const measurements = assessMeasurements(r?.measurements ?? [], input.measurements);
    const values = {
      doneAt,
      counterHours: input.counterHours ?? null,
      manHours: Math.round(input.manHours * 10) / 10,
      // An unticked step keeps its remark beside it, so the chief reads why.
      checklist: input.checklist.map((t) => (t.done || !t.remark ? { step: t.step, done: t.done } : { ...t })),
      measurements,
      remarks: input.remarks,
      doneBy: access.user.id,
      responsibleId,
      workedBy: input.workedBy.map((p) => ({ rank: p.rank, name: p.name })),
      partsUsed,
      status: "awaiting-approval" as const,
      decidedBy: null,
      decidedAt: null,
    };
    const [saved] = existing
      ? await tx.update(completion).set(values).where(eq(completion.id, existing.id)).returning({ id: completion.id })
      : await tx
          .insert(completion)
          .values({ companyId, vesselId: vessel.id, workOrderId: w.id, ...values })
          .returning({ id: completion.id });

    const followUpNumber = await createFollowUp(tx, {
      companyId,
      vesselId: vessel.id,
      componentId: w.componentId,
      componentCode: found.componentCode,
      doneAt,
      outOfLimits: measurements.filter((m) => m.outOfLimits).map((m) => m.name),
      rank: w.rank,
      critical: w.critical,
      classRelated: w.classRelated,
      needsEngineStop: w.needsEngineStop,
      now,
      reportedBy: access.user.id,
      measured: measurements
        .filter((m) => m.outOfLimits)
        .map((m) => `${m.name}: ${m.value} ${m.unit} (limits ${m.lower ?? "—"} … ${m.upper ?? "—"} ${m.unit}) when ${w.number} was done.`)
        .join("\n"),
    });
    // A follow-up raised by a measurement out of limits gets its windows from the worker.
    if (followUpNumber) await requestRecompute(tx, companyId, vessel.id);
    return { completionId: saved!.id, status: "awaiting-approval", followUpNumber };
  });
}

function sameSteps(planned: readonly string[], ticked: readonly string[]): boolean {
  return planned.length === ticked.length && planned.every((step, i) => step.trim() === ticked[i]);
}

/** When the routine was last done before this work order: a completion cannot go back past it. */
async function lastCompletionOfRoutine(tx: Tx, companyId: string, routineId: string, exceptWorkOrderId: string) {
  const [row] = await tx
    .select({ at: max(completion.doneAt) })
    .from(completion)
    .innerJoin(workOrder, eq(workOrder.id, completion.workOrderId))
    .where(
      and(
        eq(completion.companyId, companyId),
        eq(workOrder.routineId, routineId),
        eq(completion.status, "approved"),
        ne(workOrder.id, exceptWorkOrderId),
      ),
    );
  return row?.at ?? null;
}

/**
 * The counter value at completion, checked like a reading against the readings just before and
 * after it. Totals are compared, not meter values: they stay continuous across a meter replacement.
 */
async function counterErrors(
  tx: Tx,
  w: typeof workOrder.$inferSelect,
  intervalHours: number | null,
  counterHours: number | null,
  doneAt: Date,
  timeZone: string,
): Promise<FieldError[]> {
  if (counterHours === null) {
    return intervalHours !== null
      ? [
          {
            field: "counterHours",
            message: "Enter the counter value at completion: this routine falls due by running hours.",
          },
        ]
      : [];
  }
  if (!w.counterId) {
    return [{ field: "counterHours", message: "This component has no counter: leave the counter value empty." }];
  }
  const { rows } = await tx.execute<CounterNeighbours>(sql`
    select c.name,
           p.read_at as prev_at, p.total_hours as prev_total,
           n.read_at as next_at, n.total_hours as next_total
    from ${counter} c
    left join lateral (select read_at, total_hours from reading r
                       where r.company_id = c.company_id and r.counter_id = c.id and r.read_at <= ${doneAt}
                       order by r.read_at desc limit 1) p on true
    left join lateral (select read_at, total_hours from reading r
                       where r.company_id = c.company_id and r.counter_id = c.id and r.read_at > ${doneAt}
                       order by r.read_at asc limit 1) n on true
    where c.company_id = ${w.companyId} and c.id = ${w.counterId}`);
  const c = rows[0];
  if (!c) return [];
  const problem = readingProblem(
    {
      name: c.name,
      segmentStartedAt: null,
      previous: c.prev_at ? { readAt: new Date(c.prev_at), meterValue: Number(c.prev_total) } : null,
      next: c.next_at ? { readAt: new Date(c.next_at), meterValue: Number(c.next_total) } : null,
      existingAtSameInstant: null,
    },
    counterHours,
    doneAt,
    timeZone,
  );
  return problem ? [{ field: "counterHours", message: `Counter value (${c.name}): ${problem}` }] : [];
}
