"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { fetchJson } from "@/app/_components/fetch-json";
import { uploadWithProgress } from "@/app/_components/upload-with-progress";
import { queryKeys } from "@/app/_components/query-keys";
import type { AttachmentList, AttachmentView } from "@/server/attachments/contract";

const attachmentsKey = queryKeys.workOrderAttachments;

const attachmentsUrl = (vesselId: string, workOrderId: string) =>
  `/api/vessels/${vesselId}/work-orders/${workOrderId}/attachments`;

export function useAttachments(vesselId: string, workOrderId: string) {
  return useQuery({
    queryKey: attachmentsKey(vesselId, workOrderId),
    queryFn: () => fetchJson<AttachmentList>(attachmentsUrl(vesselId, workOrderId)),
  });
}

export function useUploadAttachment(vesselId: string, workOrderId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: ({ file, caption, onProgress }: { file: File; caption: string; onProgress: (share: number) => void }) => {
      const form = new FormData();
      form.append("file", file, file.name);
      if (caption.trim()) form.append("caption", caption.trim());
      return uploadWithProgress<AttachmentView>(attachmentsUrl(vesselId, workOrderId), form, onProgress);
    },
    onSettled: () => client.invalidateQueries({ queryKey: attachmentsKey(vesselId, workOrderId) }),
  });
}

export function useRemoveAttachment(vesselId: string, workOrderId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (attachmentId: string) =>
      fetchJson<{ removed: string }>(`${attachmentsUrl(vesselId, workOrderId)}/${attachmentId}`, { method: "DELETE" }),
    onSettled: () => client.invalidateQueries({ queryKey: attachmentsKey(vesselId, workOrderId) }),
  });
}
