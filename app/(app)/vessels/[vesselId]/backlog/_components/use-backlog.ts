"use client";

import { keepPreviousData, useQuery } from "@tanstack/react-query";
import { fetchJson } from "@/app/_components/fetch-json";
import { queryKeys } from "@/app/_components/query-keys";
import type { BacklogPage } from "@/server/backlog/contract";

export function useBacklog(vesselId: string, search: string) {
  return useQuery({
    queryKey: queryKeys.backlog(vesselId, search),
    queryFn: () => fetchJson<BacklogPage>(`/api/vessels/${vesselId}/backlog${search ? `?${search}` : ""}`),
    placeholderData: keepPreviousData,
    // The worker recomputes in the background: a minute-old Backlog is fresh enough on a ship's link.
    staleTime: 60_000,
  });
}
