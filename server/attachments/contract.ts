// Photos and documents on a work order's completion: the limits, the caption, and what the list
// route answers. Shared by the upload form and the route handlers.
import { z } from "zod";

export const ATTACHMENT_TYPES = ["image/jpeg", "image/png", "image/webp", "application/pdf"] as const;
export type AttachmentType = (typeof ATTACHMENT_TYPES)[number];

/** 10 MB: a phone's full-size photo fits, a video does not. */
export const MAX_ATTACHMENT_BYTES = 10 * 1024 * 1024;
/** Evidence, not an album: enough for found / during / after and a report or two. */
export const MAX_ATTACHMENTS_PER_WORK_ORDER = 12;
export const MAX_CAPTION_LENGTH = 200;

/** What the file input offers; the server still decides by the file's first bytes. */
export const ACCEPT = "image/jpeg,image/png,image/webp,application/pdf";

export const Caption = z
  .string()
  .trim()
  .max(MAX_CAPTION_LENGTH, { message: `Keep the caption under ${MAX_CAPTION_LENGTH} characters.` });

export const UploadFields = z.object({
  file: z.instanceof(Blob, { message: "Choose a photo (JPEG, PNG, WebP) or a PDF to attach." }),
  caption: Caption.optional(),
});

export type AttachmentView = {
  id: string;
  fileName: string;
  contentType: AttachmentType;
  byteSize: number;
  caption: string | null;
  uploadedBy: string | null;
  uploadedAt: string;
  /** The download route: the bytes always come through the app, never from the bucket directly. */
  url: string;
  mayRemove: boolean;
};

export type AttachmentList = {
  attachments: AttachmentView[];
  may: { add: boolean };
  /** Why nothing can be added or removed any more, when that is so. */
  lockedReason: string | null;
  limits: { maxFiles: number; maxBytes: number };
};

export function isImage(type: AttachmentType): boolean {
  return type !== "application/pdf";
}

/** "2.4 MB", "10 MB", "310 kB", "812 bytes": for lists and refusals. */
export function formatBytes(bytes: number): string {
  if (bytes >= 1024 * 1024) return `${(bytes / (1024 * 1024)).toFixed(1).replace(/\.0$/, "")} MB`;
  if (bytes >= 1024) return `${Math.round(bytes / 1024)} kB`;
  return `${bytes} bytes`;
}
