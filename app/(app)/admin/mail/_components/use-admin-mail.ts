"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { fetchJson } from "@/app/_components/fetch-json";
import { queryKeys } from "@/app/_components/query-keys";
import type { AdminMail, ClearCaughtResult, MailActionResult } from "@/server/mail/contract";

const adminMailKey = queryKeys.adminMail();

export function useAdminMail() {
  return useQuery({
    queryKey: adminMailKey,
    queryFn: () => fetchJson<AdminMail>("/api/admin/mail"),
    // Mail arrives on its own: keep the page current while it is open.
    refetchInterval: 10_000,
  });
}

/** "Try again" or "Cancel" on one outbox row; the list is read again afterwards, done or refused. */
export function useOutboxAction() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: ({ id, action }: { id: string; action: "retry" | "cancel" }) =>
      fetchJson<MailActionResult>(`/api/admin/mail/${id}/${action}`, { method: "POST" }),
    onSettled: () => client.invalidateQueries({ queryKey: adminMailKey }),
  });
}

export function useClearCaught() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: () => fetchJson<ClearCaughtResult>("/api/admin/mail/caught", { method: "DELETE" }),
    onSettled: () => client.invalidateQueries({ queryKey: adminMailKey }),
  });
}
