// The Calendar's query and answer, and the planned-date change: shared by the page and the route
// handlers. Days are the ship's days ("YYYY-MM-DD" in the vessel's zone); `end` is exclusive, as
// FullCalendar gives its visible range.
import { z } from "zod";
import { enteredDay } from "@/server/http/dates";
import { HEADING_FIELDS, JOB_FIELDS } from "@/server/work-orders/fields";
import type { WorkOrderView } from "@/server/work-orders/view";

/** A six-week month grid is 42 days; a little over three months is enough for any view. */
export const MAX_CALENDAR_DAYS = 100;

const shipDay = (name: string) => z.iso.date({ message: `${name} is a ship’s day, YYYY-MM-DD.` });

const DAY = /^\d{4}-\d{2}-\d{2}$/;

function daysBetween(start: string, end: string): number {
  return (Date.parse(`${end}T00:00:00Z`) - Date.parse(`${start}T00:00:00Z`)) / 86_400_000;
}

export const CalendarQuery = z.object({ start: shipDay("start"), end: shipDay("end") }).superRefine((q, ctx) => {
  // zod runs this even when a day failed above: only two good days make a range.
  if (!DAY.test(q.start) || !DAY.test(q.end)) return;
  const days = daysBetween(q.start, q.end);
  if (days <= 0) {
    ctx.addIssue({ code: "custom", path: ["end"], message: "end must be after start." });
  } else if (days > MAX_CALENDAR_DAYS) {
    ctx.addIssue({
      code: "custom",
      path: ["end"],
      message: `Ask for at most ${MAX_CALENDAR_DAYS} days at a time (this range has ${days}).`,
    });
  }
});
export type CalendarQuery = z.output<typeof CalendarQuery>;

export const PlannedDateInput = z.object({
  plannedDate: enteredDay(
    "planned",
    "The planned day",
    "plannedDate is a ship’s day, YYYY-MM-DD, or null to clear it.",
  ).nullable(),
});
export type PlannedDateInput = z.output<typeof PlannedDateInput>;

/** The work order's own columns the Calendar shows as they are stored. */
export const CALENDAR_FIELDS = [
  ...HEADING_FIELDS,
  "plannedDate",
  "remainingHours",
  "planFrom",
  "planUntil",
  ...JOB_FIELDS,
] as const;

export type CalendarWorkOrder = WorkOrderView<(typeof CALENDAR_FIELDS)[number]> & {
  component: { code: string; name: string };
  /** The ship's day the Calendar shows it on: the planned day, else the due day (done: the day done). */
  day: string;
  /** The computed due day (the approved deferral's new limit when there is one); never replaced by a plan. */
  dueDay: string | null;
  /** The day it was done, for done work. */
  doneDay: string | null;
  /** Its due day comes from running hours projected at the counter's rate. */
  projected: boolean;
  /** How the projection was made, in words; null when not projected. */
  basis: string | null;
  /** The hours limit in force: the approved deferral's when there is one. */
  dueHours: number | null;
  pendingDeferral: boolean;
};

export type CalendarPortStay = {
  id: string;
  port: string;
  arrivesAt: string;
  departsAt: string;
  /** First and last ship's day of the stay (inclusive). */
  firstDay: string;
  lastDay: string;
  /** Hours of the engine-stop slot; null when the engine may not stop. */
  engineStopHours: number | null;
  packageAccepted: boolean;
};

export type CalendarRange = {
  start: string;
  end: string;
  timeZone: string;
  workOrders: CalendarWorkOrder[];
  portStays: CalendarPortStay[];
};

export type PlannedDateResult = {
  id: string;
  number: string;
  plannedDate: string | null;
  dueDay: string | null;
};
