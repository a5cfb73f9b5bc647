"use client";

import { useQuery } from "@tanstack/react-query";
import { fetchJson } from "@/app/_components/fetch-json";
import type { FleetBoard } from "@/server/fleet/contract";

/** The board's key; kept here until app/_components/query-keys.ts carries it. */
export const fleetBoardKey = ["fleet", "board"] as const;

export function useFleetBoard() {
  return useQuery({
    queryKey: fleetBoardKey,
    queryFn: () => fetchJson<FleetBoard>("/api/fleet/board"),
    // The figures change with the worker's runs: a minute-old board is fresh enough.
    staleTime: 60_000,
  });
}
