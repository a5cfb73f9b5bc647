import { DecisionInput } from "@/server/completions/contract";
import { decideCompletion } from "@/server/completions/decision";
import { withAccess } from "@/server/http/with-access";
import { requestRecompute } from "@/server/jobs";

/** The chief engineer approves a completion or returns it with a note. */
export const POST = withAccess(
  { permission: "work:approve", vessel: true, body: DecisionInput },
  async ({ access, vessel, params, body }) => {
    const result = await decideCompletion(access, vessel, params.workOrderId ?? "", body);
    // The worker schedules the next occurrence from the approved completion.
    if (result.status === "approved") await requestRecompute(access.company.id, vessel.id);
    return result;
  },
);
