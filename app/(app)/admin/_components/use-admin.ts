"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { fetchJson } from "@/app/_components/fetch-json";
import { queryKeys } from "@/app/_components/query-keys";
import type {
  AdminPeopleList,
  AdminPerson,
  AdminVessel,
  AdminVesselList,
  UserInput,
  UserPatch,
  VesselInput,
  VesselPatch,
} from "@/server/admin/contract";

export function useAdminVessels() {
  return useQuery({
    queryKey: queryKeys.adminVessels(),
    queryFn: () => fetchJson<AdminVesselList>("/api/admin/vessels"),
  });
}

export function useAdminPeople() {
  return useQuery({
    queryKey: queryKeys.adminPeople(),
    queryFn: () => fetchJson<AdminPeopleList>("/api/admin/users"),
  });
}

/** After any change both lists are stale: people show vessel names, vessels count their people. */
function useRefreshAdmin() {
  const client = useQueryClient();
  const router = useRouter();
  return async () => {
    await Promise.all([
      client.invalidateQueries({ queryKey: queryKeys.adminVessels() }),
      client.invalidateQueries({ queryKey: queryKeys.adminPeople() }),
    ]);
    // The header's vessel menu is rendered on the server.
    router.refresh();
  };
}

export function useSaveVessel() {
  const refresh = useRefreshAdmin();
  return useMutation({
    mutationFn: ({ id, values }: { id?: string; values: VesselInput | VesselPatch }) =>
      id
        ? fetchJson<AdminVessel>(`/api/admin/vessels/${id}`, { method: "PATCH", body: JSON.stringify(values) })
        : fetchJson<AdminVessel>("/api/admin/vessels", { method: "POST", body: JSON.stringify(values) }),
    onSuccess: refresh,
  });
}

export function useRetireVessel() {
  const refresh = useRefreshAdmin();
  return useMutation({
    mutationFn: (id: string) => fetchJson<AdminVessel>(`/api/admin/vessels/${id}`, { method: "DELETE" }),
    onSuccess: refresh,
  });
}

export function useCreatePerson() {
  const refresh = useRefreshAdmin();
  return useMutation({
    mutationFn: (values: UserInput) =>
      fetchJson<AdminPerson>("/api/admin/users", { method: "POST", body: JSON.stringify(values) }),
    onSuccess: refresh,
  });
}

export function useUpdatePerson() {
  const refresh = useRefreshAdmin();
  return useMutation({
    mutationFn: ({ id, changes }: { id: string; changes: UserPatch }) =>
      fetchJson<AdminPerson>(`/api/admin/users/${id}`, { method: "PATCH", body: JSON.stringify(changes) }),
    onSuccess: refresh,
  });
}

/** E-mails a person a one-time link to choose a password (the invitation again while unanswered). */
export function useSendPasswordLink() {
  const refresh = useRefreshAdmin();
  return useMutation({
    mutationFn: (id: string) =>
      fetchJson<{ sent: "invitation" | "password-reset" }>(`/api/admin/users/${id}/password-link`, { method: "POST" }),
    onSuccess: refresh,
  });
}
