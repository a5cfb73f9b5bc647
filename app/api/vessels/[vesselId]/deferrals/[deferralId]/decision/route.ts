import { DeferralDecisionInput } from "@/server/deferrals/contract";
import { decideDeferral } from "@/server/deferrals/decision";
import { withAccess } from "@/server/http/with-access";
import { DeferralParams } from "@/server/http/params";

/** The superintendent (or, for plain work where the company allows it, the chief) decides a request. */
export const POST = withAccess(
  { permission: "deferral:decide", vessel: true, body: DeferralDecisionInput, params: DeferralParams },
  async ({ access, vessel, params, body }) => {
    const result = await decideDeferral(access, vessel, params.deferralId, body);
    return result;
  },
);
