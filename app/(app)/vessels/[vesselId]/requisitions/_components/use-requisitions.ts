"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { fetchJson } from "@/app/_components/fetch-json";
import { queryKeys } from "@/app/_components/query-keys";
import type { ReceiptInput, RequisitionInput, RequisitionList, RequisitionView, StayParts } from "@/server/parts/contract";

const base = (vesselId: string) => `/api/vessels/${vesselId}/requisitions`;

export function useRequisitions(vesselId: string) {
  return useQuery({ queryKey: queryKeys.requisitions(vesselId), queryFn: () => fetchJson<RequisitionList>(base(vesselId)) });
}

/** The parts a stay's jobs need: the accepted package's, or the jobs given (a proposal on screen). */
export function useStayParts(vesselId: string, stayId: string, jobs: string[] | null, minimum: boolean) {
  const list = jobs ? jobs.join(",") : "";
  return useQuery({
    queryKey: queryKeys.stayParts(vesselId, stayId, jobs ? list : "accepted", minimum),
    queryFn: () => fetchJson<StayParts>(`/api/vessels/${vesselId}/port-stays/${stayId}/parts?minimum=${minimum ? 1 : 0}${jobs ? `&jobs=${list}` : ""}`),
  });
}

/** Every change refreshes the vessel's requisitions, the stay's parts and the stores. */
function useRequisitionMutation<I>(vesselId: string, send: (input: I) => Promise<RequisitionView>) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: send,
    onSuccess: () =>
      Promise.all([
        client.invalidateQueries({ queryKey: queryKeys.requisitions(vesselId) }),
        client.invalidateQueries({ queryKey: queryKeys.stores(vesselId) }),
        client.invalidateQueries({ queryKey: ["fleet-requisitions"] }),
      ]),
  });
}

const post = (url: string, method: string, body: unknown) => fetchJson<RequisitionView>(url, { method, body: JSON.stringify(body) });

export function useDraftRequisition(vesselId: string) {
  return useRequisitionMutation(vesselId, (input: RequisitionInput) => post(base(vesselId), "POST", input));
}

export function useEditRequisition(vesselId: string, id: string) {
  return useRequisitionMutation(vesselId, (input: Partial<RequisitionInput>) => post(`${base(vesselId)}/${id}`, "PATCH", input));
}

export function useMoveRequisition(vesselId: string, id: string) {
  return useRequisitionMutation(vesselId, (input: { to: "sent" | "ordered" | "cancelled"; orderRef?: string }) => post(`${base(vesselId)}/${id}/state`, "POST", input));
}

export function useReceiveRequisition(vesselId: string, id: string) {
  return useRequisitionMutation(vesselId, (input: ReceiptInput) => post(`${base(vesselId)}/${id}/receipts`, "POST", input));
}
