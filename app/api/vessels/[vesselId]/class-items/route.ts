import { ClassItemsQuery } from "@/server/class-items/contract";
import { listClassItems } from "@/server/class-items/queries";
import { withAccess } from "@/server/http/with-access";

/** The vessel's class-related routines as a surveyor goes through them. */
export const GET = withAccess(
  { permission: "vessel:read", vessel: true, query: ClassItemsQuery },
  async ({ access, vessel, query }) => ({ items: await listClassItems(access, [vessel.id], query.sort) }),
);
