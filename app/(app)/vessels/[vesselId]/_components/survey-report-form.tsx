import { shipDay } from "@/server/format/hours";
import { addShipDays, addShipMonths, shipDateFromKey, shipDateKey } from "@/server/scheduling/ship-date";

/**
 * The vessel's survey and audit report for a period: a plain form whose answer is a PDF download,
 * so it works without the page's scripts. The period starts as the twelve months up to today.
 */
export function SurveyReportForm({ vesselId, timeZone }: { vesselId: string; timeZone: string }) {
  const today = shipDay(new Date(), timeZone);
  const yearAgo = shipDateKey(addShipDays(addShipMonths(shipDateFromKey(today), -12), 1));
  return (
    <section aria-labelledby="survey-report-heading" className="no-print mt-4 panel p-4">
      <h2 id="survey-report-heading" className="font-semibold">
        Survey and audit report
      </h2>
      <p className="mt-1 text-sm text-ink-600 dark:text-ink-300">
        Critical and class-related routines, open deferrals and defects, readings coverage and work done late in a period
        of ship’s days, as a PDF to hand to a surveyor or auditor.
      </p>
      <form method="get" action={`/api/vessels/${vesselId}/reports/survey`} className="mt-3 flex flex-wrap items-end gap-3">
        <label className="grid gap-1">
          <span className="label">From</span>
          <input className="field" type="date" name="from" defaultValue={yearAgo} max={today} required />
        </label>
        <label className="grid gap-1">
          <span className="label">To</span>
          <input className="field" type="date" name="to" defaultValue={today} max={today} required />
        </label>
        <button type="submit" className="btn-quiet">
          Survey report (PDF)
        </button>
      </form>
    </section>
  );
}
