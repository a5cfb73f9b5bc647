// The parts catalogue (company-wide) and the stores on board (per vessel): reading what is on board
// as the sum of the movements, and writing each movement as its own row under a lock per vessel and
// part, so two people taking the last part at once leave the stock right and one of them is refused.
import "server-only";
import { randomUUID } from "node:crypto";
import { and, asc, desc, eq, inArray, sql } from "drizzle-orm";
import { getDb, type Tx } from "@/db/client";
import { component, part, partFit, routine, routinePart, stockMovement, storeLocation, user, vessel as vesselTable } from "@/db/schema";
import type { Access, VesselRef } from "@/server/auth/access";
import { can } from "@/server/auth/roles";
import { AppError, invalidInput } from "@/server/http/problem";
import { type Catalogue, type CataloguePart, type FittingPart, type MovementValues, type PartValues, type RecentMovement, type StoresView } from "./contract";
import { countDifference, isLow, q3, stockByLocation, takeProblem, unitProblem } from "./stock";
import { lockStock } from "./use";

/** A catalogue larger than this is paged by the company's own tools; the page lists this many. */
export const CATALOGUE_LIMIT = 10_000;

const place = (l: { store: string; rack: string; bin: string }) => [l.store, l.rack && `rack ${l.rack}`, l.bin && `bin ${l.bin}`].filter(Boolean).join(", ");

/** The catalogue, or (with `onlyPartId`) the one part a change answers with. */
export async function loadCatalogue(access: Access, onlyPartId?: string): Promise<Catalogue> {
  const db = getDb();
  const companyId = access.company.id;
  const parts = await db
    .select()
    .from(part)
    .where(and(eq(part.companyId, companyId), onlyPartId ? eq(part.id, onlyPartId) : undefined))
    .orderBy(asc(part.number))
    .limit(CATALOGUE_LIMIT);
  const fits = parts.length
    ? await db
        .select({ partId: partFit.partId, id: component.id, code: component.code, name: component.name, vesselCode: vesselTable.code, vesselId: component.vesselId })
        .from(partFit)
        .innerJoin(component, eq(component.id, partFit.componentId))
        .innerJoin(vesselTable, eq(vesselTable.id, component.vesselId))
        .where(and(eq(partFit.companyId, companyId), inArray(partFit.partId, parts.map((p) => p.id))))
        .orderBy(asc(vesselTable.code), asc(component.code))
    : [];
  // A seagoing user sees the components of the vessels they are assigned to.
  const visible = (vesselId: string) => !access.assignedVesselIds || access.assignedVesselIds.includes(vesselId);
  return {
    canEdit: can(access.role, "parts:edit"),
    parts: parts.map((p) => ({
      id: p.id,
      number: p.number,
      makerRef: p.makerRef ?? "",
      description: p.description,
      unit: p.unit,
      critical: p.critical,
      minimumOnBoard: p.minimumOnBoard,
      fits: fits.filter((f) => f.partId === p.id && visible(f.vesselId)).map(({ id, code, name, vesselCode }) => ({ id, code, name, vesselCode })),
    })),
  };
}

/** The components named are the company's, and ones the user may open. */
async function checkFits(tx: Tx, access: Access, ids: string[]) {
  if (!ids.length) return;
  const found = await tx
    .select({ id: component.id, vesselId: component.vesselId })
    .from(component)
    .where(and(eq(component.companyId, access.company.id), inArray(component.id, ids)));
  const known = new Set(found.filter((c) => !access.assignedVesselIds || access.assignedVesselIds.includes(c.vesselId)).map((c) => c.id));
  const missing = ids.filter((id) => !known.has(id));
  if (missing.length) throw invalidInput([{ field: "fits", message: `${missing.length} of the components chosen are not on a vessel of yours; choose them again.` }]);
}

async function setFits(tx: Tx, access: Access, partId: string, ids: string[]) {
  await tx.delete(partFit).where(and(eq(partFit.companyId, access.company.id), eq(partFit.partId, partId)));
  const unique = [...new Set(ids)];
  if (unique.length) await tx.insert(partFit).values(unique.map((componentId) => ({ companyId: access.company.id, partId, componentId })));
}

export async function createPart(access: Access, input: PartValues): Promise<CataloguePart> {
  const id = await getDb().transaction(async (tx) => {
    await checkFits(tx, access, input.fits);
    const { fits, ...fields } = input;
    const [row] = await tx.insert(part).values({ companyId: access.company.id, ...fields }).returning({ id: part.id });
    await setFits(tx, access, row!.id, fits);
    return row!.id;
  });
  return (await loadCatalogue(access, id)).parts[0]!;
}

export async function updatePart(access: Access, partId: string, input: Partial<PartValues>): Promise<CataloguePart> {
  await getDb().transaction(async (tx) => {
    const [was] = await tx.select().from(part).where(and(eq(part.companyId, access.company.id), eq(part.id, partId))).for("update");
    if (!was) throw new AppError("not-found", "There is no such part in the catalogue.");
    const { fits, ...fields } = input;
    // A unit changed to whole pieces while some vessel holds a part of one is refused.
    if (fields.unit && fields.unit !== was.unit && (fields.unit === "piece" || fields.unit === "set")) {
      const [odd] = await tx
        .select({ n: sql<number>`count(*)::int` })
        .from(stockMovement)
        .where(and(eq(stockMovement.companyId, access.company.id), eq(stockMovement.partId, partId), sql`${stockMovement.quantity} <> trunc(${stockMovement.quantity})`));
      if (odd && odd.n > 0) throw invalidInput([{ field: "unit", message: "Some stock of this part is recorded in parts of a unit; it cannot be counted in whole pieces." }]);
    }
    if (Object.keys(fields).length) await tx.update(part).set({ ...fields, updatedAt: new Date() }).where(eq(part.id, partId));
    if (fits) {
      await checkFits(tx, access, fits);
      await setFits(tx, access, partId, fits);
    }
  });
  return (await loadCatalogue(access, partId)).parts[0]!;
}

export async function loadStores(access: Access, vessel: VesselRef): Promise<StoresView> {
  const db = getDb();
  const companyId = access.company.id;
  const [locations, sums, parts] = await Promise.all([
    db
      .select()
      .from(storeLocation)
      .where(and(eq(storeLocation.companyId, companyId), eq(storeLocation.vesselId, vessel.id)))
      .orderBy(asc(storeLocation.store), asc(storeLocation.rack), asc(storeLocation.bin)),
    db
      .select({ partId: stockMovement.partId, locationId: stockMovement.locationId, quantity: sql<string>`sum(${stockMovement.quantity})` })
      .from(stockMovement)
      .where(and(eq(stockMovement.companyId, companyId), eq(stockMovement.vesselId, vessel.id)))
      .groupBy(stockMovement.partId, stockMovement.locationId),
    db.select().from(part).where(eq(part.companyId, companyId)).orderBy(asc(part.number)).limit(CATALOGUE_LIMIT),
  ]);
  const placeOf = new Map(locations.map((l) => [l.id, place(l)]));
  const byPart = new Map<string, { locationId: string; quantity: number }[]>();
  for (const s of sums) byPart.set(s.partId, [...(byPart.get(s.partId) ?? []), { locationId: s.locationId, quantity: q3(Number(s.quantity)) }]);
  // The lines: every part with stock here, and every critical spare or part with a minimum (kept on every vessel).
  const lines = parts
    .filter((p) => byPart.has(p.id) || p.critical || p.minimumOnBoard > 0)
    .map((p) => {
      const held = (byPart.get(p.id) ?? []).filter((h) => h.quantity !== 0);
      const total = q3(held.reduce((n, h) => n + h.quantity, 0));
      return {
        part: { id: p.id, number: p.number, description: p.description, unit: p.unit, critical: p.critical, minimumOnBoard: p.minimumOnBoard, makerRef: p.makerRef ?? "" },
        onBoard: total,
        byLocation: held.map((h) => ({ locationId: h.locationId, place: placeOf.get(h.locationId) ?? "", quantity: h.quantity })),
        low: isLow(total, p.minimumOnBoard),
      };
    });
  return {
    vessel: { id: vessel.id, name: vessel.name, code: vessel.code },
    locations: locations.map((l) => ({ id: l.id, place: place(l) })),
    lines,
    canWrite: can(access.role, "stores:write") && !vessel.retiredAt,
  };
}

export async function createLocation(access: Access, vessel: VesselRef, input: { store: string; rack: string; bin: string }) {
  const [row] = await getDb()
    .insert(storeLocation)
    .values({ companyId: access.company.id, vesselId: vessel.id, ...input })
    .returning();
  return { id: row!.id, place: place(row!) };
}

/** One movement (a move is two rows), checked against the stock under a lock of the vessel's part. */
export async function recordMovement(access: Access, vessel: VesselRef, input: MovementValues, now = new Date()) {
  const companyId = access.company.id;
  return getDb().transaction(async (tx) => {
    const [p] = await tx.select().from(part).where(and(eq(part.companyId, companyId), eq(part.id, input.partId)));
    if (!p) throw invalidInput([{ field: "partId", message: "There is no such part in the catalogue." }]);
    const wanted = input.kind === "moved" ? [input.locationId, input.toLocationId] : [input.locationId];
    const locations = await tx
      .select()
      .from(storeLocation)
      .where(and(eq(storeLocation.companyId, companyId), eq(storeLocation.vesselId, vessel.id), inArray(storeLocation.id, wanted)));
    const at = new Map(locations.map((l) => [l.id, l]));
    if (!at.has(input.locationId)) throw invalidInput([{ field: "locationId", message: `There is no such location on ${vessel.name}.` }]);
    if (input.kind === "moved") {
      if (!at.has(input.toLocationId)) throw invalidInput([{ field: "toLocationId", message: `There is no such location on ${vessel.name}.` }]);
      if (input.toLocationId === input.locationId) throw invalidInput([{ field: "toLocationId", message: "Choose another location than the one it is taken from." }]);
    }
    // One writer per vessel and part at a time: the stock read below is the stock the row lands on.
    await lockStock(tx, vessel.id, [p.id]);
    const rows = await tx
      .select({ locationId: stockMovement.locationId, quantity: stockMovement.quantity })
      .from(stockMovement)
      .where(and(eq(stockMovement.companyId, companyId), eq(stockMovement.vesselId, vessel.id), eq(stockMovement.partId, p.id)));
    const held = stockByLocation(rows);
    const base = { companyId, vesselId: vessel.id, partId: p.id, movedBy: access.user.id, movedAt: now };
    const here = place(at.get(input.locationId)!);
    if (input.kind === "received") {
      const problem = unitProblem(p.unit, input.quantity, "quantity");
      if (problem) throw invalidInput([problem]);
      await tx.insert(stockMovement).values({ ...base, locationId: input.locationId, kind: "received", quantity: input.quantity, reason: input.reason });
    } else if (input.kind === "counted") {
      const problem = unitProblem(p.unit, input.counted, "counted");
      if (problem) throw invalidInput([problem]);
      const diff = countDifference(held.get(input.locationId) ?? 0, input.counted);
      if (diff === null) return { changed: false, onBoard: q3([...held.values()].reduce((a, b) => a + b, 0)) };
      await tx.insert(stockMovement).values({ ...base, locationId: input.locationId, kind: "counted", quantity: diff, reason: input.reason });
    } else {
      const problem = unitProblem(p.unit, input.quantity, "quantity") ?? takeProblem(held.get(input.locationId) ?? 0, input.quantity, here, p.unit);
      if (problem) throw invalidInput([problem]);
      const moveId = randomUUID();
      await tx.insert(stockMovement).values([
        { ...base, locationId: input.locationId, kind: "moved-out", quantity: -input.quantity, moveId, reason: input.reason },
        { ...base, locationId: input.toLocationId, kind: "moved-in", quantity: input.quantity, moveId, reason: input.reason },
      ]);
    }
    // What was held, plus the movement (a move between locations leaves the total as it was).
    const before = [...held.values()].reduce((a, b) => a + b, 0);
    const delta = input.kind === "received" ? input.quantity : input.kind === "counted" ? countDifference(held.get(input.locationId) ?? 0, input.counted)! : 0;
    return { changed: true, onBoard: q3(before + delta) };
  });
}

/** A part's last movements on the vessel, newest first. */
export async function recentMovements(access: Access, vessel: VesselRef, partId: string, limit = 50): Promise<RecentMovement[]> {
  const rows = await getDb()
    .select({ kind: stockMovement.kind, quantity: stockMovement.quantity, reason: stockMovement.reason, at: stockMovement.movedAt, by: user.name, store: storeLocation.store, rack: storeLocation.rack, bin: storeLocation.bin })
    .from(stockMovement)
    .innerJoin(storeLocation, eq(storeLocation.id, stockMovement.locationId))
    .leftJoin(user, eq(user.id, stockMovement.movedBy))
    .where(and(eq(stockMovement.companyId, access.company.id), eq(stockMovement.vesselId, vessel.id), eq(stockMovement.partId, partId)))
    .orderBy(desc(stockMovement.movedAt))
    .limit(limit);
  return rows.map((r) => ({ kind: r.kind, quantity: r.quantity, place: place(r), reason: r.reason, by: r.by, at: r.at.toISOString() }));
}


/**
 * The parts a job needs (its routine's list, with quantities) and the catalogue's parts that fit its
 * component or the components above it (a cylinder unit's job needs the engine's parts too), each
 * with what the vessel holds and what is short: the work order shows them.
 */
export async function partsForComponent(
  companyId: string,
  vesselId: string,
  componentId: string,
  routineId: string | null = null,
  /** What a defect's plan names, in place of a routine's list. */
  planned: readonly { partId: string; quantity: number }[] = [],
): Promise<FittingPart[]> {
  const db = getDb();
  const tree = await db
    .select({ id: component.id, code: component.code, parentId: component.parentId })
    .from(component)
    .where(and(eq(component.companyId, companyId), eq(component.vesselId, vesselId)));
  const byId = new Map(tree.map((c) => [c.id, c]));
  const line: string[] = [];
  // Up the tree, each component once: a broken tree cannot loop.
  for (let at = byId.get(componentId); at && !line.includes(at.id); at = at.parentId ? byId.get(at.parentId) : undefined) line.push(at.id);
  const fitting = line.length
    ? await db
        .select({ p: part, componentId: partFit.componentId })
        .from(partFit)
        .innerJoin(part, eq(part.id, partFit.partId))
        .where(and(eq(partFit.companyId, companyId), inArray(partFit.componentId, line)))
        .orderBy(asc(part.number))
    : [];
  const needs = routineId
    ? await db
        .select({ p: part, quantity: routinePart.quantity })
        .from(routinePart)
        .innerJoin(part, eq(part.id, routinePart.partId))
        .where(and(eq(routinePart.companyId, companyId), eq(routinePart.routineId, routineId)))
        .orderBy(asc(part.number))
    : planned.length
      ? (await db.select().from(part).where(and(eq(part.companyId, companyId), inArray(part.id, planned.map((n) => n.partId))))).map((p) => ({
          p,
          quantity: planned.find((n) => n.partId === p.id)!.quantity,
        }))
      : [];
  const ids = [...new Set([...needs.map((n) => n.p.id), ...fitting.map((r) => r.p.id)])];
  if (!ids.length) return [];
  const sums = await db
    .select({ partId: stockMovement.partId, total: sql<string>`sum(${stockMovement.quantity})` })
    .from(stockMovement)
    .where(and(eq(stockMovement.companyId, companyId), eq(stockMovement.vesselId, vesselId), inArray(stockMovement.partId, ids)))
    .groupBy(stockMovement.partId);
  const held = new Map(sums.map((s) => [s.partId, q3(Number(s.total))]));
  const fitsOf = new Map<string, string>();
  for (const r of fitting) if (!fitsOf.has(r.p.id)) fitsOf.set(r.p.id, byId.get(r.componentId)?.code ?? "");
  const needed = new Map(needs.map((n) => [n.p.id, n.quantity]));
  const parts = new Map([...needs.map((n) => [n.p.id, n.p] as const), ...fitting.map((r) => [r.p.id, r.p] as const)]);
  // What the job needs first, then what fits.
  return [...parts.values()]
    .sort((a, b) => Number(needed.has(b.id)) - Number(needed.has(a.id)) || a.number.localeCompare(b.number))
    .map((p) => {
      const onBoardNow = held.get(p.id) ?? 0;
      const need = needed.get(p.id) ?? null;
      return {
        id: p.id,
        number: p.number,
        description: p.description,
        unit: p.unit,
        critical: p.critical,
        minimumOnBoard: p.minimumOnBoard,
        onBoard: onBoardNow,
        low: isLow(onBoardNow, p.minimumOnBoard) || onBoardNow <= 0,
        fits: fitsOf.get(p.id) ?? "",
        needed: need,
        short: need === null ? 0 : Math.max(0, q3(need - Math.max(onBoardNow, 0))),
      };
    });
}

/** The parts a routine needs each time: the whole list replaced, every part the company's. */
export async function setRoutineParts(access: Access, vessel: VesselRef, routineId: string, parts: { partId: string; quantity: number }[]) {
  const companyId = access.company.id;
  await getDb().transaction(async (tx) => {
    const [r] = await tx
      .select({ id: routine.id })
      .from(routine)
      .where(and(eq(routine.companyId, companyId), eq(routine.vesselId, vessel.id), eq(routine.id, routineId)));
    if (!r) throw new AppError("not-found", "There is no such routine on this vessel.");
    const ids = [...new Set(parts.map((p) => p.partId))];
    if (ids.length !== parts.length) throw invalidInput([{ field: "parts", message: "Each part once: add up the quantities of a part named twice." }]);
    const known = ids.length ? await tx.select().from(part).where(and(eq(part.companyId, companyId), inArray(part.id, ids))) : [];
    const byId = new Map(known.map((p) => [p.id, p]));
    const errors = parts.flatMap((p, i) => {
      const found = byId.get(p.partId);
      if (!found) return [{ field: `parts.${i}.partId`, message: "There is no such part in the catalogue." }];
      const problem = unitProblem(found.unit, p.quantity, `parts.${i}.quantity`);
      return problem ? [problem] : [];
    });
    if (errors.length) throw invalidInput(errors);
    await tx.delete(routinePart).where(and(eq(routinePart.companyId, companyId), eq(routinePart.routineId, routineId)));
    if (parts.length) await tx.insert(routinePart).values(parts.map((p) => ({ companyId, routineId, partId: p.partId, quantity: p.quantity })));
  });
  return { parts };
}

/** The parts a routine needs, as its editor shows them. */
export async function getRoutineParts(access: Access, vessel: VesselRef, routineId: string) {
  const companyId = access.company.id;
  const db = getDb();
  const [r] = await db
    .select({ id: routine.id })
    .from(routine)
    .where(and(eq(routine.companyId, companyId), eq(routine.vesselId, vessel.id), eq(routine.id, routineId)));
  if (!r) throw new AppError("not-found", "There is no such routine on this vessel.");
  const rows = await db
    .select({ partId: part.id, number: part.number, description: part.description, unit: part.unit, quantity: routinePart.quantity })
    .from(routinePart)
    .innerJoin(part, eq(part.id, routinePart.partId))
    .where(and(eq(routinePart.companyId, companyId), eq(routinePart.routineId, routineId)))
    .orderBy(asc(part.number));
  return { parts: rows };
}
