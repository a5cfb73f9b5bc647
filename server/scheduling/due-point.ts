// Due points of a routine (PRODUCT.md, "The computation Keelson owns", point 2): hours = last done
// counter value + interval, turned into a projected date with the counter's running rate;
// calendar = the rule's next occurrence after the last completion (floating) or the fixed
// anniversary (anchored); whichever comes first is the due date.
import { invalidInput } from "@/server/http/problem";
import { round1 } from "@/server/readings/rules";
import { nextOccurrenceAfter, type CalendarRule } from "./calendar-rule";
import { endOfShipDate, shipDateOf, shipDaysBetween } from "./ship-date";
import type { CalendarWindow } from "./tolerance";

const DAY_MS = 86_400_000;

export type CounterPoint = { at: Date; counterHours: number };

export type DuePointInput = {
  intervalHours?: number | null;
  calendarRule?: CalendarRule | null;
  /**
   * The calendar limit keeps a fixed anniversary. Pass `routine.anchored && rule.keepsAnniversary`:
   * a tolerance rule that does not keep the anniversary makes the routine behave floating.
   */
  anchored: boolean;
  lastDone?: CounterPoint | null;
  /** Where a routine never done counts from: a date and the counter value on it. */
  baseline?: CounterPoint | null;
  /**
   * Anchored routines: the anniversary the next work order aims at. Set it to the first due date
   * when the routine is created and, on each completion, to `nextAnchoredDue(...).nextDue`.
   * A floating routine with no completion and no baseline takes it as its first due date.
   */
  anchorDate?: Date | null;
  /** The counter's latest reading and running rate (running-rate.ts). */
  counter?: {
    totalHours: number;
    readAt: Date;
    hoursPerDay: number;
    /** When the counter passed hours it has passed, from its readings: a passed due point stays put. */
    passedAt?: (hours: number) => Date | null;
  } | null;
  now: Date;
  timeZone: string;
};

export type DuePoint = {
  dueHours: number | null;
  /** When the counter reaches dueHours at the running rate from the last reading; null at a rate of 0. */
  projectedDate: Date | null;
  /** The calendar due point: the end of the due ship's day. */
  calendarDue: Date | null;
  /** The earlier of projectedDate and calendarDue; null when neither is known. */
  dueDate: Date | null;
  governing: "hours" | "calendar";
  /** Hours left at the last reading (negative when past). */
  remainingHours: number | null;
  /** Ship's days from today to the due date's day (0 = due today, negative = past). */
  remainingDays: number | null;
};

function needBaseline(): never {
  throw invalidInput([
    { field: "baseline", message: "A routine never done needs a baseline: the date and counter value it counts from." },
  ]);
}

export function computeDuePoint(input: DuePointInput): DuePoint {
  const { intervalHours, calendarRule, counter, timeZone } = input;
  const hasHours = intervalHours !== undefined && intervalHours !== null;
  if (!hasHours && !calendarRule) {
    throw invalidInput([
      { field: "intervalHours", message: "Give an interval in running hours, a calendar rule, or both." },
    ]);
  }
  if (hasHours && !(intervalHours > 0)) {
    throw invalidInput([{ field: "intervalHours", message: "The interval is a number of hours above 0." }]);
  }
  const start = input.lastDone ?? input.baseline ?? null;

  let dueHours: number | null = null;
  let remainingHours: number | null = null;
  let projectedDate: Date | null = null;
  if (hasHours) {
    if (!start) needBaseline();
    dueHours = round1(start.counterHours + intervalHours);
    if (counter) {
      const remaining = dueHours - counter.totalHours;
      remainingHours = round1(remaining);
      const passed = remaining <= 0 ? (counter.passedAt?.(dueHours) ?? null) : null;
      if (passed) projectedDate = passed;
      else if (counter.hoursPerDay > 0)
        projectedDate = new Date(counter.readAt.getTime() + (remaining / counter.hoursPerDay) * DAY_MS);
    }
  }

  let calendarDue: Date | null = null;
  if (calendarRule) {
    const anchor = input.anchorDate ?? null;
    if (input.anchored) {
      if (!anchor) {
        throw invalidInput([{ field: "anchorDate", message: "An anchored routine needs its anniversary date." }]);
      }
      calendarDue = endOfShipDate(shipDateOf(anchor, timeZone), timeZone);
    } else if (start) {
      calendarDue = nextOccurrenceAfter(calendarRule, start.at, start.at, timeZone);
    } else if (anchor) {
      calendarDue = endOfShipDate(shipDateOf(anchor, timeZone), timeZone);
    } else {
      needBaseline();
    }
  }

  const calendarFirst = calendarDue !== null && (projectedDate === null || calendarDue < projectedDate);
  const governing = calendarFirst || !hasHours ? "calendar" : "hours";
  const dueDate = governing === "calendar" ? calendarDue : projectedDate;
  const remainingDays =
    dueDate === null ? null : shipDaysBetween(shipDateOf(input.now, timeZone), shipDateOf(dueDate, timeZone));
  return { dueHours, projectedDate, calendarDue, dueDate, governing, remainingHours, remainingDays };
}

export type AnchoredDueInput = {
  /** The due point the completed work order aimed at (the anniversary). */
  previousDue: Date;
  completedAt: Date;
  /** The completed work order's window (calendarWindow of previousDue). */
  window: CalendarWindow;
  /** The routine's calendar rule: one step of it is the period (FREQ=YEARLY;INTERVAL=5 → 5 years). */
  period: CalendarRule | string;
  timeZone: string;
  /** The tolerance rule's keepsAnniversary; false makes every completion count like a floating one. */
  keepsAnniversary?: boolean;
};

export type AnchoredDue = {
  /** The next anniversary (end of its ship's day); null when the rule has ended. */
  nextDue: Date | null;
  /** False when the completion moved the anniversary. */
  anniversaryKept: boolean;
};

/**
 * The next anniversary of an anchored routine after a completion, after the renewal rules of
 * HSSC, IMO Resolution A.1104(29) (seen; the same three cases in UK SI 2023/1216 reg. 13): done
 * inside the window before the due point E → E + period; done after E → still E + period; done
 * before the window opens, on C → C + period. Anniversaries already past at completion (work done
 * more than a period late) are skipped, so the next work order is never born overdue by them.
 */
export function nextAnchoredDue(input: AnchoredDueInput): AnchoredDue {
  const { previousDue, completedAt, window, period, timeZone } = input;
  const moves = completedAt < window.opensAt || input.keepsAnniversary === false;
  // The series restarts from the completion when the anniversary moves. A rule with BY parts
  // (every year on 15 April) has fixed dates either way; its first date after E comes next.
  const after = completedAt > previousDue ? completedAt : previousDue;
  const nextDue = nextOccurrenceAfter(period, moves ? completedAt : previousDue, after, timeZone);
  return { nextDue, anniversaryKept: !moves };
}
