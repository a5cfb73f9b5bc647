// Every import of a vessel's plan from files (issue 12): who, when, which files (kept in object
// storage under `objectKeys`), and what it created, changed and retired.
import { index, jsonb, pgTable, text, uuid } from "drizzle-orm/pg-core";
import { user } from "./auth";
import { companyRef, nowStamp, vesselRef } from "./refs";

type KindCounts = { created: number; changed: number; retired: number };
/** Readings are only ever created; imports recorded before readings could be imported have none. */
export type ImportCounts = Record<"counters" | "components" | "routines", KindCounts> & { readings?: KindCounts };

export const vesselImport = pgTable(
  "vessel_import",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: companyRef(),
    vesselId: vesselRef(),
    importedBy: text().references(() => user.id, { onDelete: "set null" }),
    importedAt: nowStamp(),
    fileNames: jsonb().$type<string[]>().notNull(),
    objectKeys: jsonb().$type<string[]>().notNull(),
    counts: jsonb().$type<ImportCounts>().notNull(),
  },
  (t) => [index().on(t.companyId, t.vesselId, t.importedAt)],
);
