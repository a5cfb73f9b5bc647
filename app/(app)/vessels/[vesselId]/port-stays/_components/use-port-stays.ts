"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { fetchJson } from "@/app/_components/fetch-json";
import { queryKeys } from "@/app/_components/query-keys";
import type {
  PackageCheck,
  PackageInput,
  PackageResult,
  PortStayDetail,
  PortStayInput,
  PortStayList,
  PortStayView,
  ProposalView,
} from "@/server/port-stays/contract";

const base = (vesselId: string) => `/api/vessels/${vesselId}/port-stays`;

export function usePortStays(vesselId: string) {
  return useQuery({
    queryKey: queryKeys.portStays(vesselId),
    queryFn: () => fetchJson<PortStayList>(base(vesselId)),
  });
}

export function usePortStay(vesselId: string, stayId: string) {
  return useQuery({
    queryKey: queryKeys.portStay(vesselId, stayId),
    queryFn: () => fetchJson<PortStayDetail>(`${base(vesselId)}/${stayId}`),
  });
}

/** A stay's dates show on the Calendar too: a change to one refreshes both. */
function useInvalidateStays(vesselId: string) {
  const client = useQueryClient();
  return () =>
    Promise.all([
      client.invalidateQueries({ queryKey: queryKeys.portStays(vesselId) }),
      client.invalidateQueries({ queryKey: queryKeys.calendarAll(vesselId) }),
    ]);
}

export function useSaveStay(vesselId: string) {
  const invalidate = useInvalidateStays(vesselId);
  return useMutation({
    mutationFn: ({ id, values }: { id?: string; values: PortStayInput }) =>
      fetchJson<PortStayView>(id ? `${base(vesselId)}/${id}` : base(vesselId), {
        method: id ? "PATCH" : "POST",
        body: JSON.stringify(values),
      }),
    onSuccess: invalidate,
  });
}

/**
 * After a delete the list drops the stay at once (the page goes back to it), and the stay itself is
 * not fetched again: it is gone.
 */
export function useDeleteStay(vesselId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: ({ id, releasePackage }: { id: string; releasePackage: boolean }) =>
      fetchJson<{ deleted: string; released: number }>(
        `${base(vesselId)}/${id}${releasePackage ? "?releasePackage=true" : ""}`,
        { method: "DELETE" },
      ),
    onSuccess: (_result, { id }) => {
      client.setQueryData<PortStayList>(queryKeys.portStays(vesselId), (list) =>
        list && {
          ...list,
          upcoming: list.upcoming.filter((s) => s.id !== id),
          past: list.past.filter((s) => s.id !== id),
        },
      );
      return Promise.all([
        client.invalidateQueries({ queryKey: queryKeys.calendarAll(vesselId) }),
        client.invalidateQueries({ queryKey: queryKeys.backlogAll(vesselId) }),
      ]);
    },
  });
}

export function usePropose(vesselId: string, stayId: string) {
  return useMutation({
    mutationFn: () => fetchJson<ProposalView>(`${base(vesselId)}/${stayId}/proposal`, { method: "POST" }),
  });
}

/** Accepted work gets planned dates: the Calendar and the Backlog show them. */
export function useAcceptPackage(vesselId: string, stayId: string) {
  const invalidate = useInvalidateStays(vesselId);
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: PackageInput) =>
      fetchJson<PackageResult>(`${base(vesselId)}/${stayId}/package`, { method: "PUT", body: JSON.stringify(input) }),
    onSuccess: () =>
      Promise.all([
        invalidate(),
        client.invalidateQueries({ queryKey: queryKeys.backlogAll(vesselId) }),
      ]),
  });
}

/** The draft as the server would store it; writes nothing. */
export function checkPackage(vesselId: string, stayId: string, input: PackageInput): Promise<PackageCheck> {
  return fetchJson<PackageCheck>(`${base(vesselId)}/${stayId}/package/check`, { method: "POST", body: JSON.stringify(input) });
}
