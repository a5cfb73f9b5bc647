"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { fetchJson, ProblemError } from "@/app/_components/fetch-json";
import { queryKeys } from "@/app/_components/query-keys";
import type { AttachmentList, AttachmentView } from "@/server/attachments/contract";
import type { Problem } from "@/server/http/problem";

const attachmentsKey = queryKeys.workOrderAttachments;

const attachmentsUrl = (vesselId: string, workOrderId: string) =>
  `/api/vessels/${vesselId}/work-orders/${workOrderId}/attachments`;

export function useAttachments(vesselId: string, workOrderId: string) {
  return useQuery({
    queryKey: attachmentsKey(vesselId, workOrderId),
    queryFn: () => fetchJson<AttachmentList>(attachmentsUrl(vesselId, workOrderId)),
  });
}

/**
 * Sends one file as multipart/form-data. XMLHttpRequest rather than fetch: only it reports upload
 * progress, which matters on a ship's slow link. `onProgress` gets 0…1.
 */
function uploadWithProgress(url: string, form: FormData, onProgress: (share: number) => void): Promise<AttachmentView> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open("POST", url);
    xhr.setRequestHeader("accept", "application/json");
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable) onProgress(event.loaded / event.total);
    };
    xhr.onload = () => {
      let body: unknown = null;
      try {
        body = xhr.responseText ? JSON.parse(xhr.responseText) : null;
      } catch {
        /* not JSON: answered below by status */
      }
      if (xhr.status >= 200 && xhr.status < 300) return resolve(body as AttachmentView);
      const problem: Problem =
        body && typeof body === "object" && "detail" in body
          ? (body as Problem)
          : { type: "about:blank", title: xhr.statusText, status: xhr.status, detail: `The server answered ${xhr.status}.` };
      reject(new ProblemError(problem));
    };
    xhr.onerror = () => reject(new Error("network"));
    xhr.send(form);
  });
}

export function useUploadAttachment(vesselId: string, workOrderId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: ({ file, caption, onProgress }: { file: File; caption: string; onProgress: (share: number) => void }) => {
      const form = new FormData();
      form.append("file", file, file.name);
      if (caption.trim()) form.append("caption", caption.trim());
      return uploadWithProgress(attachmentsUrl(vesselId, workOrderId), form, onProgress);
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
