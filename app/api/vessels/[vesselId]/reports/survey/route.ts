import { withAccess } from "@/server/http/with-access";
import { SurveyReportQuery } from "@/server/reports/contract";
import { pdfResponse } from "@/server/reports/pdf-response";
import { loadSurveyReport } from "@/server/reports/queries";
import { renderSurveyReport } from "@/server/reports/survey-report";

/** The vessel's survey and audit report for a period of ship's days (`from`, `to`), as a PDF. */
export const GET = withAccess(
  { permission: "vessel:read", vessel: true, query: SurveyReportQuery },
  async ({ access, vessel, query }) => {
    const report = await loadSurveyReport(access, vessel, query);
    return pdfResponse(await renderSurveyReport(report), `survey-report-${vessel.code}-${report.from}-${report.to}.pdf`);
  },
);
