// The demo's spare parts: a small company catalogue (invented part numbers and makers' references),
// an engine store and a workshop on each vessel, a year's deliveries and counts, and a few critical
// spares run down below their minimum so the Stores page has something to say. Demo only.
import { addDays } from "date-fns";
import { and, asc, eq, gt } from "drizzle-orm";
import type { Db } from "../client";
import * as s from "../schema";
import type { PartUnit } from "../schema/parts";
import { seededRandom } from "./readings";

type DemoPart = { number: string; makerRef: string; description: string; unit: PartUnit; critical?: boolean; minimum?: number; fits: string[] };

/** Minimums are `common practice` demo values; the maker's and class's recommendations decide on a real ship. */
const CATALOGUE: DemoPart[] = [
  { number: "BW-1001", makerRef: "HV-90-221", description: "Piston ring set, main engine cylinder unit", unit: "set", critical: true, minimum: 2, fits: ["ME.CYL.1", "ME.CYL.2", "ME.CYL.3", "ME.CYL.4", "ME.CYL.5", "ME.CYL.6"] },
  { number: "BW-1002", makerRef: "HV-90-310", description: "Exhaust valve spindle seal kit", unit: "set", critical: true, minimum: 2, fits: ["ME.CYL.1", "ME.CYL.2", "ME.CYL.3"] },
  { number: "BW-1003", makerRef: "HV-70-118", description: "Fuel valve nozzle", unit: "piece", critical: true, minimum: 6, fits: ["ME"] },
  { number: "BW-1004", makerRef: "HV-40-002", description: "Cylinder cover O-ring set", unit: "set", minimum: 1, fits: ["ME.CYL.1"] },
  { number: "BW-1010", makerRef: "HD-23-551", description: "Generator engine lube oil filter element", unit: "piece", minimum: 6, fits: ["AE.1", "AE.2", "AE.3"] },
  { number: "BW-1011", makerRef: "HD-23-118", description: "Generator engine injection valve", unit: "piece", critical: true, minimum: 3, fits: ["AE.1", "AE.2", "AE.3"] },
  { number: "BW-1012", makerRef: "HD-23-640", description: "Cylinder head gasket, generator engine", unit: "piece", minimum: 2, fits: ["AE.1", "AE.2", "AE.3"] },
  { number: "BW-1020", makerRef: "CV-40-77", description: "Purifier bowl O-ring kit", unit: "set", minimum: 2, fits: [] },
  { number: "BW-1021", makerRef: "BK-260-15", description: "Air compressor valve repair kit, first stage", unit: "set", critical: true, minimum: 1, fits: [] },
  { number: "BW-1030", makerRef: "NP-MS-45", description: "Mechanical seal, sea water pump", unit: "piece", critical: true, minimum: 1, fits: [] },
  { number: "BW-1040", makerRef: "", description: "Liquid gasket sealant, 100 ml tube", unit: "piece", fits: [] },
  { number: "BW-1050", makerRef: "", description: "System oil, main engine", unit: "litre", minimum: 2000, fits: ["ME"] },
  { number: "BW-1051", makerRef: "", description: "Packing cord, graphite, 10 mm", unit: "metre", fits: [] },
];

/** What a job takes each time, by the routine's title (demo and onboarded wordings alike). */
const NEEDS: { title: RegExp; part: string; quantity: number }[] = [
  { title: /piston overhaul/i, part: "BW-1001", quantity: 1 },
  { title: /piston overhaul/i, part: "BW-1004", quantity: 1 },
  { title: /piston overhaul/i, part: "BW-1040", quantity: 1 },
  { title: /exhaust valve overhaul/i, part: "BW-1002", quantity: 1 },
  { title: /fuel valves? pressure test/i, part: "BW-1003", quantity: 3 },
  { title: /generator.*lube oil|lube oil.*generator/i, part: "BW-1010", quantity: 2 },
  { title: /injector pressure test|injection valve test/i, part: "BW-1011", quantity: 1 },
  { title: /cylinder heads?/i, part: "BW-1012", quantity: 1 },
  { title: /purifier.*bowl|bowl cleaning/i, part: "BW-1020", quantity: 1 },
  { title: /compressor.*valves? overhaul|compressor valve overhaul/i, part: "BW-1021", quantity: 1 },
];

export async function seedParts(db: Db, companyId: string, now: Date): Promise<void> {
  const [present] = await db.select({ id: s.part.id }).from(s.part).where(eq(s.part.companyId, companyId)).limit(1);
  if (present) return;
  const vessels = await db.select().from(s.vessel).where(eq(s.vessel.companyId, companyId));
  const components = await db.select({ id: s.component.id, code: s.component.code, vesselId: s.component.vesselId }).from(s.component).where(eq(s.component.companyId, companyId));
  const [storekeeper] = await db.select({ id: s.user.id }).from(s.user).where(eq(s.user.email, "second@brightwater.example"));
  await db.transaction(async (tx) => {
    const parts = await tx
      .insert(s.part)
      .values(CATALOGUE.map((p) => ({ companyId, number: p.number, makerRef: p.makerRef || null, description: p.description, unit: p.unit, critical: p.critical ?? false, minimumOnBoard: p.minimum ?? 0 })))
      .returning();
    const fits = CATALOGUE.flatMap((p, i) => components.filter((c) => p.fits.includes(c.code)).map((c) => ({ companyId, partId: parts[i]!.id, componentId: c.id })));
    if (fits.length) await tx.insert(s.partFit).values(fits);
    const byNumber = new Map(parts.map((p) => [p.number, p.id]));
    const routines = await tx.select({ id: s.routine.id, title: s.routine.title }).from(s.routine).where(eq(s.routine.companyId, companyId));
    const needs = routines.flatMap((r) =>
      NEEDS.filter((n) => n.title.test(r.title)).map((n) => ({ companyId, routineId: r.id, partId: byNumber.get(n.part)!, quantity: n.quantity })),
    );
    // One row per routine and part: the first rule naming a part wins.
    const once = [...new Map(needs.map((n) => [`${n.routineId} ${n.partId}`, n])).values()];
    for (let i = 0; i < once.length; i += 1000) await tx.insert(s.routinePart).values(once.slice(i, i + 1000));
    for (const [n, v] of vessels.entries()) {
      const random = seededRandom(900 + n);
      const [store, rackB, workshop] = await tx
        .insert(s.storeLocation)
        .values([
          { companyId, vesselId: v.id, store: "Engine store", rack: "1", bin: "A" },
          { companyId, vesselId: v.id, store: "Engine store", rack: "2", bin: "B" },
          { companyId, vesselId: v.id, store: "Workshop" },
        ])
        .returning();
      const rows: (typeof s.stockMovement.$inferInsert)[] = [];
      for (const [i, p] of parts.entries()) {
        const demo = CATALOGUE[i]!;
        const minimum = demo.minimum ?? 0;
        const received = demo.unit === "litre" ? 4000 : Math.max(2, minimum * 2);
        const at = (daysAgo: number) => addDays(now, -daysAgo);
        const where = i % 2 ? rackB! : store!;
        rows.push({ companyId, vesselId: v.id, partId: p.id, locationId: where.id, kind: "received", quantity: received, reason: "Delivered with the annual spares order", movedBy: storekeeper?.id ?? null, movedAt: at(300) });
        // Used over the year: most stay above the minimum, a few critical spares fall below it.
        // Aster Gale has used all her ring sets: her Port Kelang overhaul finds them short.
        const usedUp = v.code === "AG" && demo.number === "BW-1001";
        const runDown = demo.critical && random() < 0.35;
        const used = usedUp ? received : runDown ? received - Math.max(0, minimum - 1) : Math.floor(received * (0.2 + random() * 0.3));
        if (used > 0) rows.push({ companyId, vesselId: v.id, partId: p.id, locationId: where.id, kind: "used", quantity: -used, reason: "Used on planned work", movedBy: storekeeper?.id ?? null, movedAt: at(40 + Math.floor(random() * 200)) });
        if (i === 0 && !usedUp) {
          rows.push({ companyId, vesselId: v.id, partId: p.id, locationId: where.id, kind: "moved-out", quantity: -1, reason: "Ready for the next overhaul", movedBy: storekeeper?.id ?? null, movedAt: at(10) });
          rows.push({ companyId, vesselId: v.id, partId: p.id, locationId: workshop!.id, kind: "moved-in", quantity: 1, reason: "Ready for the next overhaul", movedBy: storekeeper?.id ?? null, movedAt: at(10) });
        }
      }
      // One count that found a difference, with its reason.
      rows.push({ companyId, vesselId: v.id, partId: parts[4]!.id, locationId: store!.id, kind: "counted", quantity: 1, reason: "Quarterly count: one found in the wrong bin", movedBy: storekeeper?.id ?? null, movedAt: addDays(now, -20) });
      await tx.insert(s.stockMovement).values(rows.filter((r) => r.quantity !== 0));
    }
    await seedRequisitions(tx, companyId, vessels, byNumber, storekeeper?.id ?? null, now);
  });
}

/**
 * A requisition delivered on each vessel two months ago (received into its stores), and one sent
 * to the office for delivery at its next port stay: the Fleet board and the office's list have
 * something to show. Aster Gale's ring sets are not asked for: her chief finds them short.
 */
async function seedRequisitions(
  tx: Parameters<Parameters<Db["transaction"]>[0]>[0],
  companyId: string,
  vessels: { id: string; code: string }[],
  byNumber: Map<string, string>,
  by: string | null,
  now: Date,
) {
  for (const v of vessels) {
    const [store] = await tx.select().from(s.storeLocation).where(eq(s.storeLocation.vesselId, v.id)).limit(1);
    const [done] = await tx
      .insert(s.requisition)
      .values({ companyId, vesselId: v.id, number: `RQ-${v.code}-0001`, state: "delivered", note: "Filters for the generator oil changes.", orderRef: "PO-24-0117", createdBy: by, createdAt: addDays(now, -70), sentAt: addDays(now, -69), orderedAt: addDays(now, -66), deliveredAt: addDays(now, -58) })
      .returning();
    const [line] = await tx.insert(s.requisitionLine).values({ companyId, requisitionId: done!.id, partId: byNumber.get("BW-1010")!, quantity: 6, reason: "Under its minimum of 6" }).returning();
    await tx.insert(s.stockMovement).values({ companyId, vesselId: v.id, partId: line!.partId, locationId: store!.id, kind: "received", quantity: 6, requisitionLineId: line!.id, reason: `Delivered against RQ-${v.code}-0001`, movedBy: by, movedAt: addDays(now, -58) });
    const [next] = await tx
      .select({ id: s.portStay.id })
      .from(s.portStay)
      .where(and(eq(s.portStay.vesselId, v.id), gt(s.portStay.arrivesAt, now)))
      .orderBy(asc(s.portStay.arrivesAt))
      .limit(1);
    const [sent] = await tx
      .insert(s.requisition)
      .values({ companyId, vesselId: v.id, number: `RQ-${v.code}-0002`, portStayId: next?.id ?? null, state: "sent", note: "Critical spares under their minimum.", createdBy: by, createdAt: addDays(now, -4), sentAt: addDays(now, -3) })
      .returning();
    await tx.insert(s.requisitionLine).values([
      { companyId, requisitionId: sent!.id, partId: byNumber.get("BW-1011")!, quantity: 3, reason: "Back to its minimum of 3", position: 0 },
      { companyId, requisitionId: sent!.id, partId: byNumber.get("BW-1030")!, quantity: 1, reason: "Back to its minimum of 1", position: 1 },
    ]);
  }
}
