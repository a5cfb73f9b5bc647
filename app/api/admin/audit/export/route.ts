import { AuditSearchQuery } from "@/server/audit/contract";
import { trailCsv } from "@/server/audit/queries";
import { withAccess } from "@/server/http/with-access";

/** The search's entries as CSV (newest first, at most 50,000: the file says when that was reached). */
export const GET = withAccess({ permission: "company:manage", query: AuditSearchQuery }, async ({ access, query }) =>
  trailCsv(access, query),
);
