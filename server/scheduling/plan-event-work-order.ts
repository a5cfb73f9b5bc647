// The work order of a routine tied to an event of every port stay (issue 11): the steering gear
// tested within 12 h before each departure (SOLAS chapter V, regulation 26 — memory,
// ../shared/SOURCES.md), a check done within N h after each arrival. Such a routine has no hours
// interval and no calendar rule: it falls due once per stay. Pure.
//
// The occurrence is the first planned stay, after the routine was made, whose window opened after
// the last completion (a completion answers the stay it was done in, and any missed before it). Departure: its window opens N h before the
// departure and it is due at the departure; arrival: the window opens at the arrival and it is due
// N h after. There is no grace: once the ship has sailed untested the work is out of tolerance,
// and stays so until it is recorded — a statutory miss is shown, never rolled over silently.
// No planned stay: no work order (the routine waits for the next stay to be entered).
import type { PlanRange, WorkOrderPlan } from "./plan-work-order";
import { planRange } from "./plan-work-order";
import { shipDateOf, shipDaysBetween } from "./ship-date";
import type { CalendarWindow } from "./tolerance";
import { workOrderState } from "./work-order-state";

export type PortEvent = "departure" | "arrival";
export type EventTie = { event: PortEvent; withinHours: number };
export type StayTimes = { arrivesAt: Date; departsAt: Date };

export type EventPlanInput = {
  tie: EventTie;
  /** The vessel's port stays, any order. */
  stays: readonly StayTimes[];
  /** When the routine was made: stays before it do not count. */
  createdAt: Date;
  /** The last approved completion: it answers every stay whose window had opened by then. */
  lastDone: Date | null;
  now: Date;
  timeZone: string;
};

const HOUR_MS = 3_600_000;

/** The event's window in one stay. */
export function eventWindow(tie: EventTie, stay: StayTimes): CalendarWindow {
  const within = tie.withinHours * HOUR_MS;
  if (tie.event === "departure") {
    const at = stay.departsAt;
    return { opensAt: new Date(Math.max(at.getTime() - within, stay.arrivesAt.getTime())), dueAt: at, graceEndsAt: at };
  }
  const due = new Date(Math.min(stay.arrivesAt.getTime() + within, stay.departsAt.getTime()));
  return { opensAt: stay.arrivesAt, dueAt: due, graceEndsAt: due };
}

export function planEventWorkOrder(input: EventPlanInput): WorkOrderPlan | null {
  const { tie, now, timeZone } = input;
  const next = [...input.stays]
    .map((stay) => eventWindow(tie, stay))
    .filter((w) => w.dueAt > input.createdAt && (input.lastDone === null || w.opensAt > input.lastDone))
    .sort((a, b) => a.dueAt.getTime() - b.dueAt.getTime())[0];
  if (!next) return null;
  const range: PlanRange = planRange({ calendar: next, hours: null }, null, timeZone);
  return {
    dueHours: null,
    projectedDate: null,
    calendarDue: next.dueAt,
    dueDate: next.dueAt,
    governing: "calendar",
    remainingHours: null,
    remainingDays: shipDaysBetween(shipDateOf(now, timeZone), shipDateOf(next.dueAt, timeZone)),
    ...range,
    calendarWindow: next,
    hoursWindow: null,
    state: workOrderState({ now, currentHours: null, calendar: next }),
    rules: { hours: null, calendar: null },
  };
}
