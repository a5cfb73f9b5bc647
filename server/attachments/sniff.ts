// What a file is, from its first bytes (its "magic number"), never from the name or the type the
// browser sent: a renamed file or a page saved as photo.png is refused. Pure.
import type { AttachmentType } from "./contract";

const startsWith = (bytes: Uint8Array, signature: readonly number[], at = 0) =>
  bytes.length >= at + signature.length && signature.every((b, i) => bytes[at + i] === b);

const ascii = (text: string) => [...text].map((c) => c.charCodeAt(0));

/** The file's type when it is one Keelson keeps, else null. */
export function sniffType(bytes: Uint8Array): AttachmentType | null {
  // JPEG: SOI marker FF D8 followed by the next marker's FF.
  if (startsWith(bytes, [0xff, 0xd8, 0xff])) return "image/jpeg";
  // PNG: the eight-byte signature 89 "PNG" CR LF SUB LF.
  if (startsWith(bytes, [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])) return "image/png";
  // WebP: a RIFF container whose form type (bytes 8–11) is "WEBP".
  if (startsWith(bytes, ascii("RIFF")) && startsWith(bytes, ascii("WEBP"), 8)) return "image/webp";
  // PDF: "%PDF-" then the version.
  if (startsWith(bytes, ascii("%PDF-"))) return "application/pdf";
  return null;
}

/** The file name for display only: no folders, no control characters, not empty, not endless. */
export function displayName(name: string, type: AttachmentType): string {
  const base = name.split(/[\\/]/).pop() ?? "";
  const clean = base.replace(/[\u0000-\u001f\u007f]/g, "").trim().slice(0, 200);
  if (clean) return clean;
  return type === "application/pdf" ? "document.pdf" : `photo.${type.slice("image/".length)}`;
}
