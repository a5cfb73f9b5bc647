// Demo deferral requests, made after the worker's first run so that they refer to real work
// orders and limits: on Aster Gale and Corran Ness, requests waiting for the office and for the
// chief, and one the superintendent approved last week, so that a `deferred` work order exists.
// The reasons are invented, in the words a chief engineer would use.
import { and, asc, eq, inArray, ne } from "drizzle-orm";
import type { Db } from "../client";
import * as s from "../schema";
import {
  addShipDays,
  endOfShipDate,
  shipDateFromKey,
  shipDateKey,
  shipDateOf,
} from "../../server/scheduling/ship-date";
import { recomputeVessel } from "../../server/scheduling/recompute";

const DAY = 86_400_000;

type DemoDeferral = {
  /** Title of the routine's open work order. */
  title: string;
  reason: string;
  /** Hours beyond the later of the due point and the counter now. */
  extraHours?: number;
  /** Days beyond the later of the due day and today. */
  extraDays?: number;
  /** Days ago it was asked. */
  askedDaysAgo: number;
  /** Approved by the superintendent this many days ago. */
  approvedDaysAgo?: number;
};

const PLAN: Record<string, DemoDeferral[]> = {
  AG: [
    {
      title: "Generator set 2: cylinder heads and valves",
      reason:
        "Two exhaust valve seats and the head gasket set are on back-order with the maker; the agent confirms delivery at the next port. Generator 2 is kept on stand-by only, generators 1 and 3 carry the load.",
      extraHours: 600,
      askedDaysAgo: 2,
    },
    {
      title: "Fuel oil purifier: bowl cleaning and inspection",
      reason:
        "The bowl O-ring kit did not come with the last stores. The stand-by purifier runs meanwhile; spares are promised for the next port.",
      extraHours: 300,
      askedDaysAgo: 1,
    },
    {
      title: "Boiler burner: clean nozzle and check flame safeguard",
      reason:
        "The boiler heats the cargo until discharge and cannot be stopped before then; nozzle cleaning is planned for the day after discharge.",
      extraDays: 14,
      askedDaysAgo: 1,
    },
    {
      title: "Lube oil purifier: bowl cleaning and inspection",
      reason:
        "The maker's service engineer overhauls this purifier at the next port call with the bowl spindle bearings; the stand-by unit runs until then.",
      extraHours: 400,
      askedDaysAgo: 7,
      approvedDaysAgo: 6,
    },
  ],
  CN: [
    {
      title: "Starting air receivers: internal inspection",
      reason:
        "The class surveyor cannot attend at this port; the survey is booked for the next port call, where the receivers can be emptied with the ship alongside.",
      extraDays: 21,
      askedDaysAgo: 3,
    },
    {
      title: "Fuel oil purifier: bowl cleaning and inspection",
      reason:
        "Heavy weather on the crossing: opening the purifier bowl at sea is not safe. The job is planned for the first day alongside.",
      extraHours: 200,
      askedDaysAgo: 1,
    },
  ],
};

export async function seedDeferrals(db: Db, companyId: string, now: Date): Promise<void> {
  const [existing] = await db
    .select({ id: s.deferral.id })
    .from(s.deferral)
    .where(eq(s.deferral.companyId, companyId))
    .limit(1);
  if (existing) return;
  const people = await db
    .select({ id: s.user.id, email: s.user.email })
    .from(s.user)
    .where(inArray(s.user.email, ["chief@brightwater.example", "super@brightwater.example"]));
  const chief = people.find((p) => p.email.startsWith("chief@"))?.id ?? null;
  const superintendent = people.find((p) => p.email.startsWith("super@"))?.id ?? null;
  const [company] = await db.select().from(s.company).where(eq(s.company.id, companyId));
  const chiefDecides = company?.chiefDecidesDeferrals ?? true;

  for (const v of await db.select().from(s.vessel).where(eq(s.vessel.companyId, companyId))) {
    const plan = PLAN[v.code];
    if (!plan) continue;
    let deferred = false;
    for (const p of plan) {
      const [w] = await db
        .select()
        .from(s.workOrder)
        .where(
          and(
            eq(s.workOrder.companyId, companyId),
            eq(s.workOrder.vesselId, v.id),
            eq(s.workOrder.title, p.title),
            ne(s.workOrder.state, "done"),
          ),
        )
        .orderBy(asc(s.workOrder.occurrence))
        .limit(1);
      if (!w) {
        console.warn(`[keelson] ${v.code}: no open work order “${p.title}” to defer`);
        continue;
      }
      const proposed = proposedLimit(w, p, v.timeZone, now);
      if (!proposed) continue;
      const askedAt = new Date(now.getTime() - p.askedDaysAgo * DAY);
      const decidedAt = p.approvedDaysAgo !== undefined ? new Date(now.getTime() - p.approvedDaysAgo * DAY) : null;
      await db.insert(s.deferral).values({
        companyId,
        vesselId: v.id,
        workOrderId: w.id,
        status: decidedAt ? "approved" : "pending",
        reason: p.reason,
        proposedDueDay: proposed.day,
        proposedDueHours: proposed.hours,
        needsOffice: w.critical || w.classRelated || !chiefDecides,
        requestedBy: chief,
        requestedAt: askedAt,
        decidedBy: decidedAt ? superintendent : null,
        decidedAt,
        decisionNote: decidedAt ? "Agreed: the stand-by unit covers; confirm the service report when done." : null,
      });
      if (decidedAt) {
        // As server/deferrals/decision.ts writes an approval.
        await db
          .update(s.workOrder)
          .set({
            deferredDueDate: proposed.day ? endOfShipDate(shipDateFromKey(proposed.day), v.timeZone) : null,
            deferredDueHours: proposed.hours,
            state: "deferred",
            stateChangedAt: decidedAt,
          })
          .where(eq(s.workOrder.id, w.id));
        await db
          .insert(s.workOrderStateChange)
          .values({ companyId, workOrderId: w.id, fromState: w.state, toState: "deferred", changedAt: decidedAt });
        deferred = true;
      }
    }
    // The worker's view of the new limits.
    if (deferred) await recomputeVessel(db, companyId, v.id, now);
  }
}

/** A limit the request may propose: past today, past the due point, and past the counter now. */
function proposedLimit(
  w: typeof s.workOrder.$inferSelect,
  p: DemoDeferral,
  timeZone: string,
  now: Date,
): { day: string | null; hours: number | null } | null {
  if (p.extraHours !== undefined) {
    if (w.dueHours === null) return null;
    const counterNow = w.remainingHours !== null ? w.dueHours - w.remainingHours : w.dueHours;
    return { day: null, hours: Math.round(Math.max(w.dueHours, counterNow) + p.extraHours) };
  }
  const today = shipDateOf(now, timeZone);
  const due = w.dueDate ? shipDateOf(w.dueDate, timeZone) : today;
  const from = due.getTime() > today.getTime() ? due : today;
  return { day: shipDateKey(addShipDays(from, p.extraDays ?? 14)), hours: null };
}
