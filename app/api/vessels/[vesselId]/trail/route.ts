import { RecordTrailQuery } from "@/server/audit/contract";
import { recordTrail } from "@/server/audit/queries";
import { withAccess } from "@/server/http/with-access";

/** One record's audit trail, with the records that belong to it (a work order's completions…). */
export const GET = withAccess(
  { permission: "vessel:read", vessel: true, query: RecordTrailQuery },
  async ({ access, vessel, query }) => recordTrail(access, vessel, query),
);
