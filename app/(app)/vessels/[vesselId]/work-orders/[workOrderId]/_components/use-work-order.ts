"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { fetchJson } from "@/app/_components/fetch-json";
import { queryKeys } from "@/app/_components/query-keys";
import type { CompletionInput, CompletionResult, DecisionInput } from "@/server/completions/contract";
import type {
  DeferralDecisionInput,
  DeferralRequestInput,
  DeferralRequestResult,
  DeferralResult,
  WorkOrderWithDeferrals,
} from "@/server/deferrals/contract";

export function useWorkOrder(vesselId: string, workOrderId: string) {
  return useQuery({
    queryKey: queryKeys.workOrder(vesselId, workOrderId),
    queryFn: () => fetchJson<WorkOrderWithDeferrals>(`/api/vessels/${vesselId}/work-orders/${workOrderId}`),
  });
}

/** After a completion or a decision the work order and the Backlog's marks both change. */
function useInvalidate(vesselId: string, workOrderId: string) {
  const client = useQueryClient();
  return () =>
    Promise.all([
      client.invalidateQueries({ queryKey: queryKeys.workOrder(vesselId, workOrderId) }),
      client.invalidateQueries({ queryKey: queryKeys.backlogAll(vesselId) }),
      client.invalidateQueries({ queryKey: queryKeys.calendarAll(vesselId) }),
      client.invalidateQueries({ queryKey: queryKeys.deferrals(vesselId) }),
    ]);
}

export function useSaveCompletion(vesselId: string, workOrderId: string, resubmit: boolean) {
  const invalidate = useInvalidate(vesselId, workOrderId);
  return useMutation({
    mutationFn: (input: CompletionInput) =>
      fetchJson<CompletionResult>(`/api/vessels/${vesselId}/work-orders/${workOrderId}/completion`, {
        method: resubmit ? "PUT" : "POST",
        body: JSON.stringify(input),
      }),
    onSuccess: invalidate,
  });
}

export function useDecideCompletion(vesselId: string, workOrderId: string) {
  const invalidate = useInvalidate(vesselId, workOrderId);
  return useMutation({
    mutationFn: (input: DecisionInput) =>
      fetchJson<{ status: string }>(`/api/vessels/${vesselId}/work-orders/${workOrderId}/completion/decision`, {
        method: "POST",
        body: JSON.stringify(input),
      }),
    onSuccess: invalidate,
  });
}

export function useRequestDeferral(vesselId: string, workOrderId: string) {
  const invalidate = useInvalidate(vesselId, workOrderId);
  return useMutation({
    mutationFn: (input: DeferralRequestInput) =>
      fetchJson<DeferralRequestResult>(`/api/vessels/${vesselId}/work-orders/${workOrderId}/deferrals`, {
        method: "POST",
        body: JSON.stringify(input),
      }),
    onSuccess: invalidate,
  });
}

export function useDecideDeferral(vesselId: string, workOrderId: string) {
  const invalidate = useInvalidate(vesselId, workOrderId);
  return useMutation({
    mutationFn: ({ deferralId, ...input }: DeferralDecisionInput & { deferralId: string }) =>
      fetchJson<DeferralResult>(`/api/vessels/${vesselId}/deferrals/${deferralId}/decision`, {
        method: "POST",
        body: JSON.stringify(input),
      }),
    onSuccess: invalidate,
  });
}

export function useWithdrawDeferral(vesselId: string, workOrderId: string) {
  const invalidate = useInvalidate(vesselId, workOrderId);
  return useMutation({
    mutationFn: (deferralId: string) =>
      fetchJson<DeferralResult>(`/api/vessels/${vesselId}/deferrals/${deferralId}`, { method: "DELETE" }),
    onSuccess: invalidate,
  });
}
