import { fleetOverdueCsv, loadFleetOverdue } from "@/server/fleet/overdue";
import { FleetOverdueQuery } from "@/server/fleet/overdue-contract";
import { withAccess } from "@/server/http/with-access";

/** The same list as CSV, for the office's spreadsheets and reports. */
export const GET = withAccess({ permission: "fleet:read", query: FleetOverdueQuery }, async ({ access, query }) =>
  fleetOverdueCsv(await loadFleetOverdue(access, query)),
);
