"use client";
// Uploads with a progress bar (attachments, plan imports).
import { ProblemError } from "@/app/_components/fetch-json";
import type { Problem } from "@/server/http/problem";

/**
 * Sends a form with files as multipart/form-data. XMLHttpRequest rather than fetch: only it reports upload
 * progress, which matters on a ship's slow link. `onProgress` gets 0…1.
 */
export function uploadWithProgress<T>(url: string, form: FormData, onProgress: (share: number) => void): Promise<T> {
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
      if (xhr.status >= 200 && xhr.status < 300) return resolve(body as T);
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

