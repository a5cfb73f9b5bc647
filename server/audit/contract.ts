import { z } from "zod";
import { enteredDay } from "@/server/http/dates";
import { AUDIT_KIND_KEYS, TRAIL_RECORD_TABLES } from "./kinds";

const empty = (v: unknown) => (v === "" ? undefined : v);

/** The administrator's search of the whole trail (the page's form and the CSV export). */
export const AuditSearchQuery = z
  .object({
    /** A person's user id; `system` for Keelson's own writes. */
    person: z.preprocess(
      empty,
      z
        .string({ message: "person: a person of the company." })
        .max(64, { message: "person: a person of the company." })
        .regex(/^[\w-]+$/, { message: "person: a person of the company." })
        .optional(),
    ),
    vessel: z.preprocess(empty, z.uuid({ message: "vessel: a vessel of the company." }).optional()),
    kind: z.preprocess(
      empty,
      z.enum(AUDIT_KIND_KEYS, { message: `kind: one of ${AUDIT_KIND_KEYS.join(", ")}.` }).optional(),
    ),
    from: z.preprocess(empty, enteredDay("history", "The first day", "from: a day as YYYY-MM-DD.").optional()),
    until: z.preprocess(empty, enteredDay("history", "The last day", "until: a day as YYYY-MM-DD.").optional()),
    /** The page's cursor: entries older than this id. */
    before: z.preprocess(
      empty,
      z.coerce
        .number({ message: "before: an entry number." })
        .int({ message: "before: an entry number." })
        .positive({ message: "before: an entry number." })
        .max(Number.MAX_SAFE_INTEGER, { message: "before: an entry number." })
        .optional(),
    ),
  })
  .refine((q) => !q.from || !q.until || q.from <= q.until, {
    path: ["until"],
    message: "The last day must not be before the first day.",
  });
export type AuditSearch = z.output<typeof AuditSearchQuery>;

/** One record's trail on its own page. */
export const RecordTrailQuery = z.object({
  table: z.enum(TRAIL_RECORD_TABLES, { message: `table: one of ${TRAIL_RECORD_TABLES.join(", ")}.` }),
  record: z.uuid({ message: "record: the record's id." }),
});
export type RecordTrailRequest = z.output<typeof RecordTrailQuery>;

/** The trail of a company-wide record (a part of the catalogue, a tolerance rule): no vessel's door. */
export const COMPANY_TRAIL_TABLES = ["part", "tolerance_rule"] as const;
export const CompanyTrailQuery = z.object({
  table: z.enum(COMPANY_TRAIL_TABLES, { message: `table: one of ${COMPANY_TRAIL_TABLES.join(", ")}.` }),
  record: z.uuid({ message: "record: the record's id." }),
});

export type AuditLine = { label: string; before: string | null; after: string | null };

export type AuditItem = {
  id: number;
  at: string;
  /** The person's name, or what Keelson did it as. */
  by: string;
  byPerson: boolean;
  vessel: string | null;
  kind: string | null;
  record: string;
  action: string;
  reason: string | null;
  lines: AuditLine[];
};
