// Accepting a port stay's work package as the chief moved it on the timeline: every item is checked
// against its work order (this vessel's, open, in no other coming stay's package) and against the
// stay's clock, engine stop, crew, watches and rest hours (server/planning/package-check.ts), all
// under the vessel's work-order lock; any problem refuses the whole package (422, one entry per item)
// and nothing is written. The same check answers the timeline after each move, without writing.
import "server-only";
import { and, eq, inArray } from "drizzle-orm";
import { type Db, getDb, type Tx } from "@/db/client";
import { component, portStay, workOrder, workPackageItem } from "@/db/schema";
import type { Access, VesselRef } from "@/server/auth/access";
import { AppError, type FieldError, invalidInput } from "@/server/http/problem";
import { checkPackage, type PackageItem } from "@/server/planning/package-check";
import { lockVesselWorkOrders } from "@/server/work-orders/lock";
import type { PackageCheck, PackageInput, PackageProblem, PackageResult, PlacedView } from "./contract";
import { planJobOf, planStayOf } from "./plan-input";
import { clearPlannedDates, findStay, jobColumns, packagedElsewhere, placedView, type StayRow, toJob } from "./queries";
import { instantOfShipDateTime, shipDateTimeOf } from "./stay-days";
import { loadRankNames } from "@/server/admin/rank-names";

/** Said when the chief put a job in by hand, not from the proposal. */
export const ADDED_BY_HAND = "Added to the package by the chief engineer.";

type Evaluated = { placed: (PlacedView | null)[]; problems: PackageProblem[] };

async function evaluate(
  db: Db | Tx,
  access: Access,
  vessel: VesselRef,
  stay: StayRow,
  input: PackageInput,
  now: Date,
): Promise<Evaluated> {
  const companyId = access.company.id;
  const ids = input.items.map((i) => i.workOrderId);
  const rows = ids.length
    ? await db
        .select(jobColumns)
        .from(workOrder)
        .innerJoin(component, eq(component.id, workOrder.componentId))
        .where(and(eq(workOrder.companyId, companyId), eq(workOrder.vesselId, vessel.id), inArray(workOrder.id, ids)))
    : [];
  const byId = new Map(rows.map((r) => [r.workOrderId, r]));
  const elsewhere = await packagedElsewhere(db, companyId, vessel.id, stay.id, now, ids);

  const problems: PackageProblem[] = [];
  // The items that pass the checks of their own, with their place in the input.
  const checkable: { n: number; item: PackageItem }[] = [];
  input.items.forEach((item, n) => {
    const w = byId.get(item.workOrderId);
    const refuse = (message: string) => problems.push({ item: n, field: "workOrderId", message });
    if (!w) return refuse("There is no such work order on this vessel.");
    if (w.state === "done") return refuse(`${w.number} is done already.`);
    const other = elsewhere.get(w.workOrderId);
    if (other) return refuse(`${w.number} is in the package of ${other.port} on ${other.date}; take it out there first.`);
    checkable.push({
      n,
      item: { job: planJobOf(toJob(w), w.outOfToleranceAt), start: instantOfShipDateTime(item.start, vessel.timeZone), people: item.people },
    });
  });
  const checked = checkPackage(
    planStayOf(stay, vessel.timeZone),
    checkable.map((c) => c.item),
    undefined,
    await loadRankNames(access.company.id),
  );
  for (const p of checked.problems) problems.push({ ...p, item: checkable[p.item]!.n });
  problems.sort((a, b) => a.item - b.item);

  const placed: (PlacedView | null)[] = input.items.map(() => null);
  checked.placed.forEach((p, k) => {
    if (!p) return;
    const { n } = checkable[k]!;
    const reason = input.items[n]!.reason || ADDED_BY_HAND;
    placed[n] = placedView(toJob(byId.get(input.items[n]!.workOrderId)!), p, vessel.timeZone, { reason, urgency: null });
  });
  return { placed, problems };
}

/** The package checked as the server would store it, for the timeline after a move. Writes nothing. */
export async function checkPackageDraft(
  access: Access,
  vessel: VesselRef,
  stayId: string,
  input: PackageInput,
  now = new Date(),
): Promise<PackageCheck> {
  const db = getDb();
  const stay = await findStay(db, access, vessel, stayId);
  const { placed, problems } = await evaluate(db, access, vessel, stay, input, now);
  return { items: placed.filter((p): p is PlacedView => p !== null), problems };
}

export async function acceptPackage(
  access: Access,
  vessel: VesselRef,
  stayId: string,
  input: PackageInput,
  now = new Date(),
): Promise<PackageResult> {
  const companyId = access.company.id;
  return getDb().transaction(async (tx) => {
    await lockVesselWorkOrders(tx, vessel.id);
    const stay = await findStay(tx, access, vessel, stayId);
    if (stay.departsAt <= now) {
      throw new AppError("conflict", `${stay.port} is over: its package can no longer be changed.`);
    }
    const { placed, problems } = await evaluate(tx, access, vessel, stay, input, now);
    if (problems.length) {
      const errors: FieldError[] = problems.map((p) => ({ field: `items.${p.item}.${p.field}`, row: p.item, message: p.message }));
      throw invalidInput(errors, errors.length === 1 ? undefined : `${errors.length} items of the package need correcting; nothing was saved.`);
    }
    const items = placed as PlacedView[];
    const dayOf = (iso: string) => shipDateTimeOf(new Date(iso), vessel.timeZone).slice(0, 10);

    // Work taken out of the package loses the planned date this stay gave it.
    const previous = await tx
      .select({ workOrderId: workPackageItem.workOrderId, date: workPackageItem.plannedDate })
      .from(workPackageItem)
      .where(and(eq(workPackageItem.companyId, companyId), eq(workPackageItem.portStayId, stay.id)));
    const keep = new Set(items.map((i) => i.workOrderId));
    const cleared = await clearPlannedDates(tx, companyId, previous.filter((p) => !keep.has(p.workOrderId)));

    await tx.delete(workPackageItem).where(and(eq(workPackageItem.companyId, companyId), eq(workPackageItem.portStayId, stay.id)));
    if (items.length) {
      await tx.insert(workPackageItem).values(
        items.map((item, position) => ({
          companyId,
          vesselId: vessel.id,
          portStayId: stay.id,
          workOrderId: item.workOrderId,
          plannedDate: dayOf(item.start),
          startsAt: new Date(item.start),
          endsAt: new Date(item.end),
          segments: item.segments,
          people: item.people,
          reason: item.reason,
          position,
        })),
      );
      for (const item of items) {
        await tx
          .update(workOrder)
          .set({ plannedDate: dayOf(item.start) })
          .where(and(eq(workOrder.companyId, companyId), eq(workOrder.id, item.workOrderId)));
      }
    }
    const [stamped] = await tx
      .update(portStay)
      .set({ packageAcceptedAt: now, packageAcceptedBy: access.user.id, updatedAt: now })
      .where(and(eq(portStay.companyId, companyId), eq(portStay.id, stay.id)))
      .returning({ at: portStay.packageAcceptedAt });
    return { acceptedAt: stamped!.at!.toISOString(), items: items.length, cleared };
  });
}
