"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { fetchJson } from "@/app/_components/fetch-json";
import { queryKeys } from "@/app/_components/query-keys";
import type {
  ComponentInput,
  ComponentPatchInput,
  CounterInput,
  CounterPatchInput,
  MeterReplacementInput,
  MeterReplacementResult,
  RegisterView,
} from "@/server/register/contract";

export function useRegister(vesselId: string) {
  return useQuery({
    queryKey: queryKeys.register(vesselId),
    queryFn: () => fetchJson<RegisterView>(`/api/vessels/${vesselId}/register`),
  });
}

type Request = { method: "POST" | "PATCH" | "DELETE"; path: string; body?: unknown };

/** One write to the register; afterwards the register and the Hour log (its counters) reload. */
function useRegisterWrite<V, R = unknown>(vesselId: string, toRequest: (vars: V) => Request) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (vars: V) => {
      const { method, path, body } = toRequest(vars);
      return fetchJson<R>(`/api/vessels/${vesselId}/${path}`, {
        method,
        ...(body === undefined ? {} : { body: JSON.stringify(body) }),
      });
    },
    onSuccess: async () => {
      await Promise.all([
        client.invalidateQueries({ queryKey: queryKeys.register(vesselId) }),
        client.invalidateQueries({ queryKey: queryKeys.hourLog(vesselId) }),
        client.invalidateQueries({ queryKey: queryKeys.readings(vesselId) }),
      ]);
    },
  });
}

export function useAddComponent(vesselId: string) {
  return useRegisterWrite(vesselId, (input: ComponentInput) => ({ method: "POST", path: "components", body: input }));
}

/** Edit, or move when the change holds `parentId`. */
export function useChangeComponent(vesselId: string) {
  return useRegisterWrite(vesselId, ({ id, change }: { id: string; change: ComponentPatchInput }) => ({
    method: "PATCH",
    path: `components/${id}`,
    body: change,
  }));
}

export function useAddCounter(vesselId: string) {
  return useRegisterWrite(vesselId, (input: CounterInput) => ({ method: "POST", path: "counters", body: input }));
}

export function useChangeCounter(vesselId: string) {
  return useRegisterWrite(vesselId, ({ id, change }: { id: string; change: CounterPatchInput }) => ({
    method: "PATCH",
    path: `counters/${id}`,
    body: change,
  }));
}

export function useRetireCounter(vesselId: string) {
  return useRegisterWrite(vesselId, (id: string) => ({ method: "DELETE", path: `counters/${id}` }));
}

export function useReplaceMeter(vesselId: string) {
  return useRegisterWrite<{ id: string; input: MeterReplacementInput }, MeterReplacementResult>(
    vesselId,
    ({ id, input }) => ({
      method: "POST",
      path: `counters/${id}/replacements`,
      body: input,
    }),
  );
}
