// The reports' data, loaded with the same queries as the pages they print (scoped by the access
// door's company and vessel), then turned into the layouts' plain values.
import "server-only";
import { loadRankNames } from "@/server/admin/rank-names";
import type { Access, VesselRef } from "@/server/auth/access";
import { loadWorkOrderDetail } from "@/server/completions/queries";
import { loadFleetOverdue } from "@/server/fleet/overdue";
import type { FleetOverdueFilter } from "@/server/fleet/overdue-contract";
import { proposePackage } from "@/server/port-stays/proposal";
import { loadPortStay } from "@/server/port-stays/queries";
import { rankWords } from "@/server/routines/rank-names";
import { shipDay } from "@/server/format/hours";
import { invalidInput } from "@/server/http/problem";
import { addShipDays, addShipMonths, shipDateFromKey, shipDateKey, shipDaysBetween } from "@/server/scheduling/ship-date";
import type { JobCard } from "./job-card";
import { jobCardOf } from "./job-card-data";
import type { OverdueList } from "./overdue-list";
import { overdueListOf } from "./overdue-list-data";
import type { WorkPackage } from "./work-package";
import { workPackageOf } from "./work-package-data";
import { MAX_SURVEY_DAYS, type SurveyReportQuery } from "./contract";
import type { SurveyReport } from "./survey-report";
import { surveyReportOf } from "./survey-report-data";
import { loadSurveyData } from "./survey-queries";

/** The job card of a work order on the vessel: a foreign or unknown one is the page's 404. */
export async function loadJobCard(access: Access, vessel: VesselRef, workOrderId: string): Promise<JobCard> {
  const [detail, names] = await Promise.all([
    loadWorkOrderDetail(access, vessel, workOrderId),
    loadRankNames(access.company.id),
  ]);
  return jobCardOf(detail, vessel.imoNumber, rankWords(names));
}

/**
 * The stay's accepted package; with none accepted, the planner's proposal for someone who plans
 * (as the stay's page offers it) while the stay is still to come and has a crew to plan with.
 */
export async function loadWorkPackage(access: Access, vessel: VesselRef, stayId: string, now = new Date()): Promise<WorkPackage> {
  const [detail, names] = await Promise.all([loadPortStay(access, vessel, stayId, now), loadRankNames(access.company.id)]);
  const proposes =
    detail.items.length === 0 &&
    detail.may.plan &&
    new Date(detail.stay.departsAt) > now &&
    detail.stay.crew.some((c) => c.count > 0);
  const proposal = proposes ? await proposePackage(access, vessel, stayId, now) : null;
  return workPackageOf(detail, vessel.imoNumber, rankWords(names), proposal);
}

export async function loadOverdueList(access: Access, filter: FleetOverdueFilter): Promise<OverdueList> {
  const [list, names] = await Promise.all([loadFleetOverdue(access, filter), loadRankNames(access.company.id)]);
  return overdueListOf(list, filter, access.company.name, rankWords(names));
}

/** The vessel's survey and audit report; a period left out is the twelve months up to the ship's today. */
export async function loadSurveyReport(access: Access, vessel: VesselRef, query: SurveyReportQuery, now = new Date()): Promise<SurveyReport> {
  const to = query.to ?? shipDay(now, vessel.timeZone);
  const from = query.from ?? shipDateKey(addShipDays(addShipMonths(shipDateFromKey(to), -12), 1));
  const span = shipDaysBetween(shipDateFromKey(from), shipDateFromKey(to));
  if (span < 0) throw invalidInput([{ field: "query.from", message: "The period’s first day is on or before its last day (today when left out)." }]);
  if (span >= MAX_SURVEY_DAYS) {
    throw invalidInput([{ field: "query.from", message: "A report covers at most five years (a class cycle): shorten the period." }]);
  }
  const data = await loadSurveyData(access, vessel, from, to, now);
  return surveyReportOf(data, vessel, access.company.name, now);
}
