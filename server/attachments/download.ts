// A stored photo or document streamed back through the app (never a bucket URL): with the type
// the server found at upload, inline for images (thumbnails, a tap to enlarge), as a download for
// PDFs.
import "server-only";
import { AppError } from "@/server/http/problem";
import { getObjectStream } from "@/server/storage/s3";
import { type AttachmentType, isImage } from "./contract";

type Stored = { objectKey: string; fileName: string; contentType: AttachmentType; byteSize: number; sha256: string };

/** RFC 6266: an ASCII fallback name and the exact name as UTF-8 (RFC 8187). */
export function contentDisposition(kind: "inline" | "attachment", fileName: string): string {
  const fallback = fileName.replace(/[^\x20-\x7e]|["\\%]/g, "_");
  const exact = encodeURIComponent(fileName).replace(/['()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);
  return `${kind}; filename="${fallback}"; filename*=UTF-8''${exact}`;
}

export async function attachmentResponse(stored: Stored): Promise<Response> {
  const body = await getObjectStream(stored.objectKey);
  if (!body) throw new AppError("not-found", "The file of this photo or document is missing from storage.");
  return new Response(body, {
    headers: {
      "content-type": stored.contentType,
      "content-length": String(stored.byteSize),
      "content-disposition": contentDisposition(isImage(stored.contentType) ? "inline" : "attachment", stored.fileName),
      // The type was checked at upload: the browser must not guess another from the bytes.
      "x-content-type-options": "nosniff",
      // Even an image opened on its own runs nothing.
      "content-security-policy": "default-src 'none'; img-src 'self'; style-src 'unsafe-inline'; sandbox",
      // An attachment never changes under its id; only this user's browser may keep it.
      "cache-control": "private, max-age=86400",
      etag: `"${stored.sha256}"`,
    },
  });
}
