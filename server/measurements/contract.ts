// What the trends route answers (GET /api/vessels/[vesselId]/routines/[routineId]/trends): each
// measurement of a routine with its series, fitted line and projection (trend.ts), and the warning
// when the line reaches its limit before the routine's open work order falls due. Types only.
import type { MeasurementTrend, TrendBasis } from "./trend";

export type MeasurementTrendView = MeasurementTrend & {
  /** The chart's caption (trend-words.ts `trendCaption`), in the vessel's time zone. */
  caption: string;
  /** Set when the line meets its limit before `next` falls due (trend-words.ts `warningSentence`). */
  warning: string | null;
};

export type RoutineTrends = {
  routine: { id: string; title: string; basis: TrendBasis };
  /** The counter the routine's hours are read on, with its latest reading and running rate. */
  counter: { name: string; totalHours: number; readAt: string; hoursPerDay: number | null } | null;
  /** The routine's open work order and the limits it falls due at (a deferral's in force). */
  next: { workOrderId: string; number: string; dueHours: number | null; dueDate: string | null } | null;
  measurements: MeasurementTrendView[];
};

/** One line of the daily digest: a work order whose measurement reaches its limit before it falls due. */
export type TrendWarning = { workOrderId: string; number: string; title: string; sentence: string };
