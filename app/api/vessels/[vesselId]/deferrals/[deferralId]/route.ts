import { withdrawDeferral } from "@/server/deferrals/request";
import { withAccess } from "@/server/http/with-access";

/** The chief engineer withdraws a request nobody has decided yet. */
export const DELETE = withAccess({ permission: "work:plan", vessel: true }, ({ access, vessel, params }) =>
  withdrawDeferral(access, vessel, params.deferralId ?? ""),
);
