import { DecisionInput } from "@/server/completions/contract";
import { decideCompletion } from "@/server/completions/decision";
import { withAccess } from "@/server/http/with-access";
import { WorkOrderParams } from "@/server/http/params";

/** The chief engineer approves a completion or returns it with a note. */
export const POST = withAccess(
  { permission: "work:approve", vessel: true, body: DecisionInput, params: WorkOrderParams },
  async ({ access, vessel, params, body }) => {
    const result = await decideCompletion(access, vessel, params.workOrderId, body);
    return result;
  },
);
