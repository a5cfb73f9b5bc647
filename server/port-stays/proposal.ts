// The proposed work package of a port stay: loads the vessel's open work orders and the next stay,
// runs the planner (server/planning/stay-planner.ts, pure) and dresses its answer for the page.
// Nothing is written: the chief moves jobs on the timeline and accepts (accept.ts).
import "server-only";
import { and, asc, eq, gt, inArray, ne } from "drizzle-orm";
import { getDb } from "@/db/client";
import { component, portStay, workOrder } from "@/db/schema";
import { OPEN_STATES_BY_URGENCY } from "@/db/schema/work-order-states";
import type { Access, VesselRef } from "@/server/auth/access";
import { AppError } from "@/server/http/problem";
import { DEFAULT_SLOT_MINUTES } from "@/server/planning/stay-grid";
import { DEFAULT_LOOK_AHEAD_DAYS, planPortStay } from "@/server/planning/stay-planner";
import type { PackageJob, ProposalView } from "./contract";
import { planJobOf, planStayOf } from "./plan-input";
import { findStay, jobColumns, packagedElsewhere, placedView, toJob } from "./queries";
import { loadRankNames } from "@/server/admin/rank-names";

export async function proposePackage(
  access: Access,
  vessel: VesselRef,
  stayId: string,
  now = new Date(),
): Promise<ProposalView> {
  const db = getDb();
  const companyId = access.company.id;
  const stay = await findStay(db, access, vessel, stayId);
  if (stay.departsAt <= now) {
    throw new AppError("conflict", `${stay.port} is over: the ship sailed, so there is nothing left to plan.`);
  }

  const [next] = await db
    .select({ port: portStay.port, arrivesAt: portStay.arrivesAt })
    .from(portStay)
    .where(
      and(
        eq(portStay.companyId, companyId),
        eq(portStay.vesselId, vessel.id),
        ne(portStay.id, stay.id),
        gt(portStay.arrivesAt, stay.departsAt),
      ),
    )
    .orderBy(asc(portStay.arrivesAt))
    .limit(1);

  const rows = await db
    .select(jobColumns)
    .from(workOrder)
    .innerJoin(component, eq(component.id, workOrder.componentId))
    .where(
      and(
        eq(workOrder.companyId, companyId),
        eq(workOrder.vesselId, vessel.id),
        inArray(workOrder.state, [...OPEN_STATES_BY_URGENCY]),
      ),
    );
  // Work already in the package of another stay still to come is planned there, not here.
  const elsewhere = await packagedElsewhere(db, companyId, vessel.id, stay.id, now);
  const jobs = new Map<string, PackageJob>();
  for (const r of rows) {
    if (elsewhere.has(r.workOrderId) || r.state === "done") continue;
    jobs.set(r.workOrderId, toJob(r));
  }
  const outOfTolerance = new Map(rows.map((r) => [r.workOrderId, r.outOfToleranceAt]));

  const plan = planPortStay({
    stay: planStayOf(stay, vessel.timeZone),
    nextStayArrivesAt: next?.arrivesAt ?? null,
    lookAheadDays: DEFAULT_LOOK_AHEAD_DAYS,
    jobs: [...jobs.values()].map((j) => planJobOf(j, outOfTolerance.get(j.workOrderId) ?? null)),
    rankNames: await loadRankNames(companyId),
  });

  const job = (id: string) => jobs.get(id)!;
  return {
    horizon: plan.horizon.toISOString(),
    nextStay: next ? { port: next.port, arrivesAt: next.arrivesAt.toISOString() } : null,
    lookAheadDays: next ? null : DEFAULT_LOOK_AHEAD_DAYS,
    items: plan.placed.map((p) =>
      placedView(job(p.workOrderId), p, vessel.timeZone, { reason: p.reason, urgency: p.urgency }),
    ),
    leftOut: plan.leftOut.map((l) => ({
      ...job(l.workOrderId),
      urgency: l.urgency,
      group: l.group,
      reason: l.reason,
      message: l.message,
    })),
    atSea: plan.atSea,
    people: plan.people,
    value: plan.value,
    possible: plan.possible,
    slotMinutes: DEFAULT_SLOT_MINUTES,
  };
}
