// Requisitions: the chief engineer asks the office for parts to be delivered at a port stay (often
// the shortfalls of the stay's work package), the office orders them, and they are received on
// board line by line into the stores — each receipt a stock movement of its own.
import "server-only";
import { and, asc, desc, eq, gt, inArray, sql, type SQL } from "drizzle-orm";
import { getDb, type Db, type Tx } from "@/db/client";
import {
  defect,
  part,
  portStay,
  requisition,
  requisitionLine,
  routinePart,
  stockMovement,
  storeLocation,
  user,
  vessel as vesselTable,
  workOrder,
  workPackageItem,
} from "@/db/schema";
import type { Access, VesselRef } from "@/server/auth/access";
import { can } from "@/server/auth/roles";
import { AppError, type FieldError, invalidInput } from "@/server/http/problem";
import { findStay } from "@/server/port-stays/queries";
import type { RequisitionList, RequisitionValues, RequisitionView, StayParts } from "./contract";
import { fullyReceived, moveProblem, OPEN_REQUISITION_STATES, stayShortfalls } from "./requisition-rules";
import { q3, unitProblem } from "./stock";
import { lockStock } from "./use";

/** A vessel's list shows its newest requisitions; older ones are in the fleet CSV. */
export const REQUISITION_LIST_LIMIT = 200;

const iso = (d: Date | null) => (d ? d.toISOString() : null);
const place = (l: { store: string; rack: string; bin: string }) => [l.store, l.rack && `rack ${l.rack}`, l.bin && `bin ${l.bin}`].filter(Boolean).join(", ");

function noSuchRequisition() {
  return new AppError("not-found", "There is no such requisition on this vessel.");
}

/** Requisitions with their lines and what has been received against each, as views. */
async function loadViews(db: Db | Tx, access: Access, where: SQL | undefined, limit = REQUISITION_LIST_LIMIT): Promise<RequisitionView[]> {
  const heads = await db
    .select({ r: requisition, vesselName: vesselTable.name, vesselCode: vesselTable.code, timeZone: vesselTable.timeZone, retiredAt: vesselTable.retiredAt, port: portStay.port, arrivesAt: portStay.arrivesAt, createdBy: user.name })
    .from(requisition)
    .innerJoin(vesselTable, eq(vesselTable.id, requisition.vesselId))
    .leftJoin(portStay, eq(portStay.id, requisition.portStayId))
    .leftJoin(user, eq(user.id, requisition.createdBy))
    .where(and(eq(requisition.companyId, access.company.id), where))
    .orderBy(desc(requisition.createdAt), desc(requisition.number))
    .limit(limit);
  if (!heads.length) return [];
  const ids = heads.map((h) => h.r.id);
  const lines = await db
    .select({
      l: requisitionLine,
      number: part.number,
      description: part.description,
      unit: part.unit,
      received: sql<string>`coalesce((select sum(m.quantity) from ${stockMovement} m where m.company_id = ${requisitionLine.companyId} and m.requisition_line_id = ${requisitionLine.id}), 0)`,
    })
    .from(requisitionLine)
    .innerJoin(part, eq(part.id, requisitionLine.partId))
    .where(and(eq(requisitionLine.companyId, access.company.id), inArray(requisitionLine.requisitionId, ids)))
    .orderBy(asc(requisitionLine.position), asc(part.number));
  const plan = can(access.role, "work:plan");
  const order = can(access.role, "requisitions:order");
  const receive = can(access.role, "stores:write");
  return heads.map(({ r, ...h }) => {
    const live = !h.retiredAt;
    return {
      id: r.id,
      number: r.number,
      state: r.state,
      vessel: { id: r.vesselId, name: h.vesselName, code: h.vesselCode, timeZone: h.timeZone },
      portStay: r.portStayId && h.port && h.arrivesAt ? { id: r.portStayId, port: h.port, arrivesAt: h.arrivesAt.toISOString() } : null,
      note: r.note,
      orderRef: r.orderRef,
      createdBy: h.createdBy,
      createdAt: r.createdAt.toISOString(),
      sentAt: iso(r.sentAt),
      orderedAt: iso(r.orderedAt),
      deliveredAt: iso(r.deliveredAt),
      lines: lines
        .filter((l) => l.l.requisitionId === r.id)
        .map((l) => ({ id: l.l.id, partId: l.l.partId, number: l.number, description: l.description, unit: l.unit, quantity: l.l.quantity, received: q3(Number(l.received)), reason: l.l.reason })),
      may: {
        edit: live && plan && r.state === "drafted",
        send: live && !moveProblem(r.state, "sent", { plan, order }),
        order: live && !moveProblem(r.state, "ordered", { plan, order }),
        cancel: live && !moveProblem(r.state, "cancelled", { plan, order }),
        receive: live && receive && (r.state === "sent" || r.state === "ordered"),
      },
    };
  });
}

async function oneView(db: Db | Tx, access: Access, vessel: VesselRef, id: string): Promise<RequisitionView> {
  const [view] = await loadViews(db, access, and(eq(requisition.vesselId, vessel.id), eq(requisition.id, id)), 1);
  if (!view) throw noSuchRequisition();
  return view;
}

export async function listRequisitions(access: Access, vessel: VesselRef, now = new Date()): Promise<RequisitionList> {
  const db = getDb();
  const [requisitions, stays, locations] = await Promise.all([
    loadViews(db, access, eq(requisition.vesselId, vessel.id)),
    db
      .select({ id: portStay.id, port: portStay.port, arrivesAt: portStay.arrivesAt })
      .from(portStay)
      .where(and(eq(portStay.companyId, access.company.id), eq(portStay.vesselId, vessel.id), gt(portStay.departsAt, now)))
      .orderBy(asc(portStay.arrivesAt))
      .limit(50),
    db
      .select()
      .from(storeLocation)
      .where(and(eq(storeLocation.companyId, access.company.id), eq(storeLocation.vesselId, vessel.id)))
      .orderBy(asc(storeLocation.store), asc(storeLocation.rack), asc(storeLocation.bin)),
  ]);
  return {
    vessel: { id: vessel.id, name: vessel.name, code: vessel.code, timeZone: vessel.timeZone },
    requisitions,
    stays: stays.map((s) => ({ id: s.id, port: s.port, arrivesAt: s.arrivesAt.toISOString() })),
    locations: locations.map((l) => ({ id: l.id, place: place(l) })),
    canDraft: can(access.role, "work:plan") && !vessel.retiredAt,
  };
}

/** The lines checked: each part the company's, once, in a unit it can be counted in. */
async function checkLines(tx: Tx, access: Access, vessel: VesselRef, input: Partial<RequisitionValues>): Promise<void> {
  const errors: FieldError[] = [];
  if (input.portStayId) {
    const [stay] = await tx
      .select({ id: portStay.id })
      .from(portStay)
      .where(and(eq(portStay.companyId, access.company.id), eq(portStay.vesselId, vessel.id), eq(portStay.id, input.portStayId)));
    if (!stay) errors.push({ field: "portStayId", message: `There is no such port stay of ${vessel.name}.` });
  }
  if (input.lines) {
    const ids = input.lines.map((l) => l.partId);
    const known = ids.length ? await tx.select().from(part).where(and(eq(part.companyId, access.company.id), inArray(part.id, ids))) : [];
    const byId = new Map(known.map((p) => [p.id, p]));
    const seen = new Set<string>();
    input.lines.forEach((l, i) => {
      const p = byId.get(l.partId);
      if (!p) errors.push({ field: `lines.${i}.partId`, message: "There is no such part in the catalogue." });
      else if (seen.has(l.partId)) errors.push({ field: `lines.${i}.partId`, message: `${p.number} is asked for twice: add up its quantities on one line.` });
      else {
        const problem = unitProblem(p.unit, l.quantity, `lines.${i}.quantity`);
        if (problem) errors.push(problem);
      }
      seen.add(l.partId);
    });
  }
  if (errors.length) throw invalidInput(errors);
}

async function writeLines(tx: Tx, companyId: string, requisitionId: string, lines: RequisitionValues["lines"]) {
  await tx.delete(requisitionLine).where(and(eq(requisitionLine.companyId, companyId), eq(requisitionLine.requisitionId, requisitionId)));
  await tx.insert(requisitionLine).values(lines.map((l, position) => ({ companyId, requisitionId, partId: l.partId, quantity: l.quantity, reason: l.reason, position })));
}

export async function createRequisition(access: Access, vessel: VesselRef, input: RequisitionValues): Promise<RequisitionView> {
  const companyId = access.company.id;
  return getDb().transaction(async (tx) => {
    await checkLines(tx, access, vessel, input);
    // One numbering per vessel: "RQ-ALPHA-0007".
    await tx.execute(sql`select pg_advisory_xact_lock(hashtextextended(${`requisition:${vessel.id}`}, 0))`);
    const [{ n } = { n: 0 }] = await tx
      .select({ n: sql<number>`count(*)::int` })
      .from(requisition)
      .where(and(eq(requisition.companyId, companyId), eq(requisition.vesselId, vessel.id)));
    const [row] = await tx
      .insert(requisition)
      .values({ companyId, vesselId: vessel.id, number: `RQ-${vessel.code}-${String(n + 1).padStart(4, "0")}`, portStayId: input.portStayId, note: input.note, createdBy: access.user.id })
      .returning({ id: requisition.id });
    await writeLines(tx, companyId, row!.id, input.lines);
    return oneView(tx, access, vessel, row!.id);
  });
}

async function lockRequisition(tx: Tx, access: Access, vessel: VesselRef, id: string) {
  const [row] = await tx
    .select()
    .from(requisition)
    .where(and(eq(requisition.companyId, access.company.id), eq(requisition.vesselId, vessel.id), eq(requisition.id, id)))
    .for("update");
  if (!row) throw noSuchRequisition();
  return row;
}

/** A draft changed before it is sent: its port stay, note or lines (the whole list replaced). */
export async function updateRequisition(access: Access, vessel: VesselRef, id: string, input: Partial<RequisitionValues>): Promise<RequisitionView> {
  return getDb().transaction(async (tx) => {
    const row = await lockRequisition(tx, access, vessel, id);
    if (row.state !== "drafted") throw new AppError("conflict", `${row.number} has been sent: it is no longer changed on board.`);
    await checkLines(tx, access, vessel, input);
    const { lines, ...fields } = input;
    await tx.update(requisition).set({ ...fields, updatedAt: new Date() }).where(eq(requisition.id, row.id));
    if (lines) await writeLines(tx, access.company.id, row.id, lines);
    return oneView(tx, access, vessel, row.id);
  });
}

export async function moveRequisition(
  access: Access,
  vessel: VesselRef,
  id: string,
  input: { to: "sent" | "ordered" | "cancelled"; orderRef: string },
  now = new Date(),
): Promise<RequisitionView> {
  return getDb().transaction(async (tx) => {
    const row = await lockRequisition(tx, access, vessel, id);
    const problem = moveProblem(row.state, input.to, { plan: can(access.role, "work:plan"), order: can(access.role, "requisitions:order") });
    // "A requisition … cannot …" is about its state; "The office …" / "The vessel's chief …" about who.
    if (problem) throw new AppError(problem.startsWith("A ") ? "conflict" : "forbidden", `${row.number}: ${problem}`);
    const stamp = input.to === "sent" ? { sentAt: now } : input.to === "ordered" ? { orderedAt: now, orderRef: input.orderRef } : { cancelledAt: now };
    await tx.update(requisition).set({ state: input.to, ...stamp, updatedAt: now }).where(eq(requisition.id, row.id));
    return oneView(tx, access, vessel, row.id);
  });
}

/** Parts delivered against a requisition, line by line, into the stores; in full (or closed), it is delivered. */
export async function receiveRequisition(
  access: Access,
  vessel: VesselRef,
  id: string,
  input: { items: { lineId: string; locationId: string; quantity: number }[]; complete: boolean },
  now = new Date(),
): Promise<RequisitionView> {
  const companyId = access.company.id;
  return getDb().transaction(async (tx) => {
    const row = await lockRequisition(tx, access, vessel, id);
    if (row.state !== "sent" && row.state !== "ordered") {
      throw new AppError("conflict", `${row.number} is ${row.state}: only a requisition sent or ordered is received.`);
    }
    if (!input.items.length && !input.complete) throw invalidInput([{ field: "items", message: "Enter what was received, or close it as delivered." }]);
    const lines = await tx
      .select({ id: requisitionLine.id, partId: requisitionLine.partId, unit: part.unit })
      .from(requisitionLine)
      .innerJoin(part, eq(part.id, requisitionLine.partId))
      .where(and(eq(requisitionLine.companyId, companyId), eq(requisitionLine.requisitionId, row.id)));
    const lineOf = new Map(lines.map((l) => [l.id, l]));
    const places = input.items.length
      ? await tx
          .select({ id: storeLocation.id })
          .from(storeLocation)
          .where(and(eq(storeLocation.companyId, companyId), eq(storeLocation.vesselId, vessel.id), inArray(storeLocation.id, input.items.map((i) => i.locationId))))
      : [];
    const known = new Set(places.map((p) => p.id));
    const errors: FieldError[] = [];
    input.items.forEach((item, i) => {
      const line = lineOf.get(item.lineId);
      if (!line) errors.push({ field: `items.${i}.lineId`, message: `That line is not on ${row.number}.` });
      else {
        const problem = unitProblem(line.unit, item.quantity, `items.${i}.quantity`);
        if (problem) errors.push(problem);
      }
      if (!known.has(item.locationId)) errors.push({ field: `items.${i}.locationId`, message: `There is no such location on ${vessel.name}.` });
    });
    if (errors.length) throw invalidInput(errors);
    if (input.items.length) {
      await lockStock(tx, vessel.id, input.items.map((i) => lineOf.get(i.lineId)!.partId));
      await tx.insert(stockMovement).values(
        input.items.map((item) => ({
          companyId,
          vesselId: vessel.id,
          partId: lineOf.get(item.lineId)!.partId,
          locationId: item.locationId,
          kind: "received" as const,
          quantity: item.quantity,
          requisitionLineId: item.lineId,
          reason: `Delivered against ${row.number}`,
          movedBy: access.user.id,
          movedAt: now,
        })),
      );
    }
    const view = await oneView(tx, access, vessel, row.id);
    if (input.complete || fullyReceived(view.lines)) {
      await tx.update(requisition).set({ state: "delivered", deliveredAt: now, updatedAt: now }).where(eq(requisition.id, row.id));
      return oneView(tx, access, vessel, row.id);
    }
    return view;
  });
}

/** Every open (or every) requisition of the vessels the person sees, for the office to work from. */
export async function fleetRequisitions(access: Access, state: "open" | "all"): Promise<RequisitionView[]> {
  const scope = [
    state === "open" ? inArray(requisition.state, [...OPEN_REQUISITION_STATES]) : undefined,
    access.assignedVesselIds ? inArray(requisition.vesselId, access.assignedVesselIds.length ? access.assignedVesselIds : ["00000000-0000-0000-0000-000000000000"]) : undefined,
  ];
  return loadViews(getDb(), access, and(...scope), 2_000);
}

/** What open requisitions of the vessel still ask for, per part (asked less received). */
async function askedFor(db: Db, companyId: string, vesselId: string): Promise<Map<string, number>> {
  const rows = await db
    .select({
      partId: requisitionLine.partId,
      open: sql<string>`sum(greatest(0, ${requisitionLine.quantity} - coalesce((select sum(m.quantity) from ${stockMovement} m where m.company_id = ${requisitionLine.companyId} and m.requisition_line_id = ${requisitionLine.id}), 0)))`,
    })
    .from(requisitionLine)
    .innerJoin(requisition, eq(requisition.id, requisitionLine.requisitionId))
    .where(and(eq(requisition.companyId, companyId), eq(requisition.vesselId, vesselId), inArray(requisition.state, [...OPEN_REQUISITION_STATES])))
    .groupBy(requisitionLine.partId);
  return new Map(rows.map((r) => [r.partId, q3(Number(r.open))]));
}

/**
 * The parts a port stay's jobs need (their routines' lists) against what is on board and already
 * asked for; with `keepMinimum`, every part brought back to its minimum too.
 */
export async function stayParts(access: Access, vessel: VesselRef, stayId: string, query: { minimum: "0" | "1"; jobs?: string[] }): Promise<StayParts> {
  const db = getDb();
  const companyId = access.company.id;
  const stay = await findStay(db, access, vessel, stayId);
  const jobIds = query.jobs
    ? query.jobs
    : (
        await db
          .select({ id: workPackageItem.workOrderId })
          .from(workPackageItem)
          .where(and(eq(workPackageItem.companyId, companyId), eq(workPackageItem.portStayId, stay.id)))
      ).map((r) => r.id);
  const mine = and(eq(workOrder.companyId, companyId), eq(workOrder.vesselId, vessel.id), inArray(workOrder.id, jobIds));
  const [routineNeeds, repairs] = jobIds.length
    ? await Promise.all([
        db
          .select({ partId: routinePart.partId, quantity: routinePart.quantity, job: workOrder.number })
          .from(workOrder)
          .innerJoin(routinePart, eq(routinePart.routineId, workOrder.routineId))
          .where(mine),
        // A defect's repair needs the parts its plan names.
        db.select({ parts: defect.parts, job: workOrder.number }).from(workOrder).innerJoin(defect, eq(defect.workOrderId, workOrder.id)).where(mine),
      ])
    : [[], []];
  const needs = [...routineNeeds, ...repairs.flatMap((r) => r.parts.map((p) => ({ partId: p.partId, quantity: p.quantity, job: r.job })))];
  const keepMinimum = query.minimum === "1";
  const [parts, sums, asked, open] = await Promise.all([
    db.select().from(part).where(eq(part.companyId, companyId)),
    db
      .select({ partId: stockMovement.partId, total: sql<string>`sum(${stockMovement.quantity})` })
      .from(stockMovement)
      .where(and(eq(stockMovement.companyId, companyId), eq(stockMovement.vesselId, vessel.id)))
      .groupBy(stockMovement.partId),
    askedFor(db, companyId, vessel.id),
    db
      .select({ id: requisition.id, number: requisition.number, state: requisition.state })
      .from(requisition)
      .where(and(eq(requisition.companyId, companyId), eq(requisition.vesselId, vessel.id), eq(requisition.portStayId, stay.id), inArray(requisition.state, [...OPEN_REQUISITION_STATES])))
      .orderBy(asc(requisition.number)),
  ]);
  const byId = new Map(parts.map((p) => [p.id, p]));
  const lines = stayShortfalls(needs, byId, new Map(sums.map((s) => [s.partId, q3(Number(s.total))])), asked, keepMinimum)
    .map((l) => {
      const p = byId.get(l.partId)!;
      return { ...l, number: p.number, description: p.description, unit: p.unit, critical: p.critical, minimumOnBoard: p.minimumOnBoard };
    })
    .sort((a, b) => b.toOrder - a.toOrder || Number(b.critical) - Number(a.critical) || a.number.localeCompare(b.number));
  return {
    stayId: stay.id,
    basis: query.jobs ? "shown" : "accepted-package",
    jobs: jobIds.length,
    lines,
    openRequisitions: open,
    canRequest: can(access.role, "work:plan") && !vessel.retiredAt,
  };
}
