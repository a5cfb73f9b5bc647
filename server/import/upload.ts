// Reading an import upload: multipart/form-data with up to ten `file` fields (CSV files or a
// workbook) and an optional `retire` box. The body is read up to a bound before it is parsed.
import "server-only";
import { readMultipart } from "@/server/http/bounded-body";
import { invalidInput } from "@/server/http/problem";
import { MAX_IMPORT_BYTES, type ImportFile } from "./read-file";

export const MAX_IMPORT_FILES = 10;
const MAX_BODY_BYTES = MAX_IMPORT_BYTES + 256 * 1024;

export type ImportUpload = { files: ImportFile[]; retire: boolean };

const tooLarge = () =>
  invalidInput([{ field: "file", message: `The files come to more than ${MAX_IMPORT_BYTES / 1024 / 1024} MB, the most one import takes. Split the plan into several imports.` }]);

export async function readImportUpload(request: Request): Promise<ImportUpload> {
  const form = await readMultipart(request, MAX_BODY_BYTES, tooLarge, "the files");
  const entries = form.getAll("file");
  if (entries.length === 0) throw invalidInput([{ field: "file", message: "Choose the plan's files: CSV files or an Excel workbook." }]);
  if (entries.length > MAX_IMPORT_FILES) throw invalidInput([{ field: "file", message: `Send at most ${MAX_IMPORT_FILES} files at once.` }]);
  const files: ImportFile[] = [];
  for (const entry of entries) {
    if (typeof entry === "string") throw invalidInput([{ field: "file", message: "Each “file” field must be a file, not text." }]);
    files.push({ name: entry.name.slice(0, 200) || "upload.csv", bytes: new Uint8Array(await entry.arrayBuffer()) });
  }
  const retire = form.get("retire");
  return { files, retire: retire === "on" || retire === "true" || retire === "yes" };
}

