// One problem of an import, where a person finds it: the file, the row (as the spreadsheet numbers
// it, the header being row 1) and the column, and what is wrong in words an engineer understands.
export type ImportProblem = { file: string; row: number | null; column: string | null; message: string };

/** "routines.csv, row 88, every: …" */
export function problemLine(p: ImportProblem): string {
  return [p.file, p.row !== null ? `row ${p.row}` : null, p.column].filter(Boolean).join(", ") + `: ${p.message}`;
}
