import "server-only";
import { and, asc, eq, inArray, isNull, sql } from "drizzle-orm";
import { getDb } from "@/db/client";
import { company, counter, reading, vessel } from "@/db/schema";
import type { Access } from "@/server/auth/access";
import { stoppedReporting } from "@/server/fleet/figures";

export type VesselSummary = {
  id: string;
  name: string;
  code: string;
  imoNumber: string;
  timeZone: string;
  counters: number;
  lastReadingAt: Date | null;
  /** No reading for longer than the company's missing-readings hours, as on the Fleet board. */
  stoppedReporting: boolean;
};

/** The vessels the signed-in user may open, with when each last reported hours. */
export async function listAccessibleVessels(access: Access, now = new Date()): Promise<VesselSummary[]> {
  if (access.assignedVesselIds?.length === 0) return [];
  const db = getDb();
  const rows = await db
    .select({
      id: vessel.id,
      name: vessel.name,
      code: vessel.code,
      imoNumber: vessel.imoNumber,
      timeZone: vessel.timeZone,
      // Qualified by hand: in a single-table select drizzle leaves column names unqualified, and
      // inside the subquery they would then bind to the subquery's own table.
      counters: sql<number>`(select count(*)::int from ${counter} c where c.company_id = "vessel"."company_id" and c.vessel_id = "vessel"."id" and c.retired_at is null)`,
      lastReadingAt: sql<string | null>`(select max(r.read_at) from ${reading} r where r.company_id = "vessel"."company_id" and r.vessel_id = "vessel"."id")`,
      missingReadingsHours: company.missingReadingsHours,
    })
    .from(vessel)
    .innerJoin(company, eq(company.id, vessel.companyId))
    .where(
      and(
        eq(vessel.companyId, access.company.id),
        isNull(vessel.retiredAt),
        access.assignedVesselIds ? inArray(vessel.id, access.assignedVesselIds) : undefined,
      ),
    )
    .orderBy(asc(vessel.name));
  return rows.map(({ missingReadingsHours, ...r }) => {
    const lastReadingAt = r.lastReadingAt ? new Date(r.lastReadingAt) : null;
    return { ...r, lastReadingAt, stoppedReporting: stoppedReporting(lastReadingAt, now, missingReadingsHours) };
  });
}
