import { DeferralListQuery } from "@/server/deferrals/contract";
import { listVesselDeferrals } from "@/server/deferrals/queries";
import { withAccess } from "@/server/http/with-access";

/** A vessel's deferral requests: those awaiting a decision (the default), or all of them. */
export const GET = withAccess(
  { permission: "vessel:read", vessel: true, query: DeferralListQuery },
  async ({ access, vessel, query }) => ({ deferrals: await listVesselDeferrals(access, vessel, query.status) }),
);
