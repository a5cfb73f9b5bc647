// The empty template and the filled example of each kind, written from the published layout.
import { z } from "zod";
import { toCsv } from "@/server/export/csv";
import { IMPORT_KINDS, type ImportKind, LAYOUT } from "./layout";

export const ImportTemplateQuery = z.object({
  kind: z.enum(IMPORT_KINDS, { message: `kind must be one of ${IMPORT_KINDS.join(", ")}.` }),
  example: z
    .enum(["yes", "no"], { message: "example must be yes or no." })
    .default("no")
    .transform((v) => v === "yes"),
});

export function templateCsv(kind: ImportKind, example: boolean): string {
  const columns = LAYOUT[kind].columns.map((c) => ({ header: c.name, value: (row: Record<string, string>) => row[c.name] }));
  const rows = example ? [Object.fromEntries(LAYOUT[kind].columns.map((c) => [c.name, c.example]))] : [];
  return toCsv(columns, rows);
}

export const ExportQuery = z.object({
  kind: z.enum(IMPORT_KINDS, { message: `kind must be one of ${IMPORT_KINDS.join(", ")}.` }).optional(),
  /** Without a kind: one workbook, or a zip of a CSV per kind. */
  format: z.enum(["xlsx", "zip"], { message: "format must be xlsx or zip." }).default("xlsx"),
});
