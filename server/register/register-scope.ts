// What every write to a vessel's register shares: the lock that puts writes one after the other,
// the look-ups that check a referenced component or counter belongs to this vessel, and the
// mapping of the database's own constraints to messages a person can act on.
import "server-only";
import { and, eq, sql } from "drizzle-orm";
import type { Tx } from "@/db/client";
import { component, counter } from "@/db/schema";
import type { Access, VesselRef } from "@/server/auth/access";
import { formatShipDate } from "@/server/format/hours";
import { AppError, type FieldError } from "@/server/http/problem";

export type RegisterScope = { access: Access; vessel: VesselRef };

/**
 * Register writes of one vessel wait for each other, so that two moves made at the same moment
 * cannot together build a loop that neither would alone, and a checked code stays free until the
 * insert.
 */
export async function lockRegister(tx: Tx, vessel: VesselRef): Promise<void> {
  await tx.execute(sql`select pg_advisory_xact_lock(hashtextextended(${`register:${vessel.id}`}, 0))`);
}

export function componentScope({ access, vessel }: RegisterScope) {
  return and(eq(component.companyId, access.company.id), eq(component.vesselId, vessel.id));
}

export function counterScope({ access, vessel }: RegisterScope) {
  return and(eq(counter.companyId, access.company.id), eq(counter.vesselId, vessel.id));
}

/** An id in a body that names another vessel's (or company's) component or counter is bad input. */
export async function checkReferences(
  tx: Tx,
  scope: RegisterScope,
  refs: { parentId?: string | null; counterId?: string | null },
  errors: FieldError[],
): Promise<void> {
  const where = scope.vessel.name;
  if (refs.parentId) {
    const [parent] = await tx
      .select({ id: component.id })
      .from(component)
      .where(and(componentScope(scope), eq(component.id, refs.parentId)));
    if (!parent) errors.push({ field: "parentId", message: `There is no such component on ${where} to put it under.` });
  }
  if (refs.counterId) {
    const [found] = await tx
      .select({ name: counter.name, retiredAt: counter.retiredAt })
      .from(counter)
      .where(and(counterScope(scope), eq(counter.id, refs.counterId)));
    if (!found) errors.push({ field: "counterId", message: `There is no such counter on ${where}.` });
    else if (found.retiredAt) {
      errors.push({
        field: "counterId",
        message: `The counter ${found.name} was retired on ${formatShipDate(found.retiredAt, scope.vessel.timeZone)}; choose a counter in use.`,
      });
    }
  }
}

/** The message for a code already in use, naming the component that holds it. */
export async function checkCodeFree(
  tx: Tx,
  scope: RegisterScope,
  code: string,
  exceptId: string | null,
  errors: FieldError[],
): Promise<void> {
  const [holder] = await tx
    .select({ id: component.id, name: component.name })
    .from(component)
    .where(and(componentScope(scope), eq(component.code, code)));
  if (holder && holder.id !== exceptId) {
    errors.push({ field: "code", message: `${code} is already used on this vessel by ${holder.name}.` });
  }
}

export function noSuch(what: "component" | "counter", vessel: VesselRef): AppError {
  return new AppError("not-found", `There is no such ${what} on ${vessel.name}.`);
}
