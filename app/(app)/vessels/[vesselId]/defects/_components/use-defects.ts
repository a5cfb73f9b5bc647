"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { fetchJson } from "@/app/_components/fetch-json";
import type { DefectInput, DefectList, DefectPlanInput, DefectView } from "@/server/defects/contract";

const base = (vesselId: string) => `/api/vessels/${vesselId}/defects`;
const key = (vesselId: string, state: string) => ["vessel", vesselId, "defects", state] as const;

export function useDefects(vesselId: string, state: "open" | "all") {
  return useQuery({ queryKey: key(vesselId, state), queryFn: () => fetchJson<DefectList>(`${base(vesselId)}?state=${state}`) });
}

/** A report or a plan changes the defects, the Backlog and the Calendar. */
function useDefectMutation<I>(vesselId: string, send: (input: I) => Promise<DefectView>) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: send,
    onSuccess: () =>
      Promise.all(["defects", "backlog", "calendar"].map((what) => client.invalidateQueries({ queryKey: ["vessel", vesselId, what] }))),
  });
}

export function useReportDefect(vesselId: string) {
  return useDefectMutation(vesselId, (input: DefectInput) => fetchJson<DefectView>(base(vesselId), { method: "POST", body: JSON.stringify(input) }));
}

export function usePlanDefect(vesselId: string, defectId: string) {
  return useDefectMutation(vesselId, (input: DefectPlanInput) =>
    fetchJson<DefectView>(`${base(vesselId)}/${defectId}/plan`, { method: "POST", body: JSON.stringify(input) }),
  );
}
