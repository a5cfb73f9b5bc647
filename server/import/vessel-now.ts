// What the vessel holds now, read once for an import: its components, counters and coded routines
// with the columns an import compares, and the company's tolerance rules and rank names.
import "server-only";
import { and, asc, eq, inArray, isNotNull, isNull, or } from "drizzle-orm";
import type { Tx } from "@/db/client";
import { component, counter, counterSegment, reading, routine, toleranceRule } from "@/db/schema";
import type { Access, VesselRef } from "@/server/auth/access";
import { loadRankNames } from "@/server/admin/rank-names";
import type { CounterReadings } from "./check-readings";
import type { VesselNow } from "./check-rows";

export type VesselRows = {
  now: VesselNow;
  components: (typeof component.$inferSelect)[];
  counters: (typeof counter.$inferSelect)[];
  /** The vessel's live routines, each with its key: its code, or one derived for a routine without. */
  routines: (typeof routine.$inferSelect & { key: string })[];
  /** Retired routines by code: a file that lists one again brings it back, with its history. */
  retired: Map<string, typeof routine.$inferSelect & { key: string }>;
};

export async function loadVesselRows(tx: Tx, access: Access, vessel: VesselRef, options: { readings?: boolean; clock?: Date } = {}): Promise<VesselRows> {
  const companyId = access.company.id;
  // One after another: a transaction is one connection, and node-postgres queues (and will refuse)
  // queries sent on it at once.
  const components = await tx.select().from(component).where(and(eq(component.companyId, companyId), eq(component.vesselId, vessel.id)));
  const counters = await tx.select().from(counter).where(and(eq(counter.companyId, companyId), eq(counter.vesselId, vessel.id), isNull(counter.retiredAt)));
  const routines = await tx
    .select()
    .from(routine)
    .where(and(eq(routine.companyId, companyId), eq(routine.vesselId, vessel.id), or(isNull(routine.retiredAt), isNotNull(routine.code))));
  const rules = await tx.select({ id: toleranceRule.id, name: toleranceRule.name }).from(toleranceRule).where(eq(toleranceRule.companyId, companyId));
  const rankNames = await loadRankNames(companyId);
  const codeOf = new Map(components.map((c) => [c.id, c.code]));
  const readings = options.readings ? await loadReadings(tx, companyId, counters) : new Map();
  const keyed = withKeys(
    routines.filter((r) => !r.retiredAt),
    codeOf,
  );
  const retired = new Map(routines.filter((r) => r.retiredAt && r.code).map((r) => [r.code!, { ...r, key: r.code! }]));
  return {
    components,
    counters,
    routines: keyed,
    retired,
    now: {
      components: new Map(components.map((c) => [c.code, { id: c.id, parentCode: c.parentId ? (codeOf.get(c.parentId) ?? null) : null }])),
      counters: new Map(counters.map((c) => [c.name.toLowerCase(), { id: c.id, name: c.name }])),
      routines: new Map(keyed.map((r) => [r.key, { id: r.id }])),
      toleranceRules: new Map(rules.map((r) => [r.name.toLowerCase(), r.id])),
      rankNames,
      timeZone: vessel.timeZone,
      clock: options.clock ?? new Date(),
      readings,
    },
  };
}

/** Every counter's meters and readings: an import's readings are checked against them all. */
async function loadReadings(tx: Tx, companyId: string, counters: (typeof counter.$inferSelect)[]) {
  const out = new Map<string, CounterReadings & { name: string }>();
  if (!counters.length) return out;
  const ids = counters.map((c) => c.id);
  const segments = await tx.select().from(counterSegment).where(and(eq(counterSegment.companyId, companyId), inArray(counterSegment.counterId, ids)));
  const rows = await tx
    .select({ counterId: reading.counterId, readAt: reading.readAt, meterValue: reading.meterValue, segment: reading.segment })
    .from(reading)
    .where(and(eq(reading.companyId, companyId), inArray(reading.counterId, ids)))
    .orderBy(asc(reading.readAt));
  const byId = new Map<string, CounterReadings & { name: string }>();
  for (const c of counters) {
    const entry = { name: c.name, currentSegment: c.currentSegment, segments: [], readings: [] };
    byId.set(c.id, entry);
    out.set(c.name.toLowerCase(), entry);
  }
  for (const s of segments) byId.get(s.counterId)?.segments.push({ segment: s.segment, startedAt: s.startedAt, offsetHours: s.offsetHours });
  for (const r of rows) byId.get(r.counterId)?.readings.push({ readAt: r.readAt, meterValue: r.meterValue, segment: r.segment });
  return out;
}

/**
 * A routine made in the app has no code: its key is its component's code and its place among that
 * component's uncoded routines, oldest first ("ME.CYL.3/2"), skipping any code already taken. The
 * export writes these keys, so exporting and importing again finds the same routines.
 */
export function withKeys<R extends { id: string; code: string | null; componentId: string; createdAt: Date }>(
  routines: R[],
  componentCode: Map<string, string>,
): (R & { key: string })[] {
  const taken = new Set(routines.flatMap((r) => (r.code ? [r.code] : [])));
  const next = new Map<string, number>();
  const uncoded = routines
    .filter((r) => !r.code)
    .sort((a, b) => a.createdAt.getTime() - b.createdAt.getTime() || a.id.localeCompare(b.id));
  const keys = new Map<string, string>();
  for (const r of uncoded) {
    const prefix = componentCode.get(r.componentId) ?? "ROUTINE";
    let n = next.get(prefix) ?? 1;
    while (taken.has(`${prefix}/${n}`)) n += 1;
    keys.set(r.id, `${prefix}/${n}`);
    taken.add(`${prefix}/${n}`);
    next.set(prefix, n + 1);
  }
  return routines.map((r) => ({ ...r, key: r.code ?? keys.get(r.id)! }));
}
