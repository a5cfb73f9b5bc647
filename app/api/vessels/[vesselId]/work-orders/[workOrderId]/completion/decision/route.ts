import { DecisionInput } from "@/server/completions/contract";
import { decideCompletion } from "@/server/completions/decision";
import { withAccess } from "@/server/http/with-access";

/** The chief engineer approves a completion or returns it with a note. */
export const POST = withAccess(
  { permission: "work:approve", vessel: true, body: DecisionInput },
  async ({ access, vessel, params, body }) => {
    const result = await decideCompletion(access, vessel, params.workOrderId ?? "", body);
    return result;
  },
);
