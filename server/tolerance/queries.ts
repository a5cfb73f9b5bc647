import "server-only";
import { and, asc, eq, isNull, sql } from "drizzle-orm";
import { type Db, getDb, type Tx } from "@/db/client";
import { routine, toleranceRule, vessel } from "@/db/schema";
import type { Access } from "@/server/auth/access";
import { AppError, fieldErrorsFromZod, invalidInput } from "@/server/http/problem";
import { requestRecompute } from "@/server/jobs/recompute-vessel";
import { TOLERANCE_PRESETS } from "@/server/scheduling/presets";
import {
  type AdminToleranceRule,
  type RestoredPresets,
  type ToleranceRuleChanges,
  ToleranceRuleInput,
  type ToleranceRuleValues,
} from "./contract";
import { presetRow, toleranceRuleColumns, type ToleranceRuleRow } from "./rows";

// The company administrator's tolerance rules: every query is scoped by the administrator's company.
// Work-order states depend on the rules, so every change asks the worker to recompute each vessel.

function toAdminRule(r: ToleranceRuleRow, overridingRoutines: number): AdminToleranceRule {
  return {
    id: r.id,
    name: r.name,
    kind: r.kind,
    minInterval: r.minInterval,
    maxInterval: r.maxInterval,
    windowBefore: { value: r.windowBeforeValue, unit: r.windowBeforeUnit },
    graceAfter: { value: r.graceAfterValue, unit: r.graceAfterUnit },
    capHours: r.capHours,
    keepsAnniversary: r.keepsAnniversary,
    graceOnTime: r.graceOnTime,
    overridingRoutines,
  };
}

export async function listToleranceRules(access: Access, onlyId?: string): Promise<AdminToleranceRule[]> {
  const rows = await getDb()
    .select({
      rule: toleranceRule,
      // `${toleranceRule}.id`, not `${toleranceRule.id}`: in a one-table select Drizzle writes the
      // column unqualified, and inside the subquery a bare "id" is the routine's own id.
      overriding: sql<number>`(select count(*)::int from ${routine} r where r.company_id = ${toleranceRule}.company_id and r.tolerance_rule_id = ${toleranceRule}.id and r.retired_at is null)`,
    })
    .from(toleranceRule)
    .where(and(eq(toleranceRule.companyId, access.company.id), onlyId ? eq(toleranceRule.id, onlyId) : undefined))
    .orderBy(asc(toleranceRule.kind), asc(toleranceRule.sortOrder), asc(toleranceRule.minInterval));
  return rows.map((r) => toAdminRule(r.rule, r.overriding));
}

async function loadRule(access: Access, ruleId: string): Promise<AdminToleranceRule> {
  const [found] = await listToleranceRules(access, ruleId);
  if (!found) throw new AppError("not-found", "No such tolerance rule.");
  return found;
}

async function assertUniqueName(tx: Db | Tx, companyId: string, name: string, selfId?: string): Promise<void> {
  const [clash] = await tx
    .select({ id: toleranceRule.id })
    .from(toleranceRule)
    .where(and(eq(toleranceRule.companyId, companyId), sql`lower(${toleranceRule.name}) = lower(${name})`));
  if (clash && clash.id !== selfId) {
    throw invalidInput([{ field: "name", message: `The company already has a rule named “${name}”.` }]);
  }
}

/**
 * Every vessel's work-order states may move with a rule; retired vessels have no open work. Sent
 * in the rule's transaction, in vessel id order (two writers asking for several vessels in one
 * order cannot deadlock on the queue's per-vessel key).
 */
async function recomputeCompany(tx: Tx, companyId: string): Promise<void> {
  const vessels = await tx
    .select({ id: vessel.id })
    .from(vessel)
    .where(and(eq(vessel.companyId, companyId), isNull(vessel.retiredAt)))
    .orderBy(asc(vessel.id));
  for (const v of vessels) await requestRecompute(tx, companyId, v.id);
}

/**
 * A company with no rule saved is scheduled with the presets (work-order-writer.ts). Its first own
 * rule would end that silently, so the presets are saved alongside it: the administrator then
 * sees and changes what the worker really uses.
 */
async function savePresetsIfNone(tx: Tx, companyId: string): Promise<void> {
  const [any] = await tx
    .select({ id: toleranceRule.id })
    .from(toleranceRule)
    .where(eq(toleranceRule.companyId, companyId))
    .limit(1);
  if (!any) await tx.insert(toleranceRule).values(TOLERANCE_PRESETS.map((_, i) => presetRow(companyId, i)));
}

export async function createToleranceRule(access: Access, values: ToleranceRuleValues): Promise<AdminToleranceRule> {
  const db = getDb();
  const companyId = access.company.id;
  const id = await db.transaction(async (tx) => {
    await savePresetsIfNone(tx, companyId);
    await assertUniqueName(tx, companyId, values.name);
    const [last] = await tx
      .select({ max: sql<number>`coalesce(max(${toleranceRule.sortOrder}), -1)::int` })
      .from(toleranceRule)
      .where(eq(toleranceRule.companyId, companyId));
    const [row] = await tx
      .insert(toleranceRule)
      .values({ companyId, ...toleranceRuleColumns(values), sortOrder: (last?.max ?? -1) + 1 })
      .returning({ id: toleranceRule.id });
    await recomputeCompany(tx, companyId);
    return row!.id;
  });
  return loadRule(access, id);
}

export async function updateToleranceRule(
  access: Access,
  ruleId: string,
  changes: ToleranceRuleChanges,
): Promise<AdminToleranceRule> {
  const db = getDb();
  const companyId = access.company.id;
  const current = await loadRule(access, ruleId);
  const { id: _id, overridingRoutines: _overriding, ...stored } = current;
  // The rule as it will be, checked whole: a new kind must come with units of that kind.
  const merged = ToleranceRuleInput.safeParse({ ...stored, ...changes });
  if (!merged.success) throw invalidInput(fieldErrorsFromZod(merged.error));
  const values = merged.data;
  await db.transaction(async (tx) => {
    await assertUniqueName(tx, companyId, values.name, ruleId);
    await tx
      .update(toleranceRule)
      .set({ ...toleranceRuleColumns(values), updatedAt: new Date() })
      .where(and(eq(toleranceRule.companyId, companyId), eq(toleranceRule.id, ruleId)));
    await recomputeCompany(tx, companyId);
  });
  return loadRule(access, ruleId);
}

/**
 * Deleting a rule that routines chose by hand would quietly put them back on matching (the
 * foreign key sets null): the administrator is told which routines to change first.
 */
export async function deleteToleranceRule(access: Access, ruleId: string): Promise<{ deleted: string }> {
  const companyId = access.company.id;
  const rule = await loadRule(access, ruleId);
  const db = getDb();
  await db.transaction(async (tx) => {
    const users = await tx
      .select({ title: routine.title })
      .from(routine)
      .where(and(eq(routine.companyId, companyId), eq(routine.toleranceRuleId, ruleId), isNull(routine.retiredAt)))
      .orderBy(asc(routine.title));
    if (users.length) {
      const titles = users.map((u) => u.title);
      const shown = titles.slice(0, 10).join(", ") + (titles.length > 10 ? ` and ${titles.length - 10} more` : "");
      throw new AppError(
        "conflict",
        `“${rule.name}” is chosen on ${titles.length === 1 ? "a routine" : `${titles.length} routines`}: ${shown}. Choose another rule on ${titles.length === 1 ? "it" : "them"} first.`,
      );
    }
    await tx.delete(toleranceRule).where(and(eq(toleranceRule.companyId, companyId), eq(toleranceRule.id, ruleId)));
    await recomputeCompany(tx, companyId);
  });
  return { deleted: rule.name };
}

/** Puts back every preset whose name the company no longer has; changed presets stay as they are. */
export async function restoreTolerancePresets(access: Access): Promise<RestoredPresets> {
  const companyId = access.company.id;
  const db = getDb();
  const restored = await db.transaction(async (tx) => {
    const names = new Set(
      (
        await tx.select({ name: toleranceRule.name }).from(toleranceRule).where(eq(toleranceRule.companyId, companyId))
      ).map((r) => r.name.toLowerCase()),
    );
    const missing = TOLERANCE_PRESETS.flatMap((p, i) => (names.has(p.name.toLowerCase()) ? [] : [i]));
    if (missing.length) {
      await tx
        .insert(toleranceRule)
        .values(missing.map((i) => presetRow(companyId, i)))
        // Two administrators restoring at once: the second finds the names taken and adds nothing.
        .onConflictDoNothing();
      await recomputeCompany(tx, companyId);
    }
    return missing.map((i) => TOLERANCE_PRESETS[i]!.name);
  });
  return { restored, rules: await listToleranceRules(access) };
}
