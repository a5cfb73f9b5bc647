"use client";

import { useQuery } from "@tanstack/react-query";
import { fetchJson } from "@/app/_components/fetch-json";
import { queryKeys } from "@/app/_components/query-keys";
import type { RoutineTrends } from "@/server/measurements/contract";

/** The routine's measurement trends, under the work order's key (an approval refreshes them). */
export function useRoutineTrends(vesselId: string, workOrderId: string, routineId: string) {
  return useQuery({
    queryKey: queryKeys.workOrderTrends(vesselId, workOrderId, routineId),
    queryFn: () => fetchJson<RoutineTrends>(`/api/vessels/${vesselId}/routines/${routineId}/trends`),
  });
}
