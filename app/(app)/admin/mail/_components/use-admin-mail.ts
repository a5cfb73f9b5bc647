"use client";

import { useQuery } from "@tanstack/react-query";
import { fetchJson } from "@/app/_components/fetch-json";
import type { AdminMail } from "@/server/mail/contract";

// Not in app/_components/query-keys.ts yet (that file belongs to another change): move it there.
export const adminMailKey = ["admin", "mail"] as const;

export function useAdminMail() {
  return useQuery({
    queryKey: adminMailKey,
    queryFn: () => fetchJson<AdminMail>("/api/admin/mail"),
    // Mail arrives on its own: keep the page current while it is open.
    refetchInterval: 10_000,
  });
}
