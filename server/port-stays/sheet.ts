// The printable package sheet of a port stay: its accepted jobs per day, each with the routine's
// checklist, the spare parts to have ready and its cautions.
import "server-only";
import { and, asc, eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { component, routine, type RoutineCaution, workOrder, workPackageItem } from "@/db/schema";
import type { HeadCount } from "@/db/schema/columns";
import type { Access, VesselRef } from "@/server/auth/access";
import type { PortStayView } from "./contract";
import { findStay } from "./queries";
import { clockWords, shipDateTimeOf, stayDays } from "./stay-days";

export type SheetJob = {
  workOrderId: string;
  number: string;
  title: string;
  componentCode: string;
  componentName: string;
  rank: string;
  /** The routine's team (ranks × head count) and its elapsed hours. */
  team: HeadCount[];
  elapsedHours: number;
  manHours: number;
  needsEngineStop: boolean;
  critical: boolean;
  classRelated: boolean;
  reason: string;
  /** The working periods on the ship's clock: "2026-12-10T08:00" to "2026-12-10T17:00". */
  segments: { from: string; to: string }[];
  people: string[];
  checklist: string[];
  spareParts: string;
  cautions: RoutineCaution[];
};

export type PackageSheet = {
  stay: Pick<PortStayView, "id" | "port" | "arrivesAt" | "departsAt" | "arrivesLocal" | "departsLocal" | "workdayFrom" | "workdayTo" | "engineStop" | "packageAcceptedAt" | "remarks">;
  days: { day: string; jobs: SheetJob[] }[];
};

export async function loadPackageSheet(access: Access, vessel: VesselRef, stayId: string): Promise<PackageSheet> {
  const db = getDb();
  const companyId = access.company.id;
  const stay = await findStay(db, access, vessel, stayId);
  const rows = await db
    .select({
      date: workPackageItem.plannedDate,
      reason: workPackageItem.reason,
      segments: workPackageItem.segments,
      people: workPackageItem.people,
      workOrderId: workOrder.id,
      number: workOrder.number,
      title: workOrder.title,
      componentCode: component.code,
      componentName: component.name,
      rank: workOrder.rank,
      team: workOrder.team,
      elapsedHours: workOrder.elapsedHours,
      manHours: workOrder.estimatedManHours,
      needsEngineStop: workOrder.needsEngineStop,
      critical: workOrder.critical,
      classRelated: workOrder.classRelated,
      checklist: routine.checklist,
      spareParts: routine.spareParts,
      cautions: routine.cautions,
    })
    .from(workPackageItem)
    .innerJoin(workOrder, and(eq(workOrder.id, workPackageItem.workOrderId), eq(workOrder.companyId, companyId)))
    .innerJoin(component, eq(component.id, workOrder.componentId))
    .leftJoin(routine, and(eq(routine.id, workOrder.routineId), eq(routine.companyId, companyId)))
    .where(and(eq(workPackageItem.companyId, companyId), eq(workPackageItem.portStayId, stay.id)))
    .orderBy(asc(workPackageItem.startsAt), asc(workPackageItem.position));
  const local = (iso: string) => shipDateTimeOf(new Date(iso), vessel.timeZone);
  const days = stayDays(stay.arrivesAt, stay.departsAt, vessel.timeZone).map((day) => ({
    day,
    jobs: rows
      .filter((r) => r.date === day)
      .map(({ date: _date, checklist, spareParts, cautions, segments, ...r }) => ({
        ...r,
        segments: segments.map((x) => ({ from: local(x.from), to: local(x.to) })),
        checklist: checklist ?? [],
        spareParts: spareParts ?? "",
        cautions: cautions ?? [],
      })),
  }));
  return {
    stay: {
      id: stay.id,
      port: stay.port,
      arrivesAt: stay.arrivesAt.toISOString(),
      departsAt: stay.departsAt.toISOString(),
      arrivesLocal: shipDateTimeOf(stay.arrivesAt, vessel.timeZone),
      departsLocal: shipDateTimeOf(stay.departsAt, vessel.timeZone),
      workdayFrom: clockWords(stay.workdayFrom),
      workdayTo: clockWords(stay.workdayTo),
      engineStop:
        stay.engineStopFrom && stay.engineStopTo
          ? {
              from: stay.engineStopFrom.toISOString(),
              to: stay.engineStopTo.toISOString(),
              fromLocal: shipDateTimeOf(stay.engineStopFrom, vessel.timeZone),
              toLocal: shipDateTimeOf(stay.engineStopTo, vessel.timeZone),
            }
          : null,
      packageAcceptedAt: stay.packageAcceptedAt?.toISOString() ?? null,
      remarks: stay.remarks,
    },
    days,
  };
}
