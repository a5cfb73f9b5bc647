"use client";

import { keepPreviousData, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { fetchJson } from "@/app/_components/fetch-json";
import { queryKeys } from "@/app/_components/query-keys";
import type {
  CopyResult,
  CopyTarget,
  RoutineInput,
  RoutineList,
  RoutinePatchInput,
  RoutineView,
} from "@/server/routines/contract";

export function useRoutines(vesselId: string, component: string, q: string) {
  const search = new URLSearchParams({ ...(component ? { component } : {}), ...(q ? { q } : {}) }).toString();
  return useQuery({
    queryKey: queryKeys.routineList(vesselId, component, q),
    queryFn: () => fetchJson<RoutineList>(`/api/vessels/${vesselId}/routines${search ? `?${search}` : ""}`),
    // Typing in the filter keeps the last rows on screen instead of flashing an empty table.
    placeholderData: keepPreviousData,
  });
}

/** One routine's whole definition, loaded when it is opened for editing. */
export function useRoutine(vesselId: string, routineId: string) {
  return useQuery({
    queryKey: queryKeys.routine(vesselId, routineId),
    queryFn: () => fetchJson<RoutineView>(`/api/vessels/${vesselId}/routines/${routineId}`),
  });
}

export function useCopyTargets(vesselId: string, routineId: string) {
  return useQuery({
    queryKey: queryKeys.routineCopyTargets(vesselId, routineId),
    queryFn: () => fetchJson<CopyTarget[]>(`/api/vessels/${vesselId}/routines/${routineId}/copies`),
  });
}

type Request = { method: "POST" | "PATCH" | "DELETE"; path: string; body?: unknown };

/** One write to the routines; afterwards the routines and the Backlog (which the worker rewrites) reload. */
function useRoutineWrite<V, R>(vesselId: string, toRequest: (vars: V) => Request) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (vars: V) => {
      const { method, path, body } = toRequest(vars);
      return fetchJson<R>(`/api/vessels/${vesselId}/routines${path}`, {
        method,
        ...(body === undefined ? {} : { body: JSON.stringify(body) }),
      });
    },
    onSuccess: async () => {
      await Promise.all([
        client.invalidateQueries({ queryKey: queryKeys.routines(vesselId) }),
        client.invalidateQueries({ queryKey: queryKeys.backlogAll(vesselId) }),
      ]);
    },
  });
}

export function useAddRoutine(vesselId: string) {
  return useRoutineWrite<RoutineInput, RoutineView>(vesselId, (input) => ({ method: "POST", path: "", body: input }));
}

export function useChangeRoutine(vesselId: string) {
  return useRoutineWrite<{ id: string; change: RoutinePatchInput }, RoutineView>(vesselId, ({ id, change }) => ({
    method: "PATCH",
    path: `/${id}`,
    body: change,
  }));
}

export function useRetireRoutine(vesselId: string) {
  return useRoutineWrite<string, { openWorkOrdersRemoved: number }>(vesselId, (id) => ({
    method: "DELETE",
    path: `/${id}`,
  }));
}

export function useCopyRoutine(vesselId: string) {
  return useRoutineWrite<{ id: string; componentIds: string[] }, CopyResult>(vesselId, ({ id, componentIds }) => ({
    method: "POST",
    path: `/${id}/copies`,
    body: { componentIds },
  }));
}
