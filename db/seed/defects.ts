// The demo's defect reports (invented): on Aster Gale an oil leak at the turbocharger drain planned
// into the Port Kelang engine stop, a noisy steering-gear pump bearing just reported, and a purifier
// O-ring leak closed last month with its cause and action; one open on each other vessel. Each is a
// corrective work order, as the app writes them. Demo only.
import { addDays } from "date-fns";
import { and, eq, inArray, sql } from "drizzle-orm";
import type { Db } from "../client";
import * as s from "../schema";
import { instantOfShipTime, shipDay } from "@/server/format/hours";
import { workOrderNumber } from "@/server/scheduling/work-order-diff";

type DemoDefect = {
  component: string;
  title: string;
  description: string;
  foundDaysAgo: number;
  critical?: boolean;
  safety?: boolean;
  classItem?: boolean;
  engineStop?: boolean;
  /** Planned: the target day, days from now; the rank and man-hours. */
  plan?: { inDays: number; rank: string; manHours: number };
  /** Closed: days ago, with the cause and action. */
  closed?: { daysAgo: number; cause: string; action: string; remarks: string };
};

const DEFECTS: Record<string, DemoDefect[]> = {
  AG: [
    {
      component: "ME.TC",
      title: "Oil leak at the turbocharger drain",
      description: "Lube oil weeping at the drain flange of the turbocharger bearing housing, about 0.5 l a day into the tray.",
      foundDaysAgo: 6,
      critical: true,
      engineStop: true,
      plan: { inDays: 3, rank: "second-engineer", manHours: 6 },
    },
    {
      component: "SG.P1",
      title: "Noisy bearing, steering gear pump 1",
      description: "Rumbling from the electric motor's drive-end bearing when the pump runs; temperature normal so far.",
      foundDaysAgo: 2,
      critical: true,
      safety: true,
    },
    {
      component: "PU.FO.1",
      title: "Bowl O-ring leaking, fuel oil purifier 1",
      description: "Fuel weeping at the bowl hood during separation.",
      foundDaysAgo: 34,
      plan: { inDays: -31, rank: "third-engineer", manHours: 3 },
      closed: {
        daysAgo: 30,
        cause: "O-ring hardened: it had been fitted at the last three bowl cleanings instead of renewed.",
        action: "The bowl O-ring kit is now renewed at every bowl cleaning and is listed as the routine's part.",
        remarks: "Bowl opened, O-ring renewed, test run without leak.",
      },
    },
  ],
  CN: [
    {
      component: "PU.LO.1",
      title: "Vibration on the lube oil purifier",
      description: "Vibration rising at start-up, settles after a minute.",
      foundDaysAgo: 12,
    },
  ],
  HR: [
    {
      component: "FF.EFP",
      title: "Emergency fire pump slow to prime",
      description: "Took 90 s to deliver water at the weekly run.",
      foundDaysAgo: 4,
      critical: true,
      safety: true,
      plan: { inDays: 2, rank: "third-engineer", manHours: 4 },
    },
  ],
};

export async function seedDefects(db: Db, companyId: string, now: Date): Promise<void> {
  const [present] = await db.select({ id: s.defect.id }).from(s.defect).where(eq(s.defect.companyId, companyId)).limit(1);
  if (present) return;
  const vessels = await db.select().from(s.vessel).where(and(eq(s.vessel.companyId, companyId), inArray(s.vessel.code, Object.keys(DEFECTS))));
  const [second] = await db.select({ id: s.user.id }).from(s.user).where(eq(s.user.email, "second@brightwater.example"));
  const [chief] = await db.select({ id: s.user.id }).from(s.user).where(eq(s.user.email, "chief@brightwater.example"));
  await db.transaction(async (tx) => {
    for (const v of vessels) {
      const components = await tx.select().from(s.component).where(eq(s.component.vesselId, v.id));
      for (const [i, d] of DEFECTS[v.code]!.entries()) {
        const c = components.find((x) => x.code === d.component);
        if (!c) continue;
        const [seq] = await tx
          .update(s.vessel)
          .set({ workOrderSeq: sql`${s.vessel.workOrderSeq} + 1` })
          .where(eq(s.vessel.id, v.id))
          .returning({ sequence: s.vessel.workOrderSeq });
        const number = `DR-${v.code}-${String(i + 1).padStart(4, "0")}`;
        const foundAt = addDays(now, -d.foundDaysAgo);
        const target = d.plan ? shipDay(addDays(now, d.plan.inDays), v.timeZone) : null;
        const due = target ? instantOfShipTime(target, "12:00", v.timeZone) : null;
        const closedAt = d.closed ? addDays(now, -d.closed.daysAgo) : null;
        const [w] = await tx
          .insert(s.workOrder)
          .values({
            companyId,
            vesselId: v.id,
            componentId: c.id,
            number: workOrderNumber(v.code, seq!.sequence),
            occurrence: 1,
            kind: "corrective",
            title: `${number}: ${d.title}`,
            state: closedAt ? "done" : "scheduled",
            stateChangedAt: closedAt ?? foundAt,
            completedAt: closedAt,
            dueDate: due,
            calendarDue: due,
            plannedDate: target,
            governing: "calendar",
            rank: d.plan?.rank ?? "second-engineer",
            estimatedManHours: d.plan?.manHours ?? 1,
            critical: d.critical ?? false,
            classRelated: d.classItem ?? false,
            needsEngineStop: d.engineStop ?? false,
            computedAt: now,
            createdAt: foundAt,
          })
          .returning();
        await tx.insert(s.workOrderStateChange).values({ companyId, workOrderId: w!.id, fromState: null, toState: w!.state, changedAt: w!.stateChangedAt });
        if (d.closed && closedAt) {
          await tx.insert(s.completion).values({
            companyId,
            vesselId: v.id,
            workOrderId: w!.id,
            doneAt: addDays(closedAt, -1),
            manHours: d.plan?.manHours ?? 1,
            remarks: d.closed.remarks,
            doneBy: second?.id ?? null,
            responsibleId: chief?.id ?? null,
            status: "approved",
            decidedBy: chief?.id ?? null,
            decidedAt: closedAt,
          });
        }
        await tx.insert(s.defect).values({
          companyId,
          vesselId: v.id,
          number,
          componentId: c.id,
          workOrderId: w!.id,
          title: d.title,
          description: d.description,
          foundAt,
          reportedBy: second?.id ?? null,
          affectsCritical: d.critical ?? false,
          affectsSafety: d.safety ?? false,
          affectsClass: d.classItem ?? false,
          needsEngineStop: d.engineStop ?? false,
          plannedAt: d.plan ? addDays(foundAt, 1) : null,
          cause: d.closed?.cause ?? null,
          action: d.closed?.action ?? null,
          closedAt,
          closedBy: closedAt ? (chief?.id ?? null) : null,
          createdAt: foundAt,
        });
      }
    }
  });
}
