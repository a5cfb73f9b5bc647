import { PortStayParams } from "@/server/http/params";
import { withAccess } from "@/server/http/with-access";
import { pdfResponse } from "@/server/reports/pdf-response";
import { loadWorkPackage } from "@/server/reports/queries";
import { renderWorkPackage } from "@/server/reports/work-package";

/** The stay's work package as a PDF: the accepted one, else the proposal for someone who plans. */
export const GET = withAccess(
  { permission: "vessel:read", vessel: true, params: PortStayParams },
  async ({ access, vessel, params }) => {
    const pkg = await loadWorkPackage(access, vessel, params.stayId);
    return pdfResponse(await renderWorkPackage(pkg), `work-package-${vessel.code}-${pkg.port}.pdf`);
  },
);
