// A routine's input and output, shared by the routine form and the route handlers. The calendar rule
// comes either from the friendly form ("every 6 months") or as a raw RFC 5545 RRULE; both end up
// as one stored rule text.
import { z } from "zod";
import { optionalText, requiredText } from "@/server/http/text-fields";
import type { RoutineCaution, RoutineMeasurement } from "@/db/schema/maintenance";
import { AppError } from "@/server/http/problem";
import { MAX_JOB_MAN_HOURS } from "@/server/completions/contract";
import { enteredDay } from "@/server/http/dates";
import { MAX_METER_HOURS, MeterValue, SHIP_DAY_FORMAT } from "@/server/readings/contract";
import { calendarRuleProblem, parseCalendarRule } from "@/server/scheduling/calendar-rule";
import { calendarRuleFromForm, type CalendarRuleForm } from "@/server/scheduling/calendar-rule-words";
import { RANKS, type Rank } from "./ranks";

export { RANKS, type Rank };

export const CAUTIONS = [
  "isolation",
  "permit-to-work",
  "enclosed-space",
  "hot-work",
  "starting-air",
  "turning-gear",
] as const satisfies readonly RoutineCaution[];

export const CALENDAR_UNITS = ["day", "week", "month", "year"] as const;
export const WEEKDAYS = ["MO", "TU", "WE", "TH", "FR", "SA", "SU"] as const;

/** A number typed with at most one decimal, up to `max`; an empty field is no value. */
function tenths(what: string, { min, above, max }: { min?: number; above?: number; max: number }) {
  const limit = above !== undefined ? `above ${above}` : `of ${min ?? 0} or more`;
  const message = `${what}: enter a number ${limit} and at most ${max.toLocaleString("en-GB")}, with at most one decimal.`;
  return z
    .union([z.number(), z.string(), z.null()], { message })
    .optional()
    .transform((raw, ctx): number | null | undefined => {
      if (raw === undefined) return undefined;
      if (raw === null || (typeof raw === "string" && !raw.trim())) return null;
      const text = typeof raw === "number" ? String(raw) : raw.trim().replace(/[\s,_]/g, "");
      const value = Number(text);
      const fits = /^\d+(\.\d)?$/.test(text) && (above !== undefined ? value > above : value >= (min ?? 0));
      if (!fits || value > max) {
        ctx.addIssue({ code: "custom", message });
        return z.NEVER;
      }
      return value;
    });
}

const Measurement = z.object({
  name: requiredText("measurement’s name", 80),
  unit: z.string({ message: "The unit must be text." }).trim().max(20, { message: "Keep the unit to 20 characters." }),
  lower: z.number({ message: "The lower limit must be a number." }).nullable().default(null),
  upper: z.number({ message: "The upper limit must be a number." }).nullable().default(null),
});

const CalendarForm = z.object({
  every: z
    .number({ message: "Repeat every: enter a whole number." })
    .int({ message: "Repeat every: enter a whole number." }),
  unit: z.enum(CALENDAR_UNITS, { message: "Choose days, weeks, months or years." }),
  weekdays: z.array(z.enum(WEEKDAYS, { message: "Unknown weekday." })).optional(),
});

export const MAX_TEAM_ROWS = 6;
export const MAX_TEAM_HEADS = 10;
/** An overhaul of a large two-stroke takes days, not weeks (Keelson's bound, `common practice`). */
export const MAX_ELAPSED_HOURS = 500;
export const MAX_PORT_EVENT_HOURS = 72;
export const PORT_EVENTS = ["departure", "arrival"] as const;

const TeamRow = z.object({
  rank: z.enum(RANKS, { message: "Choose the rank." }),
  count: z
    .number({ message: "People: enter a whole number from 1." })
    .int({ message: "People: enter a whole number from 1." })
    .min(1, { message: "People: at least 1 (remove the row instead)." })
    .max(MAX_TEAM_HEADS, { message: `People: at most ${MAX_TEAM_HEADS} of one rank on a job.` }),
});

/** Every field of a routine as the form sends it; cross-field rules come in RoutineInput. */
const fields = {
  componentId: z.uuid({ message: "Choose the component the routine belongs to." }),
  title: requiredText("routine’s title", 160),
  description: optionalText("description", 4000),
  checklist: z
    .array(requiredText("checklist step", 300), { message: "The checklist is a list of steps." })
    .max(100, { message: "Keep the checklist to 100 steps or fewer." })
    .optional(),
  intervalHours: tenths("Interval in running hours", { above: 0, max: MAX_METER_HOURS }),
  calendar: CalendarForm.nullish(),
  calendarRule: z.string({ message: "The calendar rule must be text." }).trim().nullish(),
  anchored: z.boolean({ message: "Anchored must be yes or no." }).optional(),
  anchorDate: enteredDay("anniversary", "The anniversary date", SHIP_DAY_FORMAT).nullish(),
  // The completion's limit for one job (numeric(6,1) would hold 99,999.9). With a team, derived.
  estimatedManHours: tenths("Estimated man-hours", { min: 0, max: MAX_JOB_MAN_HOURS }),
  rank: z.enum(RANKS, { message: "Choose the rank who does the job." }).optional(),
  /** Who does it: ranks with a head count, the lead rank first. */
  team: z
    .array(TeamRow, { message: "List the team by rank and number of people." })
    .min(1, { message: "A job needs at least one person: add a rank to the team." })
    .max(MAX_TEAM_ROWS, { message: `At most ${MAX_TEAM_ROWS} ranks in a team.` })
    .optional(),
  /** Hours from start to finish; man-hours are elapsed × the team's head count. */
  elapsedHours: tenths("Elapsed time", { above: 0, max: MAX_ELAPSED_HOURS }),
  needsPort: z.boolean({ message: "Needs port must be yes or no." }).optional(),
  portEvent: z.enum(PORT_EVENTS, { message: "Tie it to the departure or the arrival." }).nullish(),
  portEventHours: tenths("Hours from the event", { above: 0, max: MAX_PORT_EVENT_HOURS }),
  needsEngineStop: z.boolean({ message: "Engine stop must be yes or no." }).optional(),
  critical: z.boolean({ message: "Critical must be yes or no." }).optional(),
  classRelated: z.boolean({ message: "Class-related must be yes or no." }).optional(),
  classItemRef: optionalText("class item reference", 40),
  measurements: z.array(Measurement).max(50, { message: "Keep it to 50 measurements or fewer." }).optional(),
  spareParts: optionalText("spare parts", 2000),
  cautions: z.array(z.enum(CAUTIONS, { message: "Unknown caution." })).optional(),
  baselineAt: enteredDay("history", "The day last done", SHIP_DAY_FORMAT).nullish(),
  baselineHours: z.union([MeterValue, z.null()]).optional(),
  toleranceRuleId: z.uuid({ message: "Choose one of the company’s tolerance rules." }).nullish(),
};

type Fields = z.output<z.ZodObject<typeof fields>>;

/** The stored shape of a routine's definition (the baseline day still a ship's day). */
export type NewRoutine = {
  componentId: string;
  title: string;
  description: string;
  checklist: string[];
  intervalHours: number | null;
  calendarRule: string | null;
  anchored: boolean;
  anchorDate: string | null;
  estimatedManHours: number;
  rank: Rank;
  team: { rank: Rank; count: number }[];
  elapsedHours: number;
  needsPort: boolean;
  portEvent: (typeof PORT_EVENTS)[number] | null;
  portEventHours: number | null;
  needsEngineStop: boolean;
  critical: boolean;
  classRelated: boolean;
  classItemRef: string | null;
  measurements: RoutineMeasurement[];
  spareParts: string;
  cautions: RoutineCaution[];
  baselineAt: string | null;
  baselineHours: number | null;
  toleranceRuleId: string | null;
};

type Issue = { path: (string | number)[]; message: string };

/** The stored rule text, or the reasons it cannot be. */
function ruleOf(f: Fields, issues: Issue[]): string | null {
  if (f.calendar && f.calendarRule) {
    issues.push({
      path: ["calendarRule"],
      message: "Give the calendar rule through the form or as an RRULE, not both.",
    });
    return null;
  }
  let text: string | null = null;
  if (f.calendar) {
    try {
      text = calendarRuleFromForm(f.calendar as CalendarRuleForm);
    } catch (error) {
      if (!(error instanceof AppError)) throw error;
      for (const e of error.errors) issues.push({ path: ["calendar", e.field], message: e.message });
      return null;
    }
  } else if (f.calendarRule) {
    const problem = calendarRuleProblem(f.calendarRule);
    if (problem) {
      issues.push({ path: ["calendarRule"], message: problem });
      return null;
    }
    text = f.calendarRule;
  }
  if (text === null) return null;
  const rule = parseCalendarRule(text);
  if (rule.count !== null) {
    // A floating routine restarts its series at every completion, so "10 times" never runs out.
    issues.push({
      path: [f.calendar ? "calendar" : "calendarRule"],
      message:
        "Leave COUNT out of the rule: a routine repeats from each completion, so a count of times means nothing.",
    });
    return null;
  }
  return rule.text;
}

/** The team and its hours: a team with an elapsed time, or (older clients) one rank and its man-hours. */
function labourOf(f: Fields, issues: Issue[]): Pick<NewRoutine, "rank" | "team" | "elapsedHours" | "estimatedManHours"> | null {
  if (f.team) {
    const seen = new Map<string, number>();
    f.team.forEach((row, i) => {
      const first = seen.get(row.rank);
      if (first !== undefined) issues.push({ path: ["team", i, "rank"], message: `This rank is already on row ${first + 1}: give it one row with its number of people.` });
      else seen.set(row.rank, i);
    });
    if (f.elapsedHours == null) {
      issues.push({ path: ["elapsedHours"], message: "Give the team's elapsed time: hours from start to finish." });
      return null;
    }
    const heads = f.team.reduce((sum, row) => sum + row.count, 0);
    const manHours = Math.round(f.elapsedHours * heads * 10) / 10;
    if (manHours > MAX_JOB_MAN_HOURS) {
      issues.push({
        path: ["elapsedHours"],
        message: `${heads} people × ${f.elapsedHours} h is ${manHours.toLocaleString("en-GB")} man-hours, more than one job takes (at most ${MAX_JOB_MAN_HOURS.toLocaleString("en-GB")}).`,
      });
      return null;
    }
    return { rank: f.team[0]!.rank, team: f.team, elapsedHours: f.elapsedHours, estimatedManHours: manHours };
  }
  if (!f.rank) {
    issues.push({ path: ["team"], message: "Say who does the job: a team of ranks with their number of people." });
    return null;
  }
  // One person of the rank for the man-hours' length, as routines were before teams.
  const hours = f.estimatedManHours ?? 1;
  return { rank: f.rank, team: [{ rank: f.rank, count: 1 }], elapsedHours: hours, estimatedManHours: hours };
}

function crossFieldIssues(f: Fields, calendarRule: string | null, issues: Issue[]): void {
  (f.measurements ?? []).forEach((m, i) => {
    if (m.lower !== null && m.upper !== null && m.lower > m.upper) {
      issues.push({
        path: ["measurements", i, "upper"],
        message: `${m.name}: the upper limit (${m.upper}) is below the lower limit (${m.lower}).`,
      });
    }
  });
  const hasHours = f.intervalHours != null;
  const hasCalendar = calendarRule !== null || Boolean(f.calendar || f.calendarRule);
  if (f.portEvent) {
    // It falls due at each stay's event: no interval, no anniversary, no baseline to count from.
    if (f.portEventHours == null) {
      const when = f.portEvent === "departure" ? "before the departure" : "after the arrival";
      issues.push({ path: ["portEventHours"], message: `Say within how many hours ${when} it is done.` });
    }
    if (hasHours || hasCalendar || f.anchored) {
      issues.push({
        path: [hasHours ? "intervalHours" : "calendar"],
        message: "A routine tied to every port stay falls due at each stay: leave the running hours and the calendar rule out.",
      });
    }
    return;
  }
  if (!hasHours && !hasCalendar) {
    issues.push({
      path: ["intervalHours"],
      message: "Give the routine an interval in running hours, a calendar rule, both (whichever comes first), or tie it to every port stay.",
    });
  }
  if (f.anchored) {
    if (!hasCalendar)
      issues.push({ path: ["anchored"], message: "Only a routine with a calendar rule can keep a fixed anniversary." });
    if (!f.anchorDate)
      issues.push({ path: ["anchorDate"], message: "An anchored routine needs its anniversary date (YYYY-MM-DD)." });
  }
  const baselineWords = "A routine never done needs a baseline";
  if (hasHours && f.baselineHours == null) {
    issues.push({
      path: ["baselineHours"],
      message: `${baselineWords}: the counter reading it was last done at (or the reading when the count starts).`,
    });
  }
  const floatingCalendar = hasCalendar && !f.anchored;
  if ((hasHours || floatingCalendar) && !f.baselineAt) {
    issues.push({
      path: ["baselineAt"],
      message: `${baselineWords}: the ship’s day it was last done (or when the count starts).`,
    });
  }
}

function toRoutine(f: Fields, calendarRule: string | null, labour: NonNullable<ReturnType<typeof labourOf>>): NewRoutine {
  return {
    componentId: f.componentId,
    title: f.title,
    description: f.description ?? "",
    checklist: f.checklist ?? [],
    intervalHours: f.intervalHours ?? null,
    calendarRule,
    anchored: f.anchored ?? false,
    anchorDate: f.anchored ? (f.anchorDate ?? null) : null,
    ...labour,
    needsPort: f.needsPort ?? false,
    portEvent: f.portEvent ?? null,
    portEventHours: f.portEvent ? (f.portEventHours ?? null) : null,
    needsEngineStop: f.needsEngineStop ?? false,
    critical: f.critical ?? false,
    classRelated: f.classRelated ?? false,
    classItemRef: f.classItemRef || null,
    measurements: f.measurements ?? [],
    spareParts: f.spareParts ?? "",
    cautions: CAUTIONS.filter((c) => f.cautions?.includes(c)),
    baselineAt: f.baselineAt ?? null,
    baselineHours: f.baselineHours ?? null,
    toleranceRuleId: f.toleranceRuleId ?? null,
  };
}

export const RoutineInput = z.object(fields).transform((f, ctx) => {
  const issues: Issue[] = [];
  const calendarRule = ruleOf(f, issues);
  crossFieldIssues(f, calendarRule, issues);
  const labour = labourOf(f, issues);
  for (const issue of issues) ctx.addIssue({ code: "custom", ...issue });
  return issues.length || !labour ? z.NEVER : toRoutine(f, calendarRule, labour);
});
export type RoutineInput = z.input<typeof RoutineInput>;

/** An edit: only the fields sent change; the whole routine is checked again once merged. */
export const RoutinePatch = z
  .object(fields)
  .partial()
  .refine((patch) => Object.values(patch).some((v) => v !== undefined), {
    message: "Nothing to change: send at least one field of the routine.",
  });
export type RoutinePatchInput = z.input<typeof RoutinePatch>;
export type RoutineChange = z.output<typeof RoutinePatch>;

export const RoutineListQuery = z.object({
  component: z.uuid({ message: "component must be a component id." }).optional(),
  q: z.string().trim().max(100, { message: "Keep the search to 100 characters." }).optional(),
});

export const RoutineCopyInput = z.object({
  componentIds: z
    .array(z.uuid({ message: "Each target must be a component id." }), { message: "Choose the components to copy to." })
    .min(1, { message: "Choose at least one component to copy to." })
    .max(200, { message: "Copy to at most 200 components at once." }),
});
export type RoutineCopyInput = z.input<typeof RoutineCopyInput>;

export type RoutineView = Omit<NewRoutine, "baselineAt"> & {
  id: string;
  /** The ship's day of the baseline, in the vessel's zone. */
  baselineAt: string | null;
  component: { id: string; code: string; name: string };
  /** "every 2,000 h or every 12 months, whichever first" */
  intervalWords: string;
  /** The friendly form's fields for the stored rule, or null when only the RRULE can say it. */
  calendar: CalendarRuleForm | null;
  toleranceRuleName: string | null;
  revision: number;
  updatedAt: string;
};

/**
 * A row of the Routines list: only what the table shows. The whole definition (checklist,
 * measurements, cautions, baseline…) is fetched one routine at a time when it is opened.
 */
export type RoutineSummary = Pick<
  RoutineView,
  | "id"
  | "title"
  | "component"
  | "intervalWords"
  | "rank"
  | "team"
  | "elapsedHours"
  | "estimatedManHours"
  | "critical"
  | "classRelated"
  | "classItemRef"
  | "needsEngineStop"
  | "needsPort"
> & {
  /** The fixed anniversary of an anchored routine, else null. */
  anchoredOn: string | null;
  /** Why the due engine could not plan it on its last run (it has no open work order), else null. */
  planProblem: string | null;
};

/** A routine the due engine could not plan, whatever the list's filter: the page names them all. */
export type RoutinePlanProblem = { id: string; title: string; componentCode: string; reason: string; since: string };

export type RoutineList = {
  vessel: { id: string; name: string; code: string };
  canEdit: boolean;
  routines: RoutineSummary[];
  /** Routines matching the filter; more than `routines` holds when the list was cut at its limit. */
  total: number;
  components: { id: string; code: string; name: string }[];
  toleranceRules: { id: string; name: string; kind: "hours" | "calendar" }[];
  /** Every routine of the vessel the due engine could not plan on its last run. */
  planProblems: RoutinePlanProblem[];
};

export type CopyTarget = { id: string; code: string; name: string; vessel: { id: string; name: string } };
export type CopyResult = { created: { id: string; componentCode: string; vesselName: string }[] };
