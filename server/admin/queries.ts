import "server-only";
import { and, asc, eq, inArray, isNull, or, sql } from "drizzle-orm";
import { type Db, getDb, type Tx } from "@/db/client";
import { counter, vessel, vesselAssignment, vesselClockChange } from "@/db/schema";
import type { Access } from "@/server/auth/access";
import { AppError, type FieldError, invalidInput } from "@/server/http/problem";
import type { AdminVessel, VesselChanges, VesselValues } from "./contract";
import { duplicateVesselErrors } from "./rules";

// The company administrator's vessel data: every query is scoped by the administrator's company.
// People (users, roles, assignments) are in people-queries.ts.

export async function listCompanyVessels(access: Access, onlyId?: string): Promise<AdminVessel[]> {
  const rows = await getDb()
    .select({
      id: vessel.id,
      name: vessel.name,
      code: vessel.code,
      imoNumber: vessel.imoNumber,
      timeZone: vessel.timeZone,
      retiredAt: vessel.retiredAt,
      // `${vessel}.id`, not `${vessel.id}`: in a one-table select Drizzle writes the column unqualified,
      // and inside the subquery a bare "id" is the counter's own id.
      counters: sql<number>`(select count(*)::int from ${counter} c where c.company_id = ${vessel}.company_id and c.vessel_id = ${vessel}.id and c.retired_at is null)`,
      assignedPeople: sql<number>`(select count(*)::int from ${vesselAssignment} a where a.company_id = ${vessel}.company_id and a.vessel_id = ${vessel}.id)`,
    })
    .from(vessel)
    .where(and(eq(vessel.companyId, access.company.id), onlyId ? eq(vessel.id, onlyId) : undefined))
    // Vessels in service first; retired ones stay listed because their records do.
    .orderBy(sql`${vessel.retiredAt} is not null`, asc(vessel.name));
  return rows.map((r) => ({ ...r, retiredAt: r.retiredAt ? r.retiredAt.toISOString() : null }));
}

async function loadCompanyVessel(access: Access, vesselId: string): Promise<AdminVessel> {
  const [found] = await listCompanyVessels(access, vesselId);
  if (!found) throw new AppError("not-found", "No such vessel.");
  return found;
}

async function assertUniqueVessel(
  tx: Db | Tx,
  companyId: string,
  candidate: { code?: string; imoNumber?: string },
  selfId?: string,
): Promise<void> {
  if (!candidate.code && !candidate.imoNumber) return;
  const existing = await tx
    .select({
      id: vessel.id,
      name: vessel.name,
      code: vessel.code,
      imoNumber: vessel.imoNumber,
      retiredAt: vessel.retiredAt,
    })
    .from(vessel)
    .where(
      and(
        eq(vessel.companyId, companyId),
        or(
          candidate.code ? eq(vessel.code, candidate.code) : undefined,
          candidate.imoNumber ? eq(vessel.imoNumber, candidate.imoNumber) : undefined,
        ),
      ),
    );
  const errors = duplicateVesselErrors(candidate, existing, selfId);
  if (errors.length) throw invalidInput(errors);
}

export async function createVessel(access: Access, values: VesselValues): Promise<AdminVessel> {
  const db = getDb();
  const companyId = access.company.id;
  const id = await db.transaction(async (tx) => {
    await assertUniqueVessel(tx, companyId, values);
    const [row] = await tx
      .insert(vessel)
      .values({ companyId, ...values })
      .returning({ id: vessel.id });
    return row!.id;
  });
  return loadCompanyVessel(access, id);
}

export async function updateVessel(access: Access, vesselId: string, changes: VesselChanges): Promise<AdminVessel> {
  const db = getDb();
  const companyId = access.company.id;
  const { retired, ...fields } = changes;
  const set = { ...fields, ...(retired === false ? { retiredAt: null } : {}) };
  const before = await loadCompanyVessel(access, vesselId);
  if (Object.keys(set).length) {
    await db.transaction(async (tx) => {
      await assertUniqueVessel(tx, companyId, fields, vesselId);
      await tx
        .update(vessel)
        .set(set)
        .where(and(eq(vessel.companyId, companyId), eq(vessel.id, vesselId)));
      // A zone set here is a change of the ship's clock from now: kept in its history, so the
      // worker's step (server/vessels/clock.ts), which follows the history, keeps it too.
      if (fields.timeZone && fields.timeZone !== before.timeZone) {
        await tx.insert(vesselClockChange).values({
          companyId,
          vesselId,
          effectiveAt: new Date(),
          fromTimeZone: before.timeZone,
          timeZone: fields.timeZone,
          note: "Set by the administrator under Company → Vessels",
          enteredBy: access.user.id,
        });
      }
    });
  }
  return loadCompanyVessel(access, vesselId);
}

/** Retiring keeps the vessel and its records; it leaves the vessel lists and the Hour log menus. */
export async function retireVessel(access: Access, vesselId: string, now = new Date()): Promise<AdminVessel> {
  await getDb()
    .update(vessel)
    .set({ retiredAt: now })
    .where(and(eq(vessel.companyId, access.company.id), eq(vessel.id, vesselId), isNull(vessel.retiredAt)));
  return loadCompanyVessel(access, vesselId);
}

/** Errors for the vessel ids (`vesselIds.<i>`) that are not vessels of the company. */
export async function foreignVesselErrors(tx: Db | Tx, companyId: string, vesselIds: string[]): Promise<FieldError[]> {
  if (vesselIds.length === 0) return [];
  const owned = await tx
    .select({ id: vessel.id })
    .from(vessel)
    .where(and(eq(vessel.companyId, companyId), inArray(vessel.id, vesselIds)));
  const ownedIds = new Set(owned.map((o) => o.id));
  return vesselIds.flatMap((id, i) =>
    ownedIds.has(id)
      ? []
      : [{ field: `vesselIds.${i}`, message: "Vessel assignments: there is no such vessel in your company." }],
  );
}
