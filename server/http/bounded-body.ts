// A request body read up to a bound: refused once it passes `limit` bytes (chunked bodies too), so a
// huge upload never fills memory. Shared by the JSON door and the uploads (attachments, plan imports).
import "server-only";
import { invalidInput } from "./problem";

export async function readBoundedBody(request: Request, limit: number, tooLarge: () => Error): Promise<Uint8Array<ArrayBuffer>> {
  if (!request.body) return new Uint8Array();
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > limit) {
      await reader.cancel().catch(() => undefined);
      throw tooLarge();
    }
    chunks.push(value);
  }
  const all = new Uint8Array(total);
  let at = 0;
  for (const chunk of chunks) {
    all.set(chunk, at);
    at += chunk.byteLength;
  }
  return all;
}

/**
 * A multipart/form-data upload read up to `limit` bytes (the declared length first, then the bytes
 * as they come) and parsed; `what` names the upload in the messages ("the file", "the files").
 */
export async function readMultipart(request: Request, limit: number, tooLarge: () => Error, what: string): Promise<FormData> {
  const type = request.headers.get("content-type") ?? "";
  if (!type.startsWith("multipart/form-data")) {
    throw invalidInput([{ field: "file", message: `Send ${what} as multipart/form-data, in a field named “file”.` }]);
  }
  const declared = Number(request.headers.get("content-length") ?? NaN);
  if (Number.isFinite(declared) && declared > limit) throw tooLarge();
  const body = await readBoundedBody(request, limit, tooLarge);
  try {
    return await new Response(body, { headers: { "content-type": type } }).formData();
  } catch {
    throw invalidInput([{ field: "file", message: `The upload could not be read as a form; choose ${what} again.` }]);
  }
}
