// What the company administrator sends and gets back for the company's tolerance rules, shared by
// the form (react-hook-form + zod) and the route handlers. The rule itself and its checks are in
// server/scheduling/tolerance.ts; this adds the limits of the stored columns and the wording.
import { z } from "zod";
import {
  type ToleranceKind,
  type ToleranceRule,
  toleranceRuleProblems,
  type ToleranceUnit,
} from "@/server/scheduling/tolerance";

export const TOLERANCE_KINDS = ["hours", "calendar"] as const satisfies readonly ToleranceKind[];
export const TOLERANCE_UNITS = ["days", "months", "hours", "percent"] as const satisfies readonly ToleranceUnit[];

/**
 * The units a company may choose per kind. Narrower than the scheduler accepts: a calendar window
 * in percent of the interval is not how class or makers state calendar tolerances, so the form
 * offers days and months only.
 */
export const UNITS_FOR_KIND: Record<ToleranceKind, readonly ToleranceUnit[]> = {
  hours: ["hours", "percent"],
  calendar: ["days", "months"],
};

/** The interval sizes are numeric(10,1) and the spans numeric(8,2) in the table. */
const MAX_INTERVAL = 99_999_999;
const MAX_SPAN = 999_999;

const Span = (label: string) =>
  z.object({
    value: z
      .number({ message: `${label}: give a number.` })
      .min(0, { message: `${label}: give 0 or more.` })
      .max(MAX_SPAN, { message: `${label}: at most ${MAX_SPAN}.` }),
    unit: z.enum(TOLERANCE_UNITS, { message: `${label}: pick days, months, hours or percent.` }),
  });

const Interval = (label: string) =>
  z
    .number({ message: `${label}: give a number.` })
    .min(0, { message: `${label}: give 0 or more.` })
    .max(MAX_INTERVAL, { message: `${label}: at most ${MAX_INTERVAL}.` });

const ruleFields = {
  name: z
    .string({ message: "Give the rule a name." })
    .trim()
    .min(1, { message: "Give the rule a name." })
    .max(120, { message: "Keep the name to 120 characters." }),
  kind: z.enum(TOLERANCE_KINDS, { message: "Pick running hours or calendar." }),
  minInterval: Interval("Smallest interval"),
  maxInterval: Interval("Largest interval"),
  windowBefore: Span("Window before"),
  graceAfter: Span("Grace after"),
  capHours: z
    .number({ message: "Cap: give a number of hours." })
    .positive({ message: "Cap: give a number of hours above 0." })
    .max(MAX_INTERVAL, { message: `Cap: at most ${MAX_INTERVAL} hours.` })
    .nullable()
    .optional(),
  keepsAnniversary: z.boolean({ message: "Keeps the anniversary is true or false." }),
  /** Left out on a new rule: false. */
  graceOnTime: z.boolean({ message: "On time through the grace is true or false." }).optional(),
};

type RuleFields = z.output<z.ZodObject<typeof ruleFields>>;

/** The same checks the scheduler relies on, each on the field it names, plus the units per kind. */
function checkRule(rule: RuleFields, ctx: z.RefinementCtx): void {
  for (const field of ["windowBefore", "graceAfter"] as const) {
    if (!UNITS_FOR_KIND[rule.kind].includes(rule[field].unit)) {
      ctx.addIssue({
        code: "custom",
        path: [field, "unit"],
        message: `${field === "windowBefore" ? "Window before" : "Grace after"}: a ${
          rule.kind === "hours" ? "running-hours" : "calendar"
        } rule counts in ${UNITS_FOR_KIND[rule.kind].join(" or ")}.`,
      });
    }
  }
  const { capHours, ...rest } = rule;
  const candidate: ToleranceRule = { ...rest, id: "", ...(capHours == null ? {} : { capHours }) };
  for (const problem of toleranceRuleProblems(candidate)) {
    // The unit check above says it in the form's words.
    if (problem.field.endsWith(".unit")) continue;
    ctx.addIssue({ code: "custom", path: problem.field.split("."), message: problem.message });
  }
}

export const ToleranceRuleFields = z.object(ruleFields);

export const ToleranceRuleInput = ToleranceRuleFields.superRefine(checkRule);
export type ToleranceRuleInput = z.input<typeof ToleranceRuleInput>;
export type ToleranceRuleValues = z.output<typeof ToleranceRuleInput>;

/** A PATCH sends only what changes; the merged rule is checked with ToleranceRuleInput. */
export const ToleranceRulePatch = ToleranceRuleFields.partial();
export type ToleranceRulePatch = z.input<typeof ToleranceRulePatch>;
export type ToleranceRuleChanges = z.output<typeof ToleranceRulePatch>;

export type AdminToleranceRule = {
  id: string;
  name: string;
  kind: ToleranceKind;
  minInterval: number;
  maxInterval: number;
  windowBefore: { value: number; unit: ToleranceUnit };
  graceAfter: { value: number; unit: ToleranceUnit };
  capHours: number | null;
  keepsAnniversary: boolean;
  graceOnTime: boolean;
  /** Routines that chose this rule over the matched one. */
  overridingRoutines: number;
};

export type AdminToleranceRuleList = { rules: AdminToleranceRule[] };

export type RestoredPresets = { restored: string[]; rules: AdminToleranceRule[] };
