// A tolerance rule between its pure form (server/scheduling/tolerance.ts) and its table row: the
// one place both directions are written, for the worker, the admin pages and the seed.
import type { toleranceRule } from "@/db/schema";
import { TOLERANCE_PRESETS } from "@/server/scheduling/presets";
import type { ToleranceRule } from "@/server/scheduling/tolerance";

export type ToleranceRuleRow = typeof toleranceRule.$inferSelect;

type RuleFields = Omit<ToleranceRule, "id" | "capHours"> & { capHours?: number | null };

export function toleranceRuleColumns(rule: RuleFields) {
  return {
    name: rule.name,
    kind: rule.kind,
    minInterval: rule.minInterval,
    maxInterval: rule.maxInterval,
    windowBeforeValue: rule.windowBefore.value,
    windowBeforeUnit: rule.windowBefore.unit,
    graceAfterValue: rule.graceAfter.value,
    graceAfterUnit: rule.graceAfter.unit,
    // A cap only means something on an hours rule; the contract refuses one elsewhere.
    capHours: rule.capHours ?? null,
    keepsAnniversary: rule.keepsAnniversary,
    graceOnTime: rule.graceOnTime ?? false,
  };
}

export function toleranceRuleFromRow(r: ToleranceRuleRow): ToleranceRule {
  return {
    id: r.id,
    name: r.name,
    kind: r.kind,
    minInterval: r.minInterval,
    maxInterval: r.maxInterval,
    windowBefore: { value: r.windowBeforeValue, unit: r.windowBeforeUnit },
    graceAfter: { value: r.graceAfterValue, unit: r.graceAfterUnit },
    ...(r.capHours !== null ? { capHours: r.capHours } : {}),
    keepsAnniversary: r.keepsAnniversary,
    ...(r.graceOnTime ? { graceOnTime: true } : {}),
  };
}

/** The row of preset number `index` for a company, in the presets' own order. */
export function presetRow(companyId: string, index: number) {
  return { companyId, ...toleranceRuleColumns(TOLERANCE_PRESETS[index]!), sortOrder: index };
}
