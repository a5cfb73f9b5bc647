import { CompletionInput } from "@/server/completions/contract";
import { recordCompletion, resubmitCompletion } from "@/server/completions/record";
import { withAccess } from "@/server/http/with-access";
import { WorkOrderParams } from "@/server/http/params";

/** Records the job as done; it then awaits the chief engineer's approval. */
export const POST = withAccess(
  { permission: "readings:write", vessel: true, body: CompletionInput, params: WorkOrderParams },
  async ({ access, vessel, params, body }) => {
    const result = await recordCompletion(access, vessel, params.workOrderId, body);
    return Response.json(result, { status: 201 });
  },
);

/** Resubmits a completion the chief returned for correction. */
export const PUT = withAccess(
  { permission: "readings:write", vessel: true, body: CompletionInput, params: WorkOrderParams },
  async ({ access, vessel, params, body }) => {
    const result = await resubmitCompletion(access, vessel, params.workOrderId, body);
    return result;
  },
);
