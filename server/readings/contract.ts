// The Hour log's input and output, shared by the form (react-hook-form + zod) and the route handler.
import { z } from "zod";
import { enteredDay } from "@/server/http/dates";

export const MAX_METER_HOURS = 9_999_999.9;

/** A meter value as typed: digits with at most one decimal; "12 431,5" and "12,431.5" are accepted. */
export const MeterValue = z
  .union([z.number(), z.string()])
  .transform((raw, ctx) => {
    const text = typeof raw === "number" ? String(raw) : raw.trim().replace(/[\s_]/g, "");
    const normalised = /^\d{1,3}(,\d{3})+(\.\d+)?$/.test(text) ? text.replace(/,/g, "") : text.replace(",", ".");
    if (!/^\d+(\.\d)?$/.test(normalised)) {
      ctx.addIssue({
        code: "custom",
        message: "Enter the meter value in hours, with at most one decimal (e.g. 12431.5).",
      });
      return z.NEVER;
    }
    const value = Number(normalised);
    if (value > MAX_METER_HOURS) {
      ctx.addIssue({ code: "custom", message: "That is more hours than a meter can show (9,999,999.9 h)." });
      return z.NEVER;
    }
    return value;
  });

export const SHIP_DAY_FORMAT = "Pick the ship's day as a date (YYYY-MM-DD).";
/** The ship's day of a reading: something that happened (server/http/dates.ts says the range). */
export const ShipDay = enteredDay("recorded", "The reading’s ship’s day", SHIP_DAY_FORMAT);
export const ShipClock = z
  .string()
  .regex(/^([01]\d|2[0-3]):[0-5]\d$/, { message: "Enter the ship's time as HH:MM, 24-hour clock." });

export const ReadingEntry = z.object({
  counterId: z.string().uuid({ message: "This is not a counter id." }),
  value: MeterValue,
  remark: z.string().trim().max(500, { message: "Keep the remark under 500 characters." }).optional(),
});

export const ReadingBatchInput = z.object({
  shipDay: ShipDay,
  time: ShipClock,
  entries: z
    .array(ReadingEntry)
    .min(1, { message: "Enter at least one reading." })
    .max(200, { message: "At most 200 readings at once." }),
});
export type ReadingBatchInput = z.input<typeof ReadingBatchInput>;
export type ReadingBatch = z.output<typeof ReadingBatchInput>;

export const ReadingHistoryQuery = z.object({
  counterId: z.string().uuid({ message: "counterId must be a counter id." }),
  days: z.coerce
    .number({ message: "days must be a number." })
    .int({ message: "days must be a whole number." })
    .min(1, { message: "days must be at least 1." })
    .max(3660, { message: "days can be at most 3660." })
    .default(90),
});

export type LastReading = { readAt: string; meterValue: number; totalHours: number; enteredBy: string | null };

export type HourLogCounter = {
  id: string;
  name: string;
  segment: number;
  plannedHoursPerDay: number;
  /** The worker's running rate; null until it has run. */
  rate: { hoursPerDay: number; basis: "measured" | "planned" } | null;
  components: { code: string; name: string }[];
  last: LastReading | null;
};

export type HourLogView = {
  vessel: { id: string; name: string; code: string; timeZone: string };
  now: string;
  canWrite: boolean;
  counters: HourLogCounter[];
};

export type DailyHours = { day: string; hours: number };

/** One entry of a reading's audit trail. */
export type ReadingCorrectionEntry = {
  id: string;
  kind: "corrected" | "removed";
  readAt: string;
  oldMeterValue: number;
  /** Null for a removal. */
  newMeterValue: number | null;
  reason: string;
  /** Who corrected it; null once that user is gone. */
  by: string | null;
  at: string;
};

export type HistoryReading = {
  id: string;
  readAt: string;
  /** The ship's day and the zone the ship kept when it was read (its clock changes on passage). */
  shipDay: string;
  zone: string;
  meterValue: number;
  totalHours: number;
  segment: number;
  remark: string | null;
  /** Its corrections, newest first; empty for a reading as entered. */
  corrections: ReadingCorrectionEntry[];
};

export type ReadingHistory = {
  counter: { id: string; name: string; segment: number };
  readings: HistoryReading[];
  /** Readings of the window that were removed, newest first: the audit keeps them. */
  removals: ReadingCorrectionEntry[];
  daily: DailyHours[];
};

export type ReadingBatchResult = { saved: number; readAt: string };

// Corrections (PATCH/DELETE /api/vessels/[vesselId]/readings/[readingId]): the value and the
// remark only — the instant is what the neighbours are checked at, so a reading is moved by
// removing it and entering it again.
export const CorrectionReason = z
  .string({ message: "Say why the reading is corrected (at least 5 characters)." })
  .trim()
  .min(5, { message: "Say why the reading is corrected, in at least 5 characters." })
  .max(500, { message: "Keep the reason under 500 characters." });

export const ReadingCorrectionInput = z.object({
  value: MeterValue,
  remark: z.string().trim().max(500, { message: "Keep the remark under 500 characters." }).optional(),
  reason: CorrectionReason,
});
export type ReadingCorrectionInput = z.input<typeof ReadingCorrectionInput>;
export type ReadingCorrection = z.output<typeof ReadingCorrectionInput>;

export const ReadingRemovalInput = z.object({ reason: CorrectionReason });
export type ReadingRemovalInput = z.input<typeof ReadingRemovalInput>;

export type ReadingCorrectionResult = {
  reading: { id: string; readAt: string; meterValue: number; totalHours: number; remark: string | null } | null;
  correction: ReadingCorrectionEntry;
};
