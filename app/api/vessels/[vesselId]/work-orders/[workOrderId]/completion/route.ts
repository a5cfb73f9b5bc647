import { CompletionInput } from "@/server/completions/contract";
import { recordCompletion, resubmitCompletion } from "@/server/completions/record";
import { withAccess } from "@/server/http/with-access";
import { requestRecompute } from "@/server/jobs";

/** Records the job as done; it then awaits the chief engineer's approval. */
export const POST = withAccess(
  { permission: "readings:write", vessel: true, body: CompletionInput },
  async ({ access, vessel, params, body }) => {
    const result = await recordCompletion(access, vessel, params.workOrderId ?? "", body);
    // A follow-up raised by a measurement out of limits gets its windows from the worker.
    if (result.followUpNumber) await requestRecompute(access.company.id, vessel.id);
    return Response.json(result, { status: 201 });
  },
);

/** Resubmits a completion the chief returned for correction. */
export const PUT = withAccess(
  { permission: "readings:write", vessel: true, body: CompletionInput },
  async ({ access, vessel, params, body }) => {
    const result = await resubmitCompletion(access, vessel, params.workOrderId ?? "", body);
    if (result.followUpNumber) await requestRecompute(access.company.id, vessel.id);
    return result;
  },
);
