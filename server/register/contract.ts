// The machinery register's input and output, shared by the page's forms and the route handlers.
import { z } from "zod";
import { optionalText, requiredText } from "@/server/http/text-fields";
import { enteredDay } from "@/server/http/dates";
import { MeterValue, SHIP_DAY_FORMAT, ShipClock } from "@/server/readings/contract";
import type { EffectiveCounter } from "./tree";

/** The database's own check on component codes (db/schema/machinery.ts, component_code_format). */
export const COMPONENT_CODE_PATTERN = /^[A-Z0-9][A-Z0-9._-]{0,39}$/;

/** A component code as typed: "me.cyl.3" is stored as "ME.CYL.3". */
export const ComponentCode = z
  .string({ message: "Enter a code for the component, e.g. ME.CYL.3." })
  .trim()
  .toUpperCase()
  .superRefine((code, ctx) => {
    const message = !code
      ? "Enter a code for the component, e.g. ME.CYL.3."
      : code.length > 40
        ? `The code is ${code.length} characters long; keep it to 40 or fewer.`
        : !COMPONENT_CODE_PATTERN.test(code)
          ? "The code may hold only letters, digits and . _ - and must start with a letter or digit (e.g. ME.CYL.3)."
          : null;
    if (message) ctx.addIssue({ code: "custom", message });
  });

/** Text that may be left empty: an empty field is stored as no value; `undefined` leaves it as it is. */
function optionalStoredText(what: string, max: number) {
  return optionalText(what, max).transform((v) => (v === undefined ? undefined : v || null));
}

const ComponentId = (what: string) => z.uuid({ message: `The ${what} is not a component of this register.` });
const CounterId = z.uuid({ message: "The counter is not one of this vessel’s counters." });

const componentFields = {
  code: ComponentCode,
  name: requiredText("component’s name", 120),
  parentId: ComponentId("parent").nullable(),
  critical: z.boolean({ message: "Critical must be yes or no." }),
  classItemRef: optionalStoredText("class item reference", 40),
  counterId: CounterId.nullable(),
  maker: optionalStoredText("maker", 80),
  model: optionalStoredText("model", 80),
};

export const ComponentInput = z.object({
  ...componentFields,
  parentId: componentFields.parentId.default(null),
  critical: componentFields.critical.default(false),
  counterId: componentFields.counterId.default(null),
});
export type ComponentInput = z.input<typeof ComponentInput>;
export type NewComponent = z.output<typeof ComponentInput>;

/** Edit and move: only the fields sent are changed. `parentId: null` moves to the top level. */
export const ComponentPatch = z
  .object(componentFields)
  .partial()
  .refine((patch) => Object.values(patch).some((v) => v !== undefined), {
    message: "Nothing to change: send at least one field of the component.",
  });
export type ComponentPatchInput = z.input<typeof ComponentPatch>;

/** The move form's part of a patch: the new parent, or null for the top level. */
export const ComponentMove = z.object({ parentId: componentFields.parentId });
export type ComponentChange = z.output<typeof ComponentPatch>;

/** Planned running hours per day, as typed: 0 to 24 with at most one decimal. */
export const PlannedHoursPerDay = z
  .union([z.number(), z.string()], {
    message: "Enter the planned running hours per day, from 0 to 24.",
  })
  .transform((raw, ctx) => {
    const text = typeof raw === "number" ? String(raw) : raw.trim().replace(",", ".");
    const value = Number(text);
    if (!/^\d+(\.\d)?$/.test(text) || value > 24) {
      ctx.addIssue({
        code: "custom",
        message: "Planned hours per day must be from 0 to 24, with at most one decimal (e.g. 18 or 0.5).",
      });
      return z.NEVER;
    }
    return value;
  });

const counterFields = {
  name: requiredText("counter’s name", 80),
  plannedHoursPerDay: PlannedHoursPerDay,
};

export const CounterInput = z.object(counterFields);
export type CounterInput = z.input<typeof CounterInput>;
export type NewCounter = z.output<typeof CounterInput>;

export const CounterPatch = z
  .object(counterFields)
  .partial()
  .refine((patch) => Object.values(patch).some((v) => v !== undefined), {
    message: "Nothing to change: send the counter’s name or planned hours per day.",
  });
export type CounterPatchInput = z.input<typeof CounterPatch>;
export type CounterChange = z.output<typeof CounterPatch>;

/** A meter value whose messages say which meter value is wrong; an empty field gives `whenEmpty`. */
function namedMeterValue<E extends number | null>(what: string, whenEmpty: E) {
  const What = `${what[0]!.toUpperCase()}${what.slice(1)}`;
  return z
    .union([z.number(), z.string(), z.null()], { message: `${What}: enter it in hours.` })
    .optional()
    .transform((raw, ctx): number | E => {
      if (raw === undefined || raw === null || (typeof raw === "string" && !raw.trim())) return whenEmpty;
      const parsed = MeterValue.safeParse(raw);
      if (parsed.success) return parsed.data;
      const reason = parsed.error.issues[0]?.message ?? "Enter hours with at most one decimal.";
      ctx.addIssue({ code: "custom", message: `${What}: ${reason[0]!.toLowerCase()}${reason.slice(1)}` });
      return z.NEVER;
    });
}

export const MeterReplacementInput = z.object({
  /** When the new meter was fitted, on the ship's clock. */
  replacedAt: z.object(
    { shipDay: enteredDay("recorded", "The day the meter was replaced", SHIP_DAY_FORMAT), time: ShipClock },
    { message: "Give the ship’s day and time when the meter was replaced." },
  ),
  /** What the old meter showed when it came off; null when it could not be read. */
  oldMeterFinal: namedMeterValue("final value on the old meter", null),
  newMeterStart: namedMeterValue("value shown by the new meter", 0),
  reason: requiredText("reason for the replacement", 500),
});
export type MeterReplacementInput = z.input<typeof MeterReplacementInput>;
export type MeterReplacement = z.output<typeof MeterReplacementInput>;

export type RegisterComponent = {
  id: string;
  parentId: string | null;
  code: string;
  name: string;
  critical: boolean;
  classItemRef: string | null;
  maker: string | null;
  model: string | null;
  counterId: string | null;
  sortOrder: number;
  effectiveCounter: EffectiveCounter;
};

export type RegisterCounter = {
  id: string;
  name: string;
  plannedHoursPerDay: number;
  /** The worker's running rate in hours a day (full precision); null before it has one. */
  runningRate: number | null;
  /** The meter fitted now: 1 for the first, 2 after one replacement, … */
  segment: number;
  /** When the meter fitted now was fitted; null for a counter's first meter. */
  segmentStartedAt: string | null;
  retiredAt: string | null;
  /** Latest reading of the meter fitted now. */
  last: { readAt: string; meterValue: number; totalHours: number } | null;
  /** Components whose own counter this is (those below them inherit it). */
  usedBy: { id: string; code: string; name: string }[];
};

export type RegisterView = {
  vessel: { id: string; name: string; code: string; timeZone: string };
  now: string;
  canEdit: boolean;
  components: RegisterComponent[];
  counters: RegisterCounter[];
};

export type MeterReplacementResult = {
  segment: number;
  startedAt: string;
  startMeter: number;
  offsetHours: number;
  /** Whether the old meter's final value was stored as its last reading. */
  finalReadingStored: boolean;
};
