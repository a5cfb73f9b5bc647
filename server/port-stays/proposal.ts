// The proposed work package of a port stay: loads the vessel's open work orders and the next stay,
// runs the planner (server/planning/proposal.ts, pure) and dresses its answer for the page. Nothing
// is written: the chief edits the proposal and accepts it (accept.ts).
import "server-only";
import { and, asc, eq, gt, inArray, ne } from "drizzle-orm";
import { getDb } from "@/db/client";
import { component, portStay, workOrder } from "@/db/schema";
import { OPEN_STATES_BY_URGENCY } from "@/db/schema/work-order-states";
import type { Access, VesselRef } from "@/server/auth/access";
import { AppError } from "@/server/http/problem";
import { type Candidate, DEFAULT_LOOK_AHEAD_DAYS, proposeWorkPackage } from "@/server/planning/proposal";
import type { PackageJob, ProposalView } from "./contract";
import { findStay, jobColumns, packagedElsewhere, toJob } from "./queries";
import { stayDays } from "./stay-days";

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
    .select({ ...jobColumns, outOfToleranceAt: workOrder.outOfToleranceAt })
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
  const candidates: Candidate[] = [];
  for (const r of rows) {
    if (elsewhere.has(r.workOrderId) || r.state === "done") continue;
    jobs.set(r.workOrderId, toJob(r));
    candidates.push({
      id: r.workOrderId,
      number: r.number,
      title: r.title,
      state: r.state,
      rank: r.rank,
      estimatedManHours: r.manHours,
      needsEngineStop: r.needsEngineStop,
      critical: r.critical,
      classRelated: r.classRelated,
      dueAt: r.deferredDueDate ?? r.dueDate,
      outOfToleranceAt: r.outOfToleranceAt,
      planFrom: r.planFrom,
      planUntil: r.planUntil,
    });
  }

  const proposal = proposeWorkPackage({
    stay: {
      days: stayDays(stay.arrivesAt, stay.departsAt, vessel.timeZone),
      departsAt: stay.departsAt,
      engineMayStop: stay.engineMayStop,
      immobilisationHours: stay.immobilisationHours,
    },
    nextStayArrivesAt: next?.arrivesAt ?? null,
    lookAheadDays: DEFAULT_LOOK_AHEAD_DAYS,
    crew: stay.crew,
    candidates,
    timeZone: vessel.timeZone,
  });

  const job = (id: string) => jobs.get(id)!;
  return {
    horizon: proposal.horizon.toISOString(),
    nextStay: next ? { port: next.port, arrivesAt: next.arrivesAt.toISOString() } : null,
    lookAheadDays: next ? null : DEFAULT_LOOK_AHEAD_DAYS,
    items: proposal.items.map((i) => ({ ...job(i.workOrderId), date: i.date, reason: i.reason, tier: i.tier })),
    leftOut: proposal.leftOut.map((l) => ({
      ...job(l.workOrderId),
      tier: l.tier,
      reason: l.reason,
      message: l.message,
    })),
    usage: proposal.usage,
    immobilisation: proposal.immobilisation,
  };
}
