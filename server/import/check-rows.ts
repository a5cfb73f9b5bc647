// The rows of an import checked as the app's forms check them (the same zod contracts), and across
// rows: duplicate codes, a parent or counter in neither the file nor the vessel, parent cycles, a
// routine on a missing component, last-done rows for routines not imported. Pure: the vessel's
// present codes come in as `VesselNow`. Every problem names its file, row and column.
import { ComponentCode, CounterInput } from "@/server/register/contract";
import { type NewRoutine, RoutineInput } from "@/server/routines/contract";
import type { RankNames } from "@/server/routines/rank-names";
import { cautionsCell, type Cell, listCell, measurementsCell, numberCell, teamCell, yesNo } from "./cells";
import type { ImportKind } from "./layout";
import type { ImportProblem } from "./problems";
import type { ImportRow, ImportSheet } from "./read-file";
import { readRuleWords } from "./rule-words";
import { type CounterReadings, type CounterReadingsImport, checkReadings } from "./check-readings";

export type VesselNow = {
  /** Component code → its id and its parent's code. */
  components: Map<string, { id: string; parentCode: string | null }>;
  /** Counter name in lower case → id and name as stored. */
  counters: Map<string, { id: string; name: string }>;
  /** Routine code → id. */
  routines: Map<string, { id: string }>;
  /** Tolerance rule name in lower case → id. */
  toleranceRules: Map<string, string>;
  rankNames: RankNames;
  /** The vessel's zone and the instant of the check: readings are read on the ship's clock, none in the future. */
  timeZone: string;
  clock: Date;
  /** Each counter's meters and readings, by name in lower case (loaded only when the import has readings). */
  readings: Map<string, CounterReadings & { name: string }>;
};

export type CounterCandidate = { line: number; name: string; plannedHoursPerDay: number };
export type ComponentCandidate = {
  line: number;
  code: string;
  name: string;
  parentCode: string | null;
  critical: boolean;
  classItemRef: string | null;
  counterName: string | null;
  maker: string | null;
  model: string | null;
};
export type RoutineCandidate = { line: number; code: string; componentCode: string; routine: Omit<NewRoutine, "componentId"> };
export type CheckedImport = {
  counters: CounterCandidate[];
  components: ComponentCandidate[];
  routines: RoutineCandidate[];
  readings: CounterReadingsImport[];
  problems: ImportProblem[];
};

/** A routine's code: like a component's, with "/" too ("ME.CYL.3/OVERHAUL"); stored in capitals. */
export const ROUTINE_CODE_PATTERN = /^[A-Z0-9][A-Z0-9._/-]{0,59}$/;
const PLACEHOLDER_ID = "00000000-0000-4000-8000-000000000000";
const DAY = /^\d{4}-\d{2}-\d{2}$/;

export function checkImport(sheets: ImportSheet[], now: VesselNow): CheckedImport {
  const problems: ImportProblem[] = [];
  const sheet = (kind: ImportKind) => sheets.find((s) => s.kind === kind);
  const at = (s: ImportSheet, row: ImportRow, column: string | null) => (message: string) =>
    problems.push({ file: s.source, row: row.line, column, message });

  const counters = checkCounters(sheet("counters"), at);
  const counterNames = new Set([...now.counters.keys(), ...counters.map((c) => c.name.toLowerCase())]);
  const components = checkComponents(sheet("components"), now, counterNames, at);
  const componentCodes = new Set([...now.components.keys(), ...components.map((c) => c.code)]);
  const lastDone = readLastDone(sheet("last-done"), at);
  const listed = new Set<string>();
  const routines = checkRoutines(sheet("routines"), now, componentCodes, lastDone, at, listed);
  for (const [code, done] of lastDone) {
    // A routine whose own row has a problem is still listed: its last-done row is not blamed too.
    if (!listed.has(code)) {
      problems.push({ file: done.source, row: done.line, column: "routine", message: `${code}: no such routine in the routines file; a last-done row gives the baseline of a routine imported with it.` });
    }
  }
  const readings = checkReadings(
    sheet("readings"),
    { fromFile: new Map(counters.map((c) => [c.name.toLowerCase(), c.name])), onVessel: now.readings },
    now,
    at,
  );
  return { counters, components, routines, readings, problems };
}

type At = (s: ImportSheet, row: ImportRow, column: string | null) => (message: string) => void;

function firstMessage(error: { issues: { message: string }[] }): string {
  return error.issues[0]?.message ?? "is not valid.";
}

function checkCounters(s: ImportSheet | undefined, at: At): CounterCandidate[] {
  if (!s) return [];
  const out: CounterCandidate[] = [];
  const seen = new Map<string, number>();
  for (const row of s.rows) {
    const v = row.values;
    const parsed = CounterInput.safeParse({ name: v.counter ?? "", plannedHoursPerDay: numberCell(v.planned_hours_per_day, s.decimalComma) ?? "12" });
    if (!parsed.success) {
      const issue = parsed.error.issues[0]!;
      at(s, row, issue.path[0] === "name" ? "counter" : "planned_hours_per_day")(issue.message);
      continue;
    }
    const key = parsed.data.name.toLowerCase();
    const first = seen.get(key);
    if (first) {
      at(s, row, "counter")(`“${parsed.data.name}” is already on row ${first}: one row per counter.`);
      continue;
    }
    seen.set(key, row.line);
    out.push({ line: row.line, ...parsed.data });
  }
  return out;
}

function checkComponents(s: ImportSheet | undefined, now: VesselNow, counterNames: Set<string>, at: At): ComponentCandidate[] {
  if (!s) return [];
  const out: ComponentCandidate[] = [];
  const seen = new Map<string, number>();
  for (const row of s.rows) {
    const v = row.values;
    const code = ComponentCode.safeParse(v.code ?? "");
    if (!code.success) {
      at(s, row, "code")(firstMessage(code.error));
      continue;
    }
    const first = seen.get(code.data);
    if (first) {
      at(s, row, "code")(`${code.data} is already on row ${first}: each component once.`);
      continue;
    }
    seen.set(code.data, row.line);
    const name = (v.name ?? "").trim();
    if (!name) at(s, row, "name")(`${code.data}: enter the component's name.`);
    else if (name.length > 120) at(s, row, "name")("Keep the component's name to 120 characters or fewer.");
    const critical = cell(yesNo(v.critical), at(s, row, "critical"));
    const text = (column: string, max: number) => {
      const t = (v[column] ?? "").trim();
      if (t.length > max) at(s, row, column)(`Keep it to ${max} characters or fewer.`);
      return t || null;
    };
    const counterName = text("counter", 80);
    if (counterName && !counterNames.has(counterName.toLowerCase())) {
      at(s, row, "counter")(`“${counterName}”: no such counter in the counters file or on the vessel.`);
    }
    const parentRaw = (v.parent ?? "").trim();
    const parentCode = parentRaw ? parentRaw.toUpperCase() : null;
    if (parentCode === code.data) at(s, row, "parent")(`${code.data} cannot be its own parent.`);
    out.push({
      line: row.line,
      code: code.data,
      name,
      parentCode,
      critical: critical ?? false,
      classItemRef: text("class_item", 40),
      counterName,
      maker: text("maker", 80),
      model: text("model", 80),
    });
  }
  // Parents: in the file or on the vessel, and no cycle through the file's rows and the vessel's tree.
  const parentOf = new Map<string, string | null>([...now.components].map(([c, x]) => [c, x.parentCode]));
  for (const c of out) parentOf.set(c.code, c.parentCode);
  for (const c of out) {
    const row = s.rows.find((r) => r.line === c.line)!;
    if (c.parentCode && !parentOf.has(c.parentCode)) {
      at(s, row, "parent")(`${c.parentCode}: no such component in this file or on the vessel.`);
      continue;
    }
    const path = [c.code];
    let up = c.parentCode;
    for (let steps = 0; up && steps <= parentOf.size; steps += 1) {
      if (up === c.code) {
        at(s, row, "parent")(`The parents go round in a circle: ${[...path, c.code].join(" → ")}.`);
        break;
      }
      path.push(up);
      up = parentOf.get(up) ?? null;
    }
  }
  return out;
}

type LastDone = { source: string; line: number; doneOn: string; counterHours: string | undefined; remarks: string };

function readLastDone(s: ImportSheet | undefined, at: At): Map<string, LastDone> {
  const latest = new Map<string, LastDone>();
  if (!s) return latest;
  for (const row of s.rows) {
    const v = row.values;
    const code = (v.routine ?? "").trim().toUpperCase();
    if (!code) {
      at(s, row, "routine")("Enter the routine's code.");
      continue;
    }
    const doneOn = (v.done_on ?? "").trim();
    if (!DAY.test(doneOn) || Number.isNaN(Date.parse(`${doneOn}T00:00:00Z`))) {
      at(s, row, "done_on")(`“${doneOn}” is not a day: write it as YYYY-MM-DD, e.g. 2025-11-20.`);
      continue;
    }
    const entry = { source: s.source, line: row.line, doneOn, counterHours: numberCell(v.counter_hours, s.decimalComma), remarks: (v.remarks ?? "").trim() };
    const before = latest.get(code);
    if (!before || before.doneOn <= doneOn) latest.set(code, entry);
  }
  return latest;
}

/** Where a routine's field is in the files (the contract's names and the table's). */
export const ROUTINE_COLUMN: Record<string, string> = {
  componentId: "component",
  baselineAt: "last-done done_on",
  baselineHours: "last-done counter_hours",
  title: "title",
  description: "description",
  checklist: "checklist",
  intervalHours: "every_hours",
  calendar: "every",
  calendarRule: "rrule",
  anchored: "anniversary",
  anchorDate: "anniversary",
  estimatedManHours: "elapsed_hours",
  rank: "team",
  team: "team",
  elapsedHours: "elapsed_hours",
  needsPort: "needs_port",
  portEvent: "port_event",
  portEventHours: "port_event_hours",
  needsEngineStop: "engine_stop",
  critical: "critical",
  classRelated: "class_related",
  classItemRef: "class_item",
  measurements: "measurements",
  spareParts: "spare_parts",
  cautions: "cautions",
  toleranceRuleId: "tolerance_rule",
};

function checkRoutines(
  s: ImportSheet | undefined,
  now: VesselNow,
  componentCodes: Set<string>,
  lastDone: Map<string, LastDone>,
  at: At,
  listed: Set<string>,
): RoutineCandidate[] {
  if (!s) return [];
  const out: RoutineCandidate[] = [];
  const seen = new Map<string, number>();
  for (const row of s.rows) {
    const v = row.values;
    const code = (v.code ?? "").trim().toUpperCase();
    if (!ROUTINE_CODE_PATTERN.test(code)) {
      at(s, row, "code")(code ? `“${v.code}”: a routine code holds letters, digits and . _ / - (at most 60), e.g. ME.CYL.3/OVERHAUL.` : "Enter the routine's code, e.g. ME.CYL.3/OVERHAUL.");
      continue;
    }
    const first = seen.get(code);
    if (first) {
      at(s, row, "code")(`${code} is already on row ${first}: each routine once.`);
      continue;
    }
    seen.set(code, row.line);
    listed.add(code);
    const componentCode = (v.component ?? "").trim().toUpperCase();
    let ok = true;
    const fail = (column: string) => (message: string) => {
      ok = false;
      at(s, row, column)(message);
    };
    if (!componentCode) fail("component")("Enter the code of the component it is done on.");
    else if (!componentCodes.has(componentCode)) fail("component")(`${componentCode}: no such component in the components file or on the vessel.`);

    let calendar: unknown = null;
    if ((v.every ?? "").trim()) {
      const words = readRuleWords(v.every!);
      if ("problem" in words) fail("every")(words.problem);
      else calendar = words.form;
    }
    const team = cell(teamCell(v.team, now.rankNames), fail("team"));
    const measurements = cell(measurementsCell(v.measurements, s.decimalComma), fail("measurements"));
    const cautions = cell(cautionsCell(v.cautions), fail("cautions"));
    const flag = (column: string) => cell(yesNo(v[column]), fail(column)) ?? false;
    let toleranceRuleId: string | null = null;
    const ruleName = (v.tolerance_rule ?? "").trim();
    if (ruleName) {
      toleranceRuleId = now.toleranceRules.get(ruleName.toLowerCase()) ?? null;
      if (!toleranceRuleId) fail("tolerance_rule")(`“${ruleName}” is not one of the company's tolerance rules (Company → Tolerance rules).`);
    }
    const portEvent = (v.port_event ?? "").trim().toLowerCase() || null;
    if (portEvent && portEvent !== "departure" && portEvent !== "arrival") fail("port_event")(`write departure or arrival, not “${v.port_event}”.`);
    const anniversary = (v.anniversary ?? "").trim();
    const done = lastDone.get(code);
    const input = {
      componentId: PLACEHOLDER_ID,
      title: v.title ?? "",
      description: v.description ?? "",
      checklist: listCell(v.checklist),
      intervalHours: numberCell(v.every_hours, s.decimalComma) ?? null,
      calendar,
      calendarRule: (v.rrule ?? "").trim() || null,
      anchored: Boolean(anniversary),
      anchorDate: anniversary || null,
      team: team ?? undefined,
      elapsedHours: numberCell(v.elapsed_hours, s.decimalComma) ?? null,
      needsPort: flag("needs_port"),
      portEvent,
      portEventHours: numberCell(v.port_event_hours, s.decimalComma) ?? null,
      needsEngineStop: flag("engine_stop"),
      critical: flag("critical"),
      classRelated: flag("class_related"),
      classItemRef: (v.class_item ?? "").trim() || null,
      measurements: measurements ?? [],
      spareParts: v.spare_parts ?? "",
      cautions: cautions ?? [],
      baselineAt: done?.doneOn ?? null,
      baselineHours: done?.counterHours ?? null,
      toleranceRuleId,
    };
    if (!ok) continue;
    const parsed = RoutineInput.safeParse(input);
    if (!parsed.success) {
      // A missing baseline is said only when the rest of the row is right: it may be the rule's fault.
      const isBaseline = (i: { path: PropertyKey[] }) => i.path[0] === "baselineAt" || i.path[0] === "baselineHours";
      const issues = parsed.error.issues.some((i) => !isBaseline(i)) ? parsed.error.issues.filter((i) => !isBaseline(i)) : parsed.error.issues;
      for (const issue of issues) {
        const field = String(issue.path[0] ?? "");
        if (field === "baselineAt" || field === "baselineHours") {
          const column = field === "baselineAt" ? "done_on" : "counter_hours";
          if (done) problems(at, done, column)(`${code}: ${issue.message}`);
          else at(s, row, "code")(`${code} has no row in last-done: ${lowerFirst(issue.message)}`);
        } else {
          at(s, row, ROUTINE_COLUMN[field] ?? null)(issue.message);
        }
      }
      continue;
    }
    const { componentId: _placeholder, ...routine } = parsed.data;
    out.push({ line: row.line, code, componentCode, routine });
  }
  return out;
}

function problems(at: At, done: LastDone, column: string) {
  return at({ source: done.source } as ImportSheet, { line: done.line, values: {} }, column);
}

function lowerFirst(text: string): string {
  return text.charAt(0).toLowerCase() + text.slice(1);
}

function cell<T>(c: Cell<T>, report: (message: string) => void): T | undefined {
  if ("problem" in c) {
    report(c.problem);
    return undefined;
  }
  return c.value;
}
