import Link from "next/link";
import { ageOf } from "@/app/_components/relative-age";
import { StateBadge } from "@/app/_components/state-badge";
import type { FleetBoard } from "@/server/fleet/contract";

/** The requests awaiting a decision, each linking to its work order page where it is decided. */
export function PendingDeferrals({ board, now }: { board: FleetBoard; now: Date }) {
  const items = board.pendingDeferrals;
  return (
    <section className="panel" aria-labelledby="pending-deferrals-heading">
      <h2
        id="pending-deferrals-heading"
        className="border-b border-ink-200 px-4 py-3 font-semibold dark:border-ink-800"
      >
        Pending deferrals <span className="font-normal text-ink-500">{items.length}</span>
      </h2>
      {items.length === 0 ? (
        <p className="p-4 text-ink-600 dark:text-ink-300">No deferral request awaits a decision.</p>
      ) : (
        <ul className="divide-y divide-ink-100 dark:divide-ink-850" data-testid="pending-deferrals">
          {items.map((d) => (
            <li key={d.id} className="grid gap-1 px-4 py-2 sm:grid-cols-[1fr_auto] sm:items-center">
              <div>
                <Link
                  href={`/vessels/${d.vessel.id}/work-orders/${d.workOrder.id}`}
                  className="font-mono font-semibold hover:underline"
                >
                  {d.workOrder.number}
                </Link>{" "}
                <span className="font-medium">{d.workOrder.title}</span>
                <span className="block text-xs text-ink-600 dark:text-ink-300">
                  {d.vessel.name} · asked {ageOf(d.requestedAt, now)}
                  {d.requestedBy ? ` by ${d.requestedBy}` : ""} · proposed{" "}
                  {[
                    d.proposedDueDay && `to ${d.proposedDueDay}`,
                    d.proposedDueHours !== null && `to ${d.proposedDueHours.toLocaleString("en-GB")} h`,
                  ]
                    .filter(Boolean)
                    .join(" and ")}
                </span>
              </div>
              <div className="flex flex-wrap items-center gap-1.5 text-xs">
                {d.workOrder.critical && <Flag>critical</Flag>}
                {d.workOrder.classRelated && <Flag>class</Flag>}
                {d.needsOffice && <span className="text-ink-600 dark:text-ink-300">office decides</span>}
                <StateBadge state={d.workOrder.state} />
              </div>
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}

function Flag({ children }: { children: React.ReactNode }) {
  return (
    <span className="rounded border border-alarm-500 px-1.5 py-0.5 font-bold text-alarm-700 dark:text-alarm-300">
      <span aria-hidden="true">◆ </span>
      {children}
    </span>
  );
}
