import { AuditSearchQuery } from "@/server/audit/contract";
import { searchTrail } from "@/server/audit/queries";
import { withAccess } from "@/server/http/with-access";

/** The company's audit trail, newest first, a page at a time: by person, vessel, kind and period. */
export const GET = withAccess({ permission: "company:manage", query: AuditSearchQuery }, async ({ access, query }) =>
  searchTrail(access, query),
);
