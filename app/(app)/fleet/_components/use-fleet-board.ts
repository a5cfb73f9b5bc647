"use client";

import { useQuery } from "@tanstack/react-query";
import { fetchJson } from "@/app/_components/fetch-json";
import { queryKeys } from "@/app/_components/query-keys";
import type { FleetBoard } from "@/server/fleet/contract";

export function useFleetBoard() {
  return useQuery({
    queryKey: queryKeys.fleetBoard(),
    queryFn: () => fetchJson<FleetBoard>("/api/fleet/board"),
    // The figures change with the worker's runs: a minute-old board is fresh enough.
    staleTime: 60_000,
  });
}
