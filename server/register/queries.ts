import "server-only";
import { and, asc, eq, max, sql } from "drizzle-orm";
import { getDb, type Tx } from "@/db/client";
import { component, counter, counterSegment, reading } from "@/db/schema";
import type { Access, VesselRef } from "@/server/auth/access";
import { can } from "@/server/auth/roles";
import { type FieldError, invalidInput } from "@/server/http/problem";
import type { ComponentChange, NewComponent, RegisterComponent, RegisterView } from "./contract";
import {
  checkCodeFree,
  checkReferences,
  componentScope,
  counterScope,
  lockRegister,
  noSuch,
  type RegisterScope,
} from "./register-scope";
import { resolveCounters, wouldCreateCycle } from "./tree";

/** The whole register of a vessel: every component with its effective counter, every counter. */
export async function loadRegister(access: Access, vessel: VesselRef, now = new Date()): Promise<RegisterView> {
  const db = getDb();
  const scope = { access, vessel };
  const components = await db
    .select({
      id: component.id,
      parentId: component.parentId,
      code: component.code,
      name: component.name,
      critical: component.critical,
      classItemRef: component.classItemRef,
      maker: component.maker,
      model: component.model,
      counterId: component.counterId,
      sortOrder: component.sortOrder,
    })
    .from(component)
    .where(componentScope(scope))
    .orderBy(asc(component.sortOrder), asc(component.code));

  const counters = await db
    .select({
      id: counter.id,
      name: counter.name,
      plannedHoursPerDay: counter.plannedHoursPerDay,
      runningRate: counter.runningRate,
      segment: counter.currentSegment,
      retiredAt: counter.retiredAt,
      segmentStartedAt: counterSegment.startedAt,
      lastAt: sql<Date | null>`last.read_at`,
      lastMeter: sql<string | null>`last.meter_value`,
      lastTotal: sql<string | null>`last.total_hours`,
    })
    .from(counter)
    .leftJoin(
      counterSegment,
      and(
        eq(counterSegment.companyId, counter.companyId),
        eq(counterSegment.counterId, counter.id),
        eq(counterSegment.segment, counter.currentSegment),
      ),
    )
    .leftJoin(
      sql`lateral (
        select r.read_at, r.meter_value, r.total_hours from ${reading} r
        where r.company_id = ${counter.companyId} and r.counter_id = ${counter.id} and r.segment = ${counter.currentSegment}
        order by r.read_at desc limit 1
      ) last`,
      sql`true`,
    )
    .where(counterScope(scope))
    .orderBy(asc(counter.sortOrder), asc(counter.name));

  const effective = resolveCounters(components);
  return {
    vessel: { id: vessel.id, name: vessel.name, code: vessel.code, timeZone: vessel.timeZone },
    now: now.toISOString(),
    canEdit: can(access.role, "register:edit"),
    components: components.map((c) => ({ ...c, effectiveCounter: effective.get(c.id) ?? { kind: "none" } })),
    counters: counters.map((c) => ({
      id: c.id,
      name: c.name,
      plannedHoursPerDay: c.plannedHoursPerDay,
      runningRate: c.runningRate,
      segment: c.segment,
      segmentStartedAt: c.segmentStartedAt?.toISOString() ?? null,
      retiredAt: c.retiredAt?.toISOString() ?? null,
      last:
        c.lastAt === null
          ? null
          : {
              readAt: new Date(c.lastAt).toISOString(),
              meterValue: Number(c.lastMeter),
              totalHours: Number(c.lastTotal),
            },
      usedBy: components.filter((u) => u.counterId === c.id).map(({ id, code, name }) => ({ id, code, name })),
    })),
  };
}

type ComponentRow = typeof component.$inferSelect;

function toView(row: ComponentRow): Omit<RegisterComponent, "effectiveCounter"> {
  const { id, parentId, code, name, critical, classItemRef, maker, model, counterId, sortOrder } = row;
  return { id, parentId, code, name, critical, classItemRef, maker, model, counterId, sortOrder };
}

async function nextSortOrder(tx: Tx, scope: RegisterScope): Promise<number> {
  const [row] = await tx
    .select({ last: max(component.sortOrder) })
    .from(component)
    .where(componentScope(scope));
  return (row?.last ?? -1) + 1;
}

/** Adds a component; it comes last among its new siblings. */
export async function createComponent(
  access: Access,
  vessel: VesselRef,
  input: NewComponent,
): Promise<Omit<RegisterComponent, "effectiveCounter">> {
  const scope = { access, vessel };
  return getDb().transaction(async (tx) => {
    await lockRegister(tx, vessel);
    const errors: FieldError[] = [];
    await checkCodeFree(tx, scope, input.code, null, errors);
    await checkReferences(tx, scope, input, errors);
    if (errors.length) throw invalidInput(errors);

    const [row] = await tx
      .insert(component)
      .values({
        companyId: access.company.id,
        vesselId: vessel.id,
        code: input.code,
        name: input.name,
        parentId: input.parentId,
        critical: input.critical,
        classItemRef: input.classItemRef ?? null,
        counterId: input.counterId,
        maker: input.maker ?? null,
        model: input.model ?? null,
        sortOrder: await nextSortOrder(tx, scope),
      })
      .returning();
    return toView(row!);
  });
}

/**
 * Edits a component, or moves it when `parentId` is sent. A move under the component itself or
 * anything below it is refused: the register is a tree, and a loop would hide the components on it.
 */
export async function updateComponent(
  access: Access,
  vessel: VesselRef,
  componentId: string,
  change: ComponentChange,
  now = new Date(),
): Promise<Omit<RegisterComponent, "effectiveCounter">> {
  const scope = { access, vessel };
  return getDb().transaction(async (tx) => {
    await lockRegister(tx, vessel);
    const [current] = await tx
      .select()
      .from(component)
      .where(and(componentScope(scope), eq(component.id, componentId)));
    if (!current) throw noSuch("component", vessel);

    const errors: FieldError[] = [];
    if (change.code !== undefined && change.code !== current.code) {
      await checkCodeFree(tx, scope, change.code, current.id, errors);
    }
    await checkReferences(tx, scope, change, errors);
    const moves = change.parentId !== undefined && change.parentId !== current.parentId;
    if (moves && change.parentId && !errors.some((e) => e.field === "parentId")) {
      const rows = await tx
        .select({
          id: component.id,
          parentId: component.parentId,
          code: component.code,
          counterId: component.counterId,
        })
        .from(component)
        .where(componentScope(scope));
      if (wouldCreateCycle(rows, current.id, change.parentId)) {
        const target = rows.find((r) => r.id === change.parentId);
        errors.push({
          field: "parentId",
          message:
            change.parentId === current.id
              ? `${current.code} can’t be put under itself.`
              : `${current.code} can’t be put under ${target?.code ?? "that component"}: ${target?.code ?? "it"} is part of ${current.code}.`,
        });
      }
    }
    if (errors.length) throw invalidInput(errors);

    const [row] = await tx
      .update(component)
      .set({
        code: change.code,
        name: change.name,
        parentId: change.parentId,
        critical: change.critical,
        classItemRef: change.classItemRef,
        counterId: change.counterId,
        maker: change.maker,
        model: change.model,
        // A moved component comes last among its new siblings, where the person moving it looks.
        sortOrder: moves ? await nextSortOrder(tx, scope) : undefined,
        updatedAt: now,
      })
      .where(and(componentScope(scope), eq(component.id, current.id)))
      .returning();
    return toView(row!);
  });
}
