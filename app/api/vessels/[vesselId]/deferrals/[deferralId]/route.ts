import { withdrawDeferral } from "@/server/deferrals/request";
import { withAccess } from "@/server/http/with-access";
import { DeferralParams } from "@/server/http/params";

/** The chief engineer withdraws a request nobody has decided yet. */
export const DELETE = withAccess(
  { permission: "work:plan", vessel: true, params: DeferralParams },
  ({ access, vessel, params }) => withdrawDeferral(access, vessel, params.deferralId),
);
