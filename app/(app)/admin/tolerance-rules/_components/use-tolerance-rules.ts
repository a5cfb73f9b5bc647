"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { fetchJson } from "@/app/_components/fetch-json";
import { queryKeys } from "@/app/_components/query-keys";
import type {
  AdminToleranceRule,
  AdminToleranceRuleList,
  RestoredPresets,
  ToleranceRuleInput,
  ToleranceRulePatch,
} from "@/server/tolerance/contract";

export function useToleranceRules() {
  return useQuery({
    queryKey: queryKeys.adminToleranceRules(),
    queryFn: () => fetchJson<AdminToleranceRuleList>("/api/admin/tolerance-rules"),
  });
}

/** Every change may move work-order states; the worker recomputes, the Backlog refetches on its own. */
function useRefreshRules() {
  const client = useQueryClient();
  return () => client.invalidateQueries({ queryKey: queryKeys.adminToleranceRules() });
}

export function useSaveToleranceRule() {
  const refresh = useRefreshRules();
  return useMutation({
    mutationFn: ({ id, values }: { id?: string; values: ToleranceRuleInput | ToleranceRulePatch }) =>
      id
        ? fetchJson<AdminToleranceRule>(`/api/admin/tolerance-rules/${id}`, {
            method: "PATCH",
            body: JSON.stringify(values),
          })
        : fetchJson<AdminToleranceRule>("/api/admin/tolerance-rules", { method: "POST", body: JSON.stringify(values) }),
    onSuccess: refresh,
  });
}

export function useDeleteToleranceRule() {
  const refresh = useRefreshRules();
  return useMutation({
    mutationFn: (id: string) =>
      fetchJson<{ deleted: string }>(`/api/admin/tolerance-rules/${id}`, { method: "DELETE" }),
    onSuccess: refresh,
  });
}

export function useRestorePresets() {
  const refresh = useRefreshRules();
  return useMutation({
    mutationFn: () => fetchJson<RestoredPresets>("/api/admin/tolerance-rules/presets", { method: "POST" }),
    onSuccess: refresh,
  });
}
