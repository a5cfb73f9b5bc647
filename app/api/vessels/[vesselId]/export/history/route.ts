import { csvResponse } from "@/server/export/csv";
import { withAccess } from "@/server/http/with-access";
import { HistoryQuery, historyCsv } from "@/server/import/history-csv";

/** The vessel's maintenance history as CSV, or with `?component=ME.CYL.3` that component's and its parts'. */
export const GET = withAccess({ permission: "vessel:read", vessel: true, query: HistoryQuery }, async ({ access, vessel, query }) => {
  const csv = await historyCsv(access, vessel, query.component);
  const name = `${vessel.code}-history${query.component ? `-${query.component}` : ""}-${new Date().toISOString().slice(0, 10)}.csv`;
  return csvResponse(csv, name);
});
