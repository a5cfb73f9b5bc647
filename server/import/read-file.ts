// Reading an import file into rows: CSV (comma or semicolon, as European spreadsheet programs
// write it; UTF-8 with or without a byte-order mark) through papaparse, and `.xlsx` workbooks
// through exceljs (one worksheet per kind). Sizes are checked before anything is parsed, and every
// loop is bounded by the row limit. What cannot be read is a problem with the file's name, never a
// throw.
import ExcelJS from "exceljs";
import JSZip from "jszip";
import Papa from "papaparse";
import { headerKey, IMPORT_KINDS, type ImportKind, kindOf, LAYOUT } from "./layout";
import type { ImportProblem } from "./problems";
import { zipUnpackedSize } from "./zip-size";

export const MAX_IMPORT_BYTES = 20 * 1024 * 1024;
/** Rows per file or worksheet: a vessel's 3,000 routines many times over. */
export const MAX_IMPORT_ROWS = 20_000;
/**
 * What a workbook or a zip of CSV files may unpack to. A 20 MB workbook of repeated cells can unpack
 * to gigabytes; this is read off the zip's table of contents before anything is unpacked, and a zip
 * of CSV files is counted again as it unpacks (a table of contents can lie).
 */
export const MAX_UNPACKED_BYTES = 200 * 1024 * 1024;
/** CSV files in one zip: one per kind, with room for a readme or two. */
const MAX_ZIP_FILES = 10;

export type ImportRow = { line: number; values: Record<string, string> };
export type ImportSheet = {
  kind: ImportKind;
  /** The file name, or "workbook.xlsx › routines" for a worksheet. */
  source: string;
  rows: ImportRow[];
  /** Numbers written with a decimal comma ("12,5"): a semicolon-separated CSV. */
  decimalComma: boolean;
};
export type ReadResult = { sheets: ImportSheet[]; problems: ImportProblem[] };

export type ImportFile = { name: string; bytes: Uint8Array };

const MB = (bytes: number) => `${Math.round(bytes / 1024 / 1024)} MB`;

export async function readImportFiles(files: ImportFile[]): Promise<ReadResult> {
  const sheets: ImportSheet[] = [];
  const problems: ImportProblem[] = [];
  const total = files.reduce((sum, f) => sum + f.bytes.byteLength, 0);
  if (total > MAX_IMPORT_BYTES) {
    problems.push({ file: files.map((f) => f.name).join(", "), row: null, column: null, message: `The files come to ${MB(total)}; an import takes at most ${MB(MAX_IMPORT_BYTES)}. Split the plan into several imports.` });
    return { sheets, problems };
  }
  for (const file of files) {
    const read = /\.xlsx$/i.test(file.name)
      ? await readWorkbook(file)
      : /\.zip$/i.test(file.name)
        ? await readZip(file)
        : /\.(csv|txt)$/i.test(file.name)
          ? readCsv(file)
          : unknownType(file);
    sheets.push(...read.sheets);
    problems.push(...read.problems);
  }
  const seen = new Map<ImportKind, string>();
  for (const sheet of sheets) {
    const first = seen.get(sheet.kind);
    if (first) problems.push({ file: sheet.source, row: null, column: null, message: `This is a second file of ${sheet.kind} (the first is ${first}): put all ${sheet.kind} in one file.` });
    else seen.set(sheet.kind, sheet.source);
  }
  return { sheets, problems };
}

function unknownType(file: ImportFile): ReadResult {
  return { sheets: [], problems: [{ file: file.name, row: null, column: null, message: "Keelson reads CSV files (.csv), a zip of CSV files (.zip) and Excel workbooks (.xlsx); save the file as one of those." }] };
}

export function readCsv(file: ImportFile): ReadResult {
  let text: string;
  try {
    text = new TextDecoder("utf-8", { fatal: true }).decode(file.bytes);
  } catch {
    return {
      sheets: [],
      problems: [{ file: file.name, row: null, column: null, message: "The file is not UTF-8 text: in the spreadsheet program, save it as “CSV UTF-8 (comma delimited)”." }],
    };
  }
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  const firstLine = text.slice(0, text.search(/\r?\n|$/));
  const delimiter = count(firstLine, ";") > count(firstLine, ",") ? ";" : ",";
  const parsed = Papa.parse<string[]>(text, { delimiter, skipEmptyLines: "greedy", preview: MAX_IMPORT_ROWS + 2 });
  const problems: ImportProblem[] = parsed.errors
    .slice(0, 20)
    .map((e) => ({ file: file.name, row: typeof e.row === "number" ? e.row + 1 : null, column: null, message: csvMessage(e) }));
  return withProblems(toSheet(file.name, file.name, parsed.data.map((row) => row.map(unguarded)), delimiter === ";"), problems);
}

/**
 * A cell as it was before a CSV writer guarded it: Keelson's export (and other careful writers) put
 * an apostrophe before a cell starting with = + - @ so that no spreadsheet runs it as a formula.
 */
export function unguarded(cell: string): string {
  return /^'[=+\-@\t\r]/.test(cell) ? cell.slice(1) : cell;
}

function csvMessage(e: Papa.ParseError): string {
  if (e.code === "MissingQuotes") return "a quoted cell is not closed: a \" is missing.";
  if (e.code === "TooFewFields" || e.code === "TooManyFields") return `this row has ${e.code === "TooFewFields" ? "fewer" : "more"} cells than the header row.`;
  return e.message;
}

/** What is wrong with a zip's table of contents, or its size past the limit; null when it may be unpacked. */
function unpackProblem(file: ImportFile, what: string): ImportProblem | null {
  const size = zipUnpackedSize(file.bytes);
  const at = { file: file.name, row: null, column: null };
  if ("problem" in size) {
    const again = what === "workbook" ? "save it again as an Excel workbook (.xlsx)" : `make it again (${size.problem})`;
    return { ...at, message: `The ${what} could not be opened: ${again}.` };
  }
  if (size.unpackedBytes > MAX_UNPACKED_BYTES) {
    return { ...at, message: `The ${what} unpacks to ${MB(size.unpackedBytes)}, more than the ${MB(MAX_UNPACKED_BYTES)} Keelson reads at once: split the plan into several imports.` };
  }
  return null;
}

/** A zip of CSV files (Keelson's own export, or one a person made): each CSV read as if uploaded alone. */
async function readZip(file: ImportFile): Promise<ReadResult> {
  const problem = unpackProblem(file, "zip file");
  if (problem) return { sheets: [], problems: [problem] };
  const at = { file: file.name, row: null, column: null };
  const zip = await JSZip.loadAsync(file.bytes).catch(() => null);
  if (!zip) return { sheets: [], problems: [{ ...at, message: "The zip file could not be opened: make it again." }] };
  const entries = Object.values(zip.files).filter((e) => !e.dir && /\.csv$/i.test(e.name) && !/(^|\/)(__MACOSX|\.)/.test(e.name));
  if (!entries.length) return { sheets: [], problems: [{ ...at, message: "The zip file holds no CSV file." }] };
  if (entries.length > MAX_ZIP_FILES) return { sheets: [], problems: [{ ...at, message: `The zip file holds ${entries.length} CSV files; put at most ${MAX_ZIP_FILES} in one import.` }] };
  const result: ReadResult = { sheets: [], problems: [] };
  let budget = MAX_UNPACKED_BYTES;
  for (const entry of entries) {
    const bytes = await unpackBounded(entry, budget);
    const name = `${file.name} › ${entry.name.split("/").at(-1)}`;
    if (!bytes) return { sheets: [], problems: [{ ...at, message: `The zip file unpacks to more than ${MB(MAX_UNPACKED_BYTES)}: split the plan into several imports.` }] };
    budget -= bytes.byteLength;
    const read = readCsv({ name, bytes });
    result.sheets.push(...read.sheets);
    result.problems.push(...read.problems);
  }
  return result;
}

type ZipStream = {
  on(event: "data", listener: (chunk: Uint8Array) => void): ZipStream;
  on(event: "error", listener: (error: Error) => void): ZipStream;
  on(event: "end", listener: () => void): ZipStream;
  pause(): ZipStream;
  resume(): ZipStream;
};

/** One entry unpacked chunk by chunk, given up (null) once it passes `limit` bytes. */
function unpackBounded(entry: JSZip.JSZipObject, limit: number): Promise<Uint8Array | null> {
  return new Promise((resolve, reject) => {
    const chunks: Uint8Array[] = [];
    let total = 0;
    // JSZip's documented internalStream (its typings lack it): chunks as they are inflated.
    const stream = (entry as unknown as { internalStream(type: "uint8array"): ZipStream }).internalStream("uint8array");
    stream
      .on("data", (chunk: Uint8Array) => {
        total += chunk.byteLength;
        if (total > limit) {
          stream.pause();
          resolve(null);
          return;
        }
        chunks.push(chunk);
      })
      .on("error", reject)
      .on("end", () => {
        const all = new Uint8Array(total);
        let offset = 0;
        for (const c of chunks) {
          all.set(c, offset);
          offset += c.byteLength;
        }
        resolve(all);
      })
      .resume();
  });
}

async function readWorkbook(file: ImportFile): Promise<ReadResult> {
  const problem = unpackProblem(file, "workbook");
  if (problem) return { sheets: [], problems: [problem] };
  const book = new ExcelJS.Workbook();
  try {
    // exceljs' types want a Node Buffer; a view over the same bytes.
    await book.xlsx.load(Buffer.from(file.bytes.buffer, file.bytes.byteOffset, file.bytes.byteLength) as unknown as ArrayBuffer);
  } catch {
    return { sheets: [], problems: [{ file: file.name, row: null, column: null, message: "The workbook could not be opened: save it again as an Excel workbook (.xlsx)." }] };
  }
  const result: ReadResult = { sheets: [], problems: [] };
  for (const ws of book.worksheets) {
    if (ws.rowCount > MAX_IMPORT_ROWS + 1) {
      result.problems.push({ file: `${file.name} › ${ws.name}`, row: null, column: null, message: `The worksheet has ${ws.rowCount.toLocaleString("en-GB")} rows; at most ${MAX_IMPORT_ROWS.toLocaleString("en-GB")} are read at once.` });
      continue;
    }
    const rows: string[][] = [];
    const width = Math.min(ws.columnCount, 60);
    for (let r = 1; r <= ws.rowCount; r += 1) {
      const row = ws.getRow(r);
      const cells: string[] = [];
      for (let c = 1; c <= width; c += 1) cells.push(cellText(row.getCell(c).value));
      rows.push(cells);
    }
    const sheet = toSheet(`${file.name} › ${ws.name}`, ws.name, rows.filter((r) => r.some((v) => v !== "")), false);
    result.sheets.push(...sheet.sheets);
    result.problems.push(...sheet.problems);
  }
  return result;
}

/** A cell as the person sees it: a date as YYYY-MM-DD, a formula as its result, rich text as its text. */
export function cellText(value: ExcelJS.CellValue): string {
  if (value === null || value === undefined) return "";
  if (value instanceof Date) return value.toISOString().slice(0, value.getUTCHours() || value.getUTCMinutes() ? 16 : 10).replace("T", " ");
  if (typeof value === "object") {
    if ("richText" in value) return value.richText.map((t) => t.text).join("").trim();
    if ("result" in value) return cellText((value.result ?? null) as ExcelJS.CellValue);
    if ("text" in value) return String(value.text).trim();
    if ("error" in value) return "";
    return "";
  }
  return String(value).trim();
}

/** Header row → the kind and its rows keyed by column; unknown and missing columns said once. */
function toSheet(source: string, nameForKind: string, data: string[][], decimalComma: boolean): ReadResult {
  const [header, ...body] = data;
  if (!header) return { sheets: [], problems: [{ file: source, row: null, column: null, message: "The file is empty: it needs a header row and a row per item." }] };
  const headers = header.map(headerKey);
  const kind = kindOf(nameForKind, header);
  if (!kind) {
    return {
      sheets: [],
      problems: [{ file: source, row: null, column: null, message: `Keelson cannot tell what this file holds: name it ${IMPORT_KINDS.slice(0, -1).join(", ")} or ${IMPORT_KINDS.at(-1)} (e.g. routines.csv), with the header row of its layout.` }],
    };
  }
  const problems: ImportProblem[] = [];
  if (body.length > MAX_IMPORT_ROWS) {
    problems.push({ file: source, row: null, column: null, message: `The file has more than ${MAX_IMPORT_ROWS.toLocaleString("en-GB")} rows; split it into several imports.` });
    return { sheets: [], problems };
  }
  const known = new Set(LAYOUT[kind].columns.map((c) => c.name));
  headers.forEach((h, i) => {
    if (h && !known.has(h)) problems.push({ file: source, row: 1, column: header[i]!, message: `Keelson's ${kind} layout has no column “${header[i]}”; it is not read.` });
  });
  const seen = new Set<string>();
  headers.forEach((h, i) => {
    if (h && seen.has(h)) problems.push({ file: source, row: 1, column: header[i]!, message: "This column is in the header row twice." });
    seen.add(h);
  });
  for (const c of LAYOUT[kind].columns) {
    if (c.required && !headers.includes(c.name)) problems.push({ file: source, row: 1, column: c.name, message: `The ${kind} file needs a “${c.name}” column (${c.meaning.toLowerCase()}).` });
  }
  const rows: ImportRow[] = body.map((cells, i) => {
    const values: Record<string, string> = {};
    headers.forEach((h, c) => {
      if (known.has(h)) values[h] = (cells[c] ?? "").trim();
    });
    return { line: i + 2, values };
  });
  return { sheets: [{ kind, source, rows, decimalComma }], problems };
}

function withProblems(read: ReadResult, more: ImportProblem[]): ReadResult {
  return { sheets: read.sheets, problems: [...more, ...read.problems] };
}

function count(text: string, char: string): number {
  let n = 0;
  for (const c of text) if (c === char) n += 1;
  return n;
}
