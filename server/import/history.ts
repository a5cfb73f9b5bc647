// The vessel's past imports for the import page: who, when, which files, what each did.
import "server-only";
import { and, desc, eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { user, vesselImport } from "@/db/schema";
import type { ImportCounts } from "@/db/schema/imports";
import type { Access, VesselRef } from "@/server/auth/access";

export type ImportRecord = { id: string; importedAt: string; importedBy: string | null; files: string[]; counts: ImportCounts };

export async function listImports(access: Access, vessel: VesselRef): Promise<{ imports: ImportRecord[] }> {
  const rows = await getDb()
    .select({ id: vesselImport.id, importedAt: vesselImport.importedAt, importedBy: user.name, files: vesselImport.fileNames, counts: vesselImport.counts })
    .from(vesselImport)
    .leftJoin(user, eq(user.id, vesselImport.importedBy))
    .where(and(eq(vesselImport.companyId, access.company.id), eq(vesselImport.vesselId, vessel.id)))
    .orderBy(desc(vesselImport.importedAt))
    .limit(50);
  return { imports: rows.map((r) => ({ ...r, importedAt: r.importedAt.toISOString() })) };
}
