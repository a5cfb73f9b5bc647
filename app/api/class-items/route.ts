import { ClassItemsQuery } from "@/server/class-items/contract";
import { listClassItems } from "@/server/class-items/queries";
import { withAccess } from "@/server/http/with-access";

/** The fleet's class-related routines, for the superintendent preparing surveys. */
export const GET = withAccess({ permission: "fleet:read", query: ClassItemsQuery }, async ({ access, query }) => ({
  items: await listClassItems(access, null, query.sort),
}));
