import { BacklogQuery } from "@/server/backlog/contract";
import { loadBacklog } from "@/server/backlog/queries";
import { withAccess } from "@/server/http/with-access";

/** Open work orders of a vessel, filtered, sorted and paged, from the worker's rows. */
export const GET = withAccess(
  { permission: "vessel:read", vessel: true, query: BacklogQuery },
  ({ access, vessel, query }) => loadBacklog(access, vessel, query),
);
