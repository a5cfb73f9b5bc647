import Link from "next/link";
import type { CalendarPortStay } from "@/server/calendar/contract";
import { formatHours } from "@/server/format/hours";
import { shortDay } from "./calendar-days";

type PortStaysInViewProps = { vesselId: string; stays: CalendarPortStay[] | undefined; loading: boolean };

/** The stays the calendar shows as shaded days, as links to plan each one's work package. */
export function PortStaysInView({ vesselId, stays, loading }: PortStaysInViewProps) {
  return (
    <section aria-labelledby="stays-heading" className="panel h-fit p-4">
      <h2 id="stays-heading" className="mb-2 text-sm font-semibold">
        Port stays in view
      </h2>
      {loading ? (
        <p className="text-sm text-ink-500 dark:text-ink-400">Loading…</p>
      ) : !stays?.length ? (
        <p className="text-sm text-ink-500 dark:text-ink-400">No port stay in these weeks.</p>
      ) : (
        <ul className="grid gap-3">
          {stays.map((s) => (
            <li key={s.id} className="text-sm">
              <Link
                href={`/vessels/${vesselId}/port-stays/${s.id}`}
                className="font-semibold text-tide-700 underline-offset-2 hover:underline dark:text-tide-300"
              >
                Plan {s.port}
              </Link>
              <span className="block text-xs text-ink-600 dark:text-ink-300">
                {s.firstDay === s.lastDay ? shortDay(s.firstDay) : `${shortDay(s.firstDay)} – ${shortDay(s.lastDay)}`}
                {" · "}
                {s.engineStopHours !== null ? `engine may stop ${formatHours(s.engineStopHours)}` : "engine on standby"}
                {" · "}
                {s.packageAccepted ? "package accepted" : "no package accepted yet"}
              </span>
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
