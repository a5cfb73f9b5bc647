// The routine form's own values (text as typed) and their way to and from the contract's input.
import type { RoutineCaution } from "@/db/schema/maintenance";
import type { Rank, RoutineInput, RoutineView } from "@/server/routines/contract";
import type { CalendarUnit } from "@/server/scheduling/calendar-rule-words";
import type { WeekdayCode } from "@/server/scheduling/calendar-rule";

export type CalendarMode = "none" | "form" | "rrule";

export type RoutineFormValues = {
  componentId: string;
  title: string;
  description: string;
  checklist: { text: string }[];
  intervalHours: string;
  calendarMode: CalendarMode;
  calendar: { every: string; unit: CalendarUnit; weekdays: WeekdayCode[] };
  calendarRule: string;
  anchored: boolean;
  anchorDate: string;
  team: { rank: Rank; count: string }[];
  elapsedHours: string;
  /** "" for a routine by running hours or calendar. */
  portEvent: "" | "departure" | "arrival";
  portEventHours: string;
  needsPort: boolean;
  needsEngineStop: boolean;
  critical: boolean;
  classRelated: boolean;
  classItemRef: string;
  measurements: { name: string; unit: string; lower: string; upper: string }[];
  spareParts: string;
  cautions: RoutineCaution[];
  baselineAt: string;
  baselineHours: string;
  toleranceRuleId: string;
};

const text = (value: number | null | undefined) => (value === null || value === undefined ? "" : String(value));

export function valuesOf(routine: RoutineView | null, today: string): RoutineFormValues {
  const mode: CalendarMode = !routine?.calendarRule ? "none" : routine.calendar ? "form" : "rrule";
  return {
    componentId: routine?.componentId ?? "",
    title: routine?.title ?? "",
    description: routine?.description ?? "",
    checklist: (routine?.checklist ?? []).map((step) => ({ text: step })),
    intervalHours: text(routine?.intervalHours),
    calendarMode: routine ? mode : "none",
    calendar: {
      every: text(routine?.calendar?.every ?? 1),
      unit: routine?.calendar?.unit ?? "month",
      weekdays: routine?.calendar?.weekdays ?? [],
    },
    calendarRule: mode === "rrule" ? (routine?.calendarRule ?? "") : "",
    anchored: routine?.anchored ?? false,
    anchorDate: routine?.anchorDate ?? "",
    team: (routine?.team ?? [{ rank: "second-engineer" as Rank, count: 1 }]).map((t) => ({ rank: t.rank, count: String(t.count) })),
    elapsedHours: text(routine?.elapsedHours ?? 1),
    portEvent: routine?.portEvent ?? "",
    portEventHours: text(routine?.portEventHours ?? 12),
    needsPort: routine?.needsPort ?? false,
    needsEngineStop: routine?.needsEngineStop ?? false,
    critical: routine?.critical ?? false,
    classRelated: routine?.classRelated ?? false,
    classItemRef: routine?.classItemRef ?? "",
    measurements: (routine?.measurements ?? []).map((m) => ({
      name: m.name,
      unit: m.unit,
      lower: text(m.lower),
      upper: text(m.upper),
    })),
    spareParts: routine?.spareParts ?? "",
    cautions: routine?.cautions ?? [],
    baselineAt: routine?.baselineAt ?? today,
    baselineHours: text(routine?.baselineHours),
    toleranceRuleId: routine?.toleranceRuleId ?? "",
  };
}

/** A limit as typed: empty is no limit; anything else that is not a number is left for the contract to refuse. */
function limit(value: string): number | null {
  const t = value.trim().replace(",", ".");
  return t === "" ? null : Number(t);
}

export function inputOf(v: RoutineFormValues): RoutineInput {
  // Tied to every port stay: no interval, calendar or baseline of its own.
  const tied = v.portEvent !== "";
  return {
    componentId: v.componentId,
    title: v.title,
    description: v.description,
    checklist: v.checklist.map((s) => s.text.trim()).filter(Boolean),
    intervalHours: tied ? null : v.intervalHours.trim() || null,
    calendar:
      !tied && v.calendarMode === "form"
        ? {
            every: Number(v.calendar.every),
            unit: v.calendar.unit,
            ...(v.calendar.unit === "week" && v.calendar.weekdays.length ? { weekdays: v.calendar.weekdays } : {}),
          }
        : null,
    calendarRule: !tied && v.calendarMode === "rrule" ? v.calendarRule : null,
    anchored: !tied && v.calendarMode !== "none" && v.anchored,
    anchorDate: v.anchorDate || null,
    team: v.team.map((t) => ({ rank: t.rank, count: Number(t.count) })),
    elapsedHours: v.elapsedHours,
    portEvent: tied ? (v.portEvent as "departure" | "arrival") : null,
    portEventHours: tied ? v.portEventHours : null,
    needsPort: v.needsPort,
    needsEngineStop: v.needsEngineStop,
    critical: v.critical,
    classRelated: v.classRelated,
    classItemRef: v.classItemRef,
    measurements: v.measurements
      .filter((m) => m.name.trim() || m.unit.trim() || m.lower.trim() || m.upper.trim())
      .map((m) => ({ name: m.name, unit: m.unit, lower: limit(m.lower), upper: limit(m.upper) })),
    spareParts: v.spareParts,
    cautions: v.cautions,
    baselineAt: tied ? null : v.baselineAt || null,
    baselineHours: tied ? null : v.baselineHours.trim() || null,
    toleranceRuleId: v.toleranceRuleId || null,
  };
}
