// CSV for the office's spreadsheets: RFC 4180 quoting by papaparse, CRLF line ends, a UTF-8 byte
// order mark so spreadsheet programs read the ship's names right, and formula-looking cells
// (=, +, -, @ first) escaped so a work-order title cannot run as a formula when opened.
import Papa from "papaparse";

export type CsvColumn<T> = { header: string; value: (row: T) => string | number | boolean | null | undefined };

const cell = (v: string | number | boolean | null | undefined) =>
  v === null || v === undefined ? "" : typeof v === "boolean" ? (v ? "yes" : "") : v;

export function toCsv<T>(columns: readonly CsvColumn<T>[], rows: readonly T[]): string {
  return Papa.unparse(
    { fields: columns.map((c) => c.header), data: rows.map((r) => columns.map((c) => cell(c.value(r)))) },
    { newline: "\r\n", escapeFormulae: true },
  );
}

/** An attachment the browser saves under `filename` (ASCII letters, digits, dots and dashes). */
export function csvResponse(csv: string, filename: string): Response {
  return new Response(`\uFEFF${csv}\r\n`, {
    headers: {
      "content-type": "text/csv; charset=utf-8",
      "content-disposition": `attachment; filename="${filename.replace(/[^\w.-]/g, "-")}"`,
      "cache-control": "no-store",
    },
  });
}
