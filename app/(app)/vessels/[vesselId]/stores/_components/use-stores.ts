"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { fetchJson } from "@/app/_components/fetch-json";
import { queryKeys } from "@/app/_components/query-keys";
import type { Catalogue, LocationInput, MovementInput, StoresView } from "@/server/parts/contract";

const base = (vesselId: string) => `/api/vessels/${vesselId}/stores`;

export function useStores(vesselId: string) {
  return useQuery({ queryKey: queryKeys.stores(vesselId), queryFn: () => fetchJson<StoresView>(base(vesselId)) });
}

export function useCatalogue() {
  return useQuery({ queryKey: queryKeys.parts(), queryFn: () => fetchJson<Catalogue>("/api/parts") });
}

export function useRecordMovement(vesselId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: MovementInput) =>
      fetchJson<{ changed: boolean; onBoard: number }>(`${base(vesselId)}/movements`, { method: "POST", body: JSON.stringify(input) }),
    onSuccess: () => client.invalidateQueries({ queryKey: queryKeys.stores(vesselId) }),
  });
}

export function useAddLocation(vesselId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: LocationInput) =>
      fetchJson<{ id: string; place: string }>(`${base(vesselId)}/locations`, { method: "POST", body: JSON.stringify(input) }),
    onSuccess: () => client.invalidateQueries({ queryKey: queryKeys.stores(vesselId) }),
  });
}
