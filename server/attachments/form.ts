// Reading an upload (multipart/form-data with `file` and an optional `caption`) without trusting
// its size: the body is read up to a bound, so a huge request is refused before it fills memory.
import "server-only";
import { readBoundedBody } from "@/server/http/bounded-body";
import { invalidInput } from "@/server/http/problem";
import { formatBytes, MAX_ATTACHMENT_BYTES, UploadFields } from "./contract";
import type { Upload } from "./queries";

/** Room for the multipart boundaries, headers and the caption around the one file. */
const FORM_OVERHEAD_BYTES = 64 * 1024;
const MAX_BODY_BYTES = MAX_ATTACHMENT_BYTES + FORM_OVERHEAD_BYTES;

const tooLarge = () =>
  invalidInput([{ field: "file", message: `The file is larger than ${formatBytes(MAX_ATTACHMENT_BYTES)}, the most one file may be.` }]);

export async function readUpload(request: Request): Promise<Upload> {
  const type = request.headers.get("content-type") ?? "";
  if (!type.startsWith("multipart/form-data")) {
    throw invalidInput([{ field: "file", message: "Send the file as multipart/form-data in a field named “file”." }]);
  }
  const declared = Number(request.headers.get("content-length") ?? NaN);
  if (Number.isFinite(declared) && declared > MAX_BODY_BYTES) throw tooLarge();
  const body = await readBoundedBody(request, MAX_BODY_BYTES, tooLarge);

  let form: FormData;
  try {
    form = await new Response(body, { headers: { "content-type": type } }).formData();
  } catch {
    throw invalidInput([{ field: "file", message: "The upload could not be read as a form; choose the file again." }]);
  }
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
