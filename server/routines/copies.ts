// Copying a routine: to other components of the same vessel, or to the components with the same
// code on the company's other vessels (sister ships share a maintenance plan).
import "server-only";
import { and, asc, eq, inArray, isNull, ne, or } from "drizzle-orm";
import { getDb } from "@/db/client";
import { component, routine, vessel as vesselTable } from "@/db/schema";
import { type Access, mayOpenVessel, type VesselRef } from "@/server/auth/access";
import { AppError, type FieldError, invalidInput } from "@/server/http/problem";
import { requestRecompute } from "@/server/jobs/recompute-vessel";
import type { CopyResult, CopyTarget } from "./contract";

async function sourceOf(access: Access, vessel: VesselRef, routineId: string) {
  const [row] = await getDb()
    .select({ r: routine, code: component.code })
    .from(routine)
    .innerJoin(component, eq(component.id, routine.componentId))
    .where(
      and(
        eq(routine.companyId, access.company.id),
        eq(routine.vesselId, vessel.id),
        eq(routine.id, routineId),
        isNull(routine.retiredAt),
      ),
    );
  return row ?? null;
}

function noSuchRoutine(vessel: VesselRef): AppError {
  return new AppError("not-found", `There is no such routine on ${vessel.name}.`);
}

/** Where a routine may be copied: this vessel's other components, and same-code ones elsewhere. */
export async function copyTargets(access: Access, vessel: VesselRef, routineId: string): Promise<CopyTarget[]> {
  const source = await sourceOf(access, vessel, routineId);
  if (!source) throw noSuchRoutine(vessel);
  const rows = await getDb()
    .select({
      id: component.id,
      code: component.code,
      name: component.name,
      vesselId: vesselTable.id,
      vesselName: vesselTable.name,
    })
    .from(component)
    .innerJoin(vesselTable, eq(vesselTable.id, component.vesselId))
    .where(
      and(
        eq(component.companyId, access.company.id),
        ne(component.id, source.r.componentId),
        isNull(vesselTable.retiredAt),
        or(eq(component.vesselId, vessel.id), eq(component.code, source.code)),
      ),
    )
    .orderBy(asc(vesselTable.name), asc(component.code));
  return rows
    .filter((r) => mayOpenVessel(access, r.vesselId))
    .map((r) => ({ id: r.id, code: r.code, name: r.name, vessel: { id: r.vesselId, name: r.vesselName } }));
}

/**
 * Copies the routine's definition to each target component. The copy starts fresh: revision 1,
 * no work done, the same baseline (the page asks to check it where the target's counter differs).
 */
export async function copyRoutine(
  access: Access,
  vessel: VesselRef,
  routineId: string,
  componentIds: string[],
): Promise<CopyResult> {
  const source = await sourceOf(access, vessel, routineId);
  if (!source) throw noSuchRoutine(vessel);
  const ids = [...new Set(componentIds)];
  const db = getDb();
  const created = await db.transaction(async (tx) => {
    const targets = await tx
      .select({ id: component.id, code: component.code, vesselId: component.vesselId, vesselName: vesselTable.name })
      .from(component)
      .innerJoin(vesselTable, eq(vesselTable.id, component.vesselId))
      .where(and(eq(component.companyId, access.company.id), inArray(component.id, ids)));
    const byId = new Map(targets.map((t) => [t.id, t]));
    const errors: FieldError[] = [];
    componentIds.forEach((id, i) => {
      const t = byId.get(id);
      if (!t || !mayOpenVessel(access, t.vesselId)) {
        errors.push({ field: `componentIds.${i}`, message: "There is no such component on a vessel you may open." });
      } else if (t.id === source.r.componentId) {
        errors.push({ field: `componentIds.${i}`, message: `The routine is already on ${t.code}.` });
      } else if (t.vesselId !== vessel.id && t.code !== source.code) {
        errors.push({
          field: `componentIds.${i}`,
          message: `On another vessel a routine of ${source.code} goes only to ${source.code}, not ${t.code}.`,
        });
      }
    });
    if (errors.length) throw invalidInput(errors);

    const { id: _id, createdAt: _c, updatedAt: _u, retiredAt: _r, revision: _v, ...definition } = source.r;
    const rows = await tx
      .insert(routine)
      .values(ids.map((id) => ({ ...definition, componentId: id, vesselId: byId.get(id)!.vesselId })))
      .returning({ id: routine.id, componentId: routine.componentId });
    // In vessel id order, as every writer that asks for several vessels does (no deadlock).
    for (const vesselId of [...new Set(targets.map((t) => t.vesselId))].sort()) {
      await requestRecompute(tx, access.company.id, vesselId);
    }
    return rows.map((row) => {
      const t = byId.get(row.componentId)!;
      return { id: row.id, componentCode: t.code, vesselName: t.vesselName };
    });
  });
  return { created: created.map(({ id, componentCode, vesselName }) => ({ id, componentCode, vesselName })) };
}
