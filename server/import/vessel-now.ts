// What the vessel holds now, read once for an import: its components, counters and coded routines
// with the columns an import compares, and the company's tolerance rules and rank names.
import "server-only";
import { and, eq, isNotNull, isNull } from "drizzle-orm";
import type { Tx } from "@/db/client";
import { component, counter, routine, toleranceRule } from "@/db/schema";
import type { Access, VesselRef } from "@/server/auth/access";
import { loadRankNames } from "@/server/admin/rank-names";
import type { VesselNow } from "./check-rows";

export type VesselRows = {
  now: VesselNow;
  components: (typeof component.$inferSelect)[];
  counters: (typeof counter.$inferSelect)[];
  routines: (typeof routine.$inferSelect)[];
};

export async function loadVesselRows(tx: Tx, access: Access, vessel: VesselRef): Promise<VesselRows> {
  const companyId = access.company.id;
  const [components, counters, routines, rules, rankNames] = await Promise.all([
    tx.select().from(component).where(and(eq(component.companyId, companyId), eq(component.vesselId, vessel.id))),
    tx.select().from(counter).where(and(eq(counter.companyId, companyId), eq(counter.vesselId, vessel.id), isNull(counter.retiredAt))),
    tx
      .select()
      .from(routine)
      .where(and(eq(routine.companyId, companyId), eq(routine.vesselId, vessel.id), isNull(routine.retiredAt), isNotNull(routine.code))),
    tx.select({ id: toleranceRule.id, name: toleranceRule.name }).from(toleranceRule).where(eq(toleranceRule.companyId, companyId)),
    loadRankNames(companyId),
  ]);
  const codeOf = new Map(components.map((c) => [c.id, c.code]));
  return {
    components,
    counters,
    routines,
    now: {
      components: new Map(components.map((c) => [c.code, { id: c.id, parentCode: c.parentId ? (codeOf.get(c.parentId) ?? null) : null }])),
      counters: new Map(counters.map((c) => [c.name.toLowerCase(), { id: c.id, name: c.name }])),
      routines: new Map(routines.map((r) => [r.code!, { id: r.id }])),
      toleranceRules: new Map(rules.map((r) => [r.name.toLowerCase(), r.id])),
      rankNames,
    },
  };
}
