"use client";

import { keepPreviousData, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { fetchJson } from "@/app/_components/fetch-json";
import { queryKeys } from "@/app/_components/query-keys";
import type { CalendarRange, PlannedDateResult } from "@/server/calendar/contract";

export type VisibleRange = { start: string; end: string };

export function useCalendar(vesselId: string, range: VisibleRange | null) {
  return useQuery({
    queryKey: queryKeys.calendar(vesselId, range?.start ?? "", range?.end ?? ""),
    queryFn: () =>
      fetchJson<CalendarRange>(`/api/vessels/${vesselId}/calendar?start=${range!.start}&end=${range!.end}`),
    enabled: range !== null,
    // Going to the next month keeps this month's events on screen until the next ones arrive.
    placeholderData: keepPreviousData,
    staleTime: 60_000,
  });
}

/** Sets (a day) or clears (null) a work order's planned date; the Calendar and the Backlog both show it. */
export function usePlanDate(vesselId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: ({ workOrderId, plannedDate }: { workOrderId: string; plannedDate: string | null }) =>
      fetchJson<PlannedDateResult>(`/api/vessels/${vesselId}/work-orders/${workOrderId}/planned-date`, {
        method: "PUT",
        body: JSON.stringify({ plannedDate }),
      }),
    onSettled: (_result, _error, { workOrderId }) =>
      Promise.all([
        client.invalidateQueries({ queryKey: queryKeys.calendarAll(vesselId) }),
        client.invalidateQueries({ queryKey: queryKeys.backlogAll(vesselId) }),
        client.invalidateQueries({ queryKey: queryKeys.workOrder(vesselId, workOrderId) }),
      ]),
  });
}
