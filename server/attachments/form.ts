// Reading an upload (multipart/form-data with `file` and an optional `caption`) without trusting
// its size: the body is read up to a bound, so a huge request is refused before it fills memory.
import "server-only";
import { readMultipart } from "@/server/http/bounded-body";
import { invalidInput } from "@/server/http/problem";
import { formatBytes, MAX_ATTACHMENT_BYTES, UploadFields } from "./contract";
import type { Upload } from "./queries";

/** Room for the multipart boundaries, headers and the caption around the one file. */
const FORM_OVERHEAD_BYTES = 64 * 1024;
const MAX_BODY_BYTES = MAX_ATTACHMENT_BYTES + FORM_OVERHEAD_BYTES;

const tooLarge = () =>
  invalidInput([{ field: "file", message: `The file is larger than ${formatBytes(MAX_ATTACHMENT_BYTES)}, the most one file may be.` }]);

export async function readUpload(request: Request): Promise<Upload> {
  const form = await readMultipart(request, MAX_BODY_BYTES, tooLarge, "the file");
  const files = form.getAll("file");
  if (files.length > 1) throw invalidInput([{ field: "file", message: "Send one file per request." }]);
  const caption = form.get("caption");
  const parsed = UploadFields.safeParse({
    file: files[0],
    caption: typeof caption === "string" ? caption : undefined,
  });
  if (!parsed.success) {
    throw invalidInput(
      parsed.error.issues.map((issue) => ({ field: String(issue.path[0] ?? "file"), message: issue.message })),
    );
  }
  const file = parsed.data.file;
  return {
    name: file instanceof File ? file.name : "",
    bytes: new Uint8Array(await file.arrayBuffer()),
    caption: parsed.data.caption,
  };
}
