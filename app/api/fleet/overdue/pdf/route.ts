import { FleetOverdueQuery } from "@/server/fleet/overdue-contract";
import { withAccess } from "@/server/http/with-access";
import { renderOverdueList } from "@/server/reports/overdue-list";
import { pdfResponse } from "@/server/reports/pdf-response";
import { loadOverdueList } from "@/server/reports/queries";

/** The same list as a PDF, under the same filters, for the office's meetings and files. */
export const GET = withAccess({ permission: "fleet:read", query: FleetOverdueQuery }, async ({ access, query }) =>
  pdfResponse(await renderOverdueList(await loadOverdueList(access, query)), `overdue-${new Date().toISOString().slice(0, 10)}.pdf`),
);
