import { WorkOrderParams } from "@/server/http/params";
import { withAccess } from "@/server/http/with-access";
import { renderJobCard } from "@/server/reports/job-card";
import { pdfResponse } from "@/server/reports/pdf-response";
import { loadJobCard } from "@/server/reports/queries";

/** The work order's job card as a PDF paper form. */
export const GET = withAccess(
  { permission: "vessel:read", vessel: true, params: WorkOrderParams },
  async ({ access, vessel, params }) => {
    const card = await loadJobCard(access, vessel, params.workOrderId);
    return pdfResponse(await renderJobCard(card), `${card.number}-job-card.pdf`);
  },
);
