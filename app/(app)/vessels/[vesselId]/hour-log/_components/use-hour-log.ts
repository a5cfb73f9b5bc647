"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { fetchJson } from "@/app/_components/fetch-json";
import { queryKeys } from "@/app/_components/query-keys";
import type {
  HourLogView,
  ReadingBatchInput,
  ReadingBatchResult,
  ReadingCorrectionInput,
  ReadingCorrectionResult,
  ReadingHistory,
  ReadingRemovalInput,
} from "@/server/readings/contract";

export function useHourLog(vesselId: string) {
  return useQuery({
    queryKey: queryKeys.hourLog(vesselId),
    queryFn: () => fetchJson<HourLogView>(`/api/vessels/${vesselId}/hour-log`),
  });
}

export function useReadingHistory(vesselId: string, counterId: string | undefined, days = 90) {
  return useQuery({
    queryKey: queryKeys.readingHistory(vesselId, counterId ?? "", days),
    queryFn: () =>
      fetchJson<ReadingHistory>(`/api/vessels/${vesselId}/readings?counterId=${counterId}&days=${days}`),
    enabled: Boolean(counterId),
  });
}

export function useSaveReadings(vesselId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (batch: ReadingBatchInput) =>
      fetchJson<ReadingBatchResult>(`/api/vessels/${vesselId}/readings`, {
        method: "POST",
        body: JSON.stringify(batch),
      }),
    onSuccess: () => refreshAfterReadings(client, vesselId),
  });
}

/** Corrects a reading's value (and remark); the reason goes into its audit trail. */
export function useCorrectReading(vesselId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: ({ readingId, input }: { readingId: string; input: ReadingCorrectionInput }) =>
      fetchJson<ReadingCorrectionResult>(`/api/vessels/${vesselId}/readings/${readingId}`, {
        method: "PATCH",
        body: JSON.stringify(input),
      }),
    onSuccess: () => refreshAfterReadings(client, vesselId),
  });
}

/** Removes a reading; its value and the reason stay in the audit trail. */
export function useRemoveReading(vesselId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: ({ readingId, input }: { readingId: string; input: ReadingRemovalInput }) =>
      fetchJson<ReadingCorrectionResult>(`/api/vessels/${vesselId}/readings/${readingId}`, {
        method: "DELETE",
        body: JSON.stringify(input),
      }),
    onSuccess: () => refreshAfterReadings(client, vesselId),
  });
}

function refreshAfterReadings(client: ReturnType<typeof useQueryClient>, vesselId: string) {
  return Promise.all([
    client.invalidateQueries({ queryKey: queryKeys.hourLog(vesselId) }),
    client.invalidateQueries({ queryKey: queryKeys.readings(vesselId) }),
    // New hours move hours-based work orders: the worker rewrites them within a second or two.
    client.invalidateQueries({ queryKey: queryKeys.backlogAll(vesselId) }),
  ]);
}
