// The reports' inputs: what a route handler parses before any query runs.
import { z } from "zod";
import { enteredDay } from "@/server/http/dates";
import { shipDateFromKey, shipDaysBetween } from "@/server/scheduling/ship-date";

/** The survey report's period covers at most a class cycle (PRODUCT.md: surveys on a five-year cycle). */
export const MAX_SURVEY_DAYS = 5 * 366;

/** The survey report's period of ship's days; left out, the twelve months up to today. */
export const SurveyReportQuery = z
  .object({
    from: enteredDay("history", "The period’s first day", "Enter the period’s first day as YYYY-MM-DD.").optional(),
    to: enteredDay("history", "The period’s last day", "Enter the period’s last day as YYYY-MM-DD.").optional(),
  })
  .superRefine((q, ctx) => {
    if (!q.from || !q.to) return;
    const days = shipDaysBetween(shipDateFromKey(q.from), shipDateFromKey(q.to));
    if (days < 0) ctx.addIssue({ code: "custom", path: ["to"], message: "The period’s last day is on or after its first day." });
    else if (days >= MAX_SURVEY_DAYS) {
      ctx.addIssue({ code: "custom", path: ["to"], message: "A report covers at most five years (a class cycle): shorten the period." });
    }
  });
export type SurveyReportQuery = z.output<typeof SurveyReportQuery>;
