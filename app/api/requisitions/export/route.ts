import { csvResponse } from "@/server/export/csv";
import { withAccess } from "@/server/http/with-access";
import { FleetRequisitionsQuery } from "@/server/parts/contract";
import { fleetRequisitionsCsv } from "@/server/parts/requisitions-csv";

/** The fleet's requisitions as CSV, a row per part asked for. */
export const GET = withAccess({ permission: "vessel:read", query: FleetRequisitionsQuery }, async ({ access, query }) =>
  csvResponse(await fleetRequisitionsCsv(access, query.state), `requisitions-${query.state}-${new Date().toISOString().slice(0, 10)}.csv`),
);
