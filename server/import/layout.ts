// Keelson's own file layout for bringing a vessel's plan in and taking it out again: one CSV file
// (or one worksheet of a workbook) per kind, keyed by the codes engineers use — the component code
// ("ME.CYL.3"), the counter's name ("Main engine") and the routine's code. The README publishes this
// table, and the empty template and the filled example are written from it.
//
// The routine code is a column of its own (not the component code and title run together): titles
// get reworded, and a routine keeps its history only if its key does not move with its wording.

export const IMPORT_KINDS = ["components", "counters", "routines", "last-done", "readings"] as const;
export type ImportKind = (typeof IMPORT_KINDS)[number];

export type ImportColumn = {
  /** The header as written in the file (lower case, words joined by "_"). */
  name: string;
  required: boolean;
  meaning: string;
  example: string;
};

const col = (name: string, required: boolean, meaning: string, example: string): ImportColumn => ({
  name,
  required,
  meaning,
  example,
});

export const LAYOUT: Record<ImportKind, { title: string; key: string; columns: ImportColumn[] }> = {
  components: {
    title: "Machinery register: one row per component",
    key: "code",
    columns: [
      col("code", true, "The component's code: letters, digits and . _ - (stored in capitals)", "ME.CYL.3"),
      col("name", true, "What the engine room calls it", "Cylinder unit 3"),
      col("parent", false, "The code of the component it belongs to; empty at the top of the tree", "ME"),
      col("critical", false, "Critical equipment: yes or no", "yes"),
      col("class_item", false, "The class society's item reference", "ME-CU-3"),
      col("counter", false, "The counter (by name) its running hours come from; empty: its parent's", "Main engine"),
      col("maker", false, "Maker", "Hansen & Vik"),
      col("model", false, "Model or type", "HV 6L50"),
    ],
  },
  counters: {
    title: "Running-hour counters: one row per hour meter",
    key: "counter",
    columns: [
      col("counter", true, "The counter's name, as the Hour log shows it", "Main engine"),
      col("planned_hours_per_day", false, "Hours a day it is expected to run, 0–24, until readings give a rate (default 12)", "18"),
    ],
  },
  routines: {
    title: "Routines: one row per maintenance task",
    key: "code",
    columns: [
      col("code", true, "The routine's own code, unique on the vessel; keep it when the title changes", "ME.CYL.3/OVERHAUL"),
      col("component", true, "The code of the component it is done on", "ME.CYL.3"),
      col("title", true, "What is done", "Piston overhaul and liner gauging"),
      col("every_hours", false, "Interval in running hours", "16000"),
      col("every", false, "Calendar interval in words: every 3 months, every 2 weeks on Monday, every year", "every 4 years"),
      col("rrule", false, "Or the calendar rule as an RFC 5545 RRULE (not both)", "FREQ=MONTHLY;INTERVAL=6"),
      col("anniversary", false, "For class items that keep a fixed anniversary: the next anniversary it falls due on (YYYY-MM-DD); empty: it counts from the last time done", "2027-03-23"),
      col("tolerance_rule", false, "The company's tolerance rule by name, where it is not the one matched by the interval", ""),
      col("team", true, "Who does it: ranks with the number of people, separated by ;", "second engineer; motorman x2"),
      col("elapsed_hours", true, "Hours from start to finish (man-hours are this × the people)", "12"),
      col("engine_stop", false, "Needs the main engine stopped: yes or no", "yes"),
      col("needs_port", false, "Can only be done in port (crane, service engineer, surveyor, parts): yes or no", "no"),
      col("port_event", false, "Falls due at every port stay instead of an interval: departure or arrival", ""),
      col("port_event_hours", false, "Within how many hours of that event", ""),
      col("critical", false, "Critical: yes or no", "yes"),
      col("class_related", false, "Class-related: yes or no", "yes"),
      col("class_item", false, "Class item reference of the routine", "ME-CU-3"),
      col("checklist", false, "Steps, separated by | or on lines of their own in the cell", "Isolate and lock out | Open crankcase doors"),
      col("measurements", false, "name [unit] lower..upper, separated by |", "Liner wear [mm] 0..1.6 | Ring gap [mm] ..2.1"),
      col("spare_parts", false, "Parts to have ready (free text)", "Piston ring set; O-rings"),
      col("cautions", false, "Any of: isolation, permit-to-work, enclosed-space, hot-work, starting-air, turning-gear (separated by ;)", "isolation; turning-gear"),
      col("description", false, "Notes for the person doing it", "Follow the maker's manual, chapter 3."),
    ],
  },
  "last-done": {
    title: "Last done: the baseline each routine counts from (the day, and the counter's hours for running-hour routines)",
    key: "routine",
    columns: [
      col("routine", true, "The routine's code", "ME.CYL.3/OVERHAUL"),
      col("done_on", true, "The ship's day it was last done (YYYY-MM-DD), or when the count starts", "2025-11-20"),
      col("counter_hours", false, "The counter's reading then (needed for routines by running hours)", "61250"),
      col("remarks", false, "What was done, for the record", "Rings renewed, liner within limits"),
    ],
  },
  readings: {
    title: "Readings history: what each hour meter showed, and when (the Hour log's rules apply)",
    key: "counter + read_at",
    columns: [
      col("counter", true, "The counter's name", "Main engine"),
      col("read_at", true, "When it was read: the ship's time YYYY-MM-DD HH:MM, or with its UTC offset", "2026-03-13 09:00"),
      col("value", true, "What the meter showed, in hours (one decimal at most)", "62431.5"),
      col("meter", false, "Which meter: 1 for the first fitted, 2 after one replacement…; empty: the one fitted now", "1"),
      col("remark", false, "A remark on the reading", "Read after the sea passage"),
    ],
  },
};

/** "Planned hours/day", "planned hours per day", "PLANNED_HOURS_PER_DAY" → "planned_hours_per_day". */
export function headerKey(header: string): string {
  return header
    .trim()
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "_")
    .replace(/^_+|_+$/g, "");
}

/** Which kind a file holds: from its name ("routines.csv", "Aster Gale - routines.csv") or its headers. */
export function kindOf(fileName: string, headers: string[]): ImportKind | null {
  const base = headerKey(fileName.replace(/\.[a-z0-9]+$/i, ""));
  const byName = [...IMPORT_KINDS]
    .sort((a, b) => b.length - a.length)
    .find((k) => base === headerKey(k) || base.endsWith(`_${headerKey(k)}`));
  if (byName) return byName;
  const keys = new Set(headers.map(headerKey));
  const fits = IMPORT_KINDS.filter((k) => LAYOUT[k].columns.filter((c) => c.required).every((c) => keys.has(c.name)));
  // The kind whose required columns are all there and that knows the most of the headers.
  const score = (k: ImportKind) => LAYOUT[k].columns.filter((c) => keys.has(c.name)).length;
  return fits.sort((a, b) => score(b) - score(a))[0] ?? null;
}
