// How an hours-based due day was projected, in words a second engineer checks against the Hour log:
// the counter's running rate, where the rate comes from, and the reading the projection starts at.
import { TZDate } from "@date-fns/tz";
import { format } from "date-fns";
import { formatHours, formatRate } from "@/server/format/hours";

export type ProjectionFacts = CounterFacts & { dueHours: number | null };

/** What a projection starts from: the counter's rate and last reading. */
export type CounterFacts = {
  /** Hours per day the worker last computed for the counter. */
  hoursPerDay: number | null;
  rateBasis: "measured" | "planned" | null;
  lastReadAt: Date | null;
  lastTotalHours: number | null;
};

export function projectionBasis(f: ProjectionFacts, timeZone: string): string {
  return projectionWords(f, timeZone)(f.dueHours);
}

/**
 * The words for every work order projected from one counter: the counter's part is written once
 * (a Calendar of a thousand events has 5–30 counters), each work order adds only its limit.
 */
export function projectionWords(c: CounterFacts, timeZone: string): (dueHours: number | null) => string {
  let how: string;
  if (c.hoursPerDay === null || c.lastReadAt === null) {
    how = "projected from running hours, but the counter has no reading or rate yet";
  } else {
    const rate = formatRate(c.hoursPerDay);
    const source = c.rateBasis === "planned" ? " (the planned rate: too little history)" : "";
    const reading = format(new TZDate(c.lastReadAt, timeZone), "d MMM");
    const at = c.lastTotalHours !== null ? `, ${formatHours(c.lastTotalHours)}` : "";
    how = `projected at ${rate}${source} from the reading of ${reading}${at}`;
  }
  return (dueHours) => (dueHours !== null ? `due at ${formatHours(dueHours)}; ${how}` : how);
}
