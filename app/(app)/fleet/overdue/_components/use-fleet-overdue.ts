"use client";

import { useQuery } from "@tanstack/react-query";
import { fetchJson } from "@/app/_components/fetch-json";
import { queryKeys } from "@/app/_components/query-keys";
import type { FleetOverdue } from "@/server/fleet/overdue-contract";

export function useFleetOverdue(search: string) {
  return useQuery({
    queryKey: queryKeys.fleetOverdue(search),
    queryFn: () => fetchJson<FleetOverdue>(`/api/fleet/overdue${search ? `?${search}` : ""}`),
    staleTime: 60_000,
    placeholderData: (previous) => previous,
  });
}
