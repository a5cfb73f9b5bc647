// Every number a person sends must fit the column it is stored in, decided by the contract: a
// value the contract accepts but the column cannot hold reaches PostgreSQL as "numeric field
// overflow", a 500 instead of a 422 naming the field. Each pair below probes the contract with
// zod at its highest and lowest accepted value and one step beyond, and checks the highest fits
// the column's precision and scale as Drizzle declares them (not copied here). The last test
// lists every numeric and integer column of the tables the contracts write: a column must be in
// a pair or in EXEMPT with the reason no person's number reaches it, so a new column is noticed.
import { getTableColumns, is } from "drizzle-orm";
import { PgInteger, PgNumeric, PgNumericNumber, type PgColumn, type PgTable } from "drizzle-orm/pg-core";
import { describe, expect, it } from "vitest";
import type { z } from "zod";
import * as s from "@/db/schema";
import { CompletionInput } from "@/server/completions/contract";
import { DeferralRequestInput } from "@/server/deferrals/contract";
import { fieldErrorsFromZod } from "@/server/http/problem";
import { ReadingBatchInput, ReadingCorrectionInput } from "@/server/readings/contract";
import { CounterInput, MeterReplacementInput } from "@/server/register/contract";
import { RoutineInput } from "@/server/routines/contract";
import { ToleranceRuleInput } from "@/server/tolerance/contract";

type Pair = {
  column: PgColumn;
  schema: z.ZodType;
  /** The field as the 422 names it, e.g. "entries.0.value". */
  field: string;
  /** Builds the input around the value (default: `{ [field]: value }`). */
  input?: (value: number) => unknown;
  max: number;
  /** The lowest value accepted and the next one below, which is refused. */
  lowest: [number, number];
};

const nested = (outer: string, inner: string) => (value: number) => ({ [outer]: { [inner]: value } });

const PAIRS: Pair[] = [
  { column: s.completion.manHours, schema: CompletionInput, field: "manHours", max: 9_999, lowest: [0.1, 0] },
  {
    column: s.completion.counterHours,
    schema: CompletionInput,
    field: "counterHours",
    max: 9_999_999.9,
    lowest: [0, -1],
  },
  { column: s.routine.intervalHours, schema: RoutineInput, field: "intervalHours", max: 9_999_999.9, lowest: [0.1, 0] },
  {
    column: s.routine.estimatedManHours,
    schema: RoutineInput,
    field: "estimatedManHours",
    max: 9_999,
    lowest: [0, -1],
  },
  { column: s.routine.baselineHours, schema: RoutineInput, field: "baselineHours", max: 9_999_999.9, lowest: [0, -1] },
  { column: s.routine.elapsedHours, schema: RoutineInput, field: "elapsedHours", max: 500, lowest: [0.1, 0] },
  { column: s.routine.portEventHours, schema: RoutineInput, field: "portEventHours", max: 72, lowest: [0.1, 0] },
  {
    column: s.deferral.proposedDueHours,
    schema: DeferralRequestInput,
    field: "proposedDueHours",
    max: 9_999_999.9,
    lowest: [0.1, 0],
  },
  // An approved deferral copies its proposed hours onto the work order.
  {
    column: s.workOrder.deferredDueHours,
    schema: DeferralRequestInput,
    field: "proposedDueHours",
    max: 9_999_999.9,
    lowest: [0.1, 0],
  },
  {
    column: s.reading.meterValue,
    schema: ReadingBatchInput,
    field: "entries.0.value",
    input: (value) => ({ entries: [{ value }] }),
    max: 9_999_999.9,
    lowest: [0, -1],
  },
  {
    column: s.readingCorrection.newMeterValue,
    schema: ReadingCorrectionInput,
    field: "value",
    max: 9_999_999.9,
    lowest: [0, -1],
  },
  {
    column: s.counter.plannedHoursPerDay,
    schema: CounterInput,
    field: "plannedHoursPerDay",
    max: 24,
    lowest: [0, -0.1],
  },
  {
    column: s.counterSegment.startMeter,
    schema: MeterReplacementInput,
    field: "newMeterStart",
    max: 9_999_999.9,
    lowest: [0, -1],
  },
  {
    column: s.toleranceRule.minInterval,
    schema: ToleranceRuleInput,
    field: "minInterval",
    max: 99_999_999,
    lowest: [0, -0.1],
  },
  {
    column: s.toleranceRule.maxInterval,
    schema: ToleranceRuleInput,
    field: "maxInterval",
    max: 99_999_999,
    lowest: [0, -0.1],
  },
  {
    column: s.toleranceRule.windowBeforeValue,
    schema: ToleranceRuleInput,
    field: "windowBefore.value",
    input: nested("windowBefore", "value"),
    max: 999_999,
    lowest: [0, -0.01],
  },
  {
    column: s.toleranceRule.graceAfterValue,
    schema: ToleranceRuleInput,
    field: "graceAfter.value",
    input: nested("graceAfter", "value"),
    max: 999_999,
    lowest: [0, -0.01],
  },
  {
    column: s.toleranceRule.capHours,
    schema: ToleranceRuleInput,
    field: "capHours",
    max: 99_999_999,
    lowest: [0.1, 0],
  },
];

/** Numeric and integer columns no person's number is written to, each with the reason. */
const EXEMPT: Record<string, string> = {
  "reading.segment": "the counter's current segment, read from the counter",
  "reading.totalHours": "computed: the segment's offset plus the meter value",
  "reading_correction.segment": "copied from the reading corrected",
  "reading_correction.oldMeterValue": "copied from the reading corrected",
  "counter.currentSegment": "counted by meter replacements",
  "counter.sortOrder": "the counter's place in the list, set by the server",
  "counter.runningRate": "computed by the worker from readings",
  "counter_segment.segment": "counted by meter replacements",
  "counter_segment.offsetHours": "computed from the old meter's final value and the offsets before it",
  "routine.revision": "counted by edits",
  "tolerance_rule.sortOrder": "the rule's place in the list, set by the server",
  "work_package_item.position": `the item's index in the package, below the contract's item limit`,
  "work_order.occurrence": "counted by the due engine",
  "work_order.dueHours": "computed by the due engine from the routine",
  "work_order.windowOpensHours": "computed by the due engine",
  "work_order.graceEndsHours": "computed by the due engine",
  "work_order.remainingHours": "computed by the due engine",
  "work_order.remainingDays": "computed by the due engine",
  "work_order.estimatedManHours": "copied from the routine's estimate (paired above)",
  "work_order.elapsedHours": "copied from the routine's team (paired above)",
  "work_order.portEventHours": "copied from the routine (paired above)",
};

const TABLES: PgTable[] = [
  s.completion,
  s.counter,
  s.counterSegment,
  s.deferral,
  s.portStay,
  s.reading,
  s.readingCorrection,
  s.routine,
  s.toleranceRule,
  s.workOrder,
  s.workPackageItem,
];

function accepts(pair: Pair, value: number): boolean {
  const result = pair.schema.safeParse(pair.input ? pair.input(value) : { [pair.field]: value });
  return result.success || !fieldErrorsFromZod(result.error).some((e) => e.field === pair.field);
}

/** The largest magnitude the column holds: numeric(p, s) → 10^(p−s) − 10^−s; integer → 2^31 − 1. */
function columnLimit(column: PgColumn): { limit: number; scale: number } {
  if (is(column, PgNumericNumber) || is(column, PgNumeric)) {
    const { precision, scale = 0 } = column;
    if (precision === undefined) return { limit: Number.POSITIVE_INFINITY, scale };
    return { limit: 10 ** (precision - scale) - 10 ** -scale, scale };
  }
  if (is(column, PgInteger)) return { limit: 2 ** 31 - 1, scale: 0 };
  throw new Error(`${column.name} is neither numeric nor integer`);
}

function columnName(column: PgColumn): string {
  const table = TABLES.find((t) => Object.values(getTableColumns(t)).includes(column));
  const key = table && Object.entries(getTableColumns(table)).find(([, c]) => c === column)?.[0];
  return `${table ? tableName(table) : "?"}.${key ?? column.name}`;
}

function tableName(table: PgTable): string {
  // Drizzle keeps the SQL name under a well-known symbol.
  return (table as unknown as Record<symbol, string>)[Symbol.for("drizzle:Name")] ?? "?";
}

describe("numbers the contracts accept fit their columns", () => {
  it.each(PAIRS.map((pair) => [columnName(pair.column), pair.field, pair] as const))(
    "%s ← %s",
    (_name, _field, pair) => {
      const { limit, scale } = columnLimit(pair.column);
      const step = 10 ** -Math.max(scale, 1);
      expect(accepts(pair, pair.max), `the contract accepts its highest, ${pair.max}`).toBe(true);
      expect(accepts(pair, pair.max + step), `the contract refuses ${pair.max + step}`).toBe(false);
      // PostgreSQL rounds to the scale first, then checks the digits left of the point.
      const stored = Math.round(pair.max * 10 ** scale) / 10 ** scale;
      expect(stored, `numeric(…, ${scale}) holds at most ${limit}`).toBeLessThanOrEqual(limit);
      const [lowest, below] = pair.lowest;
      expect(accepts(pair, lowest), `the contract accepts its lowest, ${lowest}`).toBe(true);
      expect(accepts(pair, below), `the contract refuses ${below}`).toBe(false);
      expect(lowest).toBeGreaterThanOrEqual(-limit);
    },
  );

  it("pairs or exempts every numeric and integer column of the tables the contracts write", () => {
    const paired = new Set(PAIRS.map((p) => columnName(p.column)));
    const unaccounted: string[] = [];
    for (const table of TABLES) {
      for (const [key, column] of Object.entries(getTableColumns(table))) {
        if (!is(column, PgNumericNumber) && !is(column, PgNumeric) && !is(column, PgInteger)) continue;
        const name = `${tableName(table)}.${key}`;
        if (!paired.has(name) && !(name in EXEMPT)) unaccounted.push(name);
      }
    }
    expect(unaccounted, "add a pair above, or an exemption with its reason").toEqual([]);
  });
});
