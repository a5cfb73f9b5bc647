import { BacklogQuery } from "@/server/backlog/contract";
import { backlogCsv } from "@/server/backlog/export";
import { withAccess } from "@/server/http/with-access";

/** The Backlog under the same filters and sort as CSV, every page at once. */
export const GET = withAccess(
  { permission: "vessel:read", vessel: true, query: BacklogQuery },
  ({ access, vessel, query }) => backlogCsv(access, vessel, query),
);
