import { CompanyTrailQuery } from "@/server/audit/contract";
import { recordTrail } from "@/server/audit/queries";
import { withAccess } from "@/server/http/with-access";

/** The trail of a company-wide record: a part of the catalogue, a tolerance rule. */
export const GET = withAccess({ permission: "vessel:read", query: CompanyTrailQuery }, async ({ access, query }) =>
  recordTrail(access, null, query),
);
