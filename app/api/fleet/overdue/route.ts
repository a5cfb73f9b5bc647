import { loadFleetOverdue } from "@/server/fleet/overdue";
import { FleetOverdueQuery } from "@/server/fleet/overdue-contract";
import { withAccess } from "@/server/http/with-access";

/** Every late or out-of-tolerance work order of the fleet, the worst first. */
export const GET = withAccess({ permission: "fleet:read", query: FleetOverdueQuery }, ({ access, query }) =>
  loadFleetOverdue(access, query),
);
