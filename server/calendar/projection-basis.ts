// How an hours-based due day was projected, in words a second engineer checks against the Hour log:
// the counter's running rate, where the rate comes from, and the reading the projection starts at.
import { TZDate } from "@date-fns/tz";
import { format } from "date-fns";
import { formatHours } from "@/server/format/hours";

export type ProjectionFacts = {
  /** Hours per day the worker last computed for the counter. */
  hoursPerDay: number | null;
  rateBasis: "measured" | "planned" | null;
  lastReadAt: Date | null;
  lastTotalHours: number | null;
  dueHours: number | null;
};

export function projectionBasis(f: ProjectionFacts, timeZone: string): string {
  const due = f.dueHours !== null ? `due at ${formatHours(f.dueHours)}; ` : "";
  if (f.hoursPerDay === null || f.lastReadAt === null) {
    return `${due}projected from running hours, but the counter has no reading or rate yet`;
  }
  const rate = `${f.hoursPerDay.toFixed(1)} h/day`;
  const source = f.rateBasis === "planned" ? " (the planned rate: too little history)" : "";
  const reading = format(new TZDate(f.lastReadAt, timeZone), "d MMM");
  const at = f.lastTotalHours !== null ? `, ${formatHours(f.lastTotalHours)}` : "";
  return `${due}projected at ${rate}${source} from the reading of ${reading}${at}`;
}
