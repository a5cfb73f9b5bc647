import type { Metadata } from "next";
import Link from "next/link";
import { redirect } from "next/navigation";
import { ageOf } from "@/app/_components/relative-age";
import { requirePageAccess } from "@/server/auth/access";
import { can, seesWholeFleet } from "@/server/auth/roles";
import { formatShipTime } from "@/server/format/hours";
import { listAccessibleVessels } from "@/server/vessels/queries";

export const metadata: Metadata = { title: "Vessels" };

export default async function VesselsPage() {
  const access = await requirePageAccess();
  const now = new Date();
  const vessels = await listAccessibleVessels(access, now);
  if (vessels.length === 1 && !seesWholeFleet(access.role)) redirect(`/vessels/${vessels[0]!.id}/hour-log`);

  return (
    <main>
      {can(access.role, "fleet:read") && (
        <Link
          href="/fleet"
          className="mb-4 block panel border-l-4 border-l-tide-500 p-4 hover:bg-ink-50 dark:hover:bg-ink-850"
        >
          <span className="block text-base font-semibold">Fleet board →</span>
          <span className="text-ink-600 dark:text-ink-300">
            Every vessel at a glance: work out of tolerance and late, vessels that stopped reporting, on-time rate and
            the deferral requests awaiting your decision.
          </span>
        </Link>
      )}
      <h1 className="mb-4 text-lg font-bold">Vessels</h1>
      {vessels.length === 0 ? (
        <div className="panel p-6 text-ink-600 dark:text-ink-300">
          <p className="font-medium">No vessel is assigned to you yet.</p>
          <p>Ask your company administrator to assign you to your vessel.</p>
        </div>
      ) : (
        <ul className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
          {vessels.map((v) => {
            const stale = v.stoppedReporting;
            return (
              <li key={v.id} className="panel p-4">
                <div className="flex items-baseline justify-between gap-2">
                  <h2 className="text-base font-semibold">
                    <Link href={`/vessels/${v.id}/hour-log`} className="hover:underline">
                      {v.name}
                    </Link>
                  </h2>
                  <span className="font-mono text-xs text-ink-500">
                    {v.code} · IMO {v.imoNumber}
                  </span>
                </div>
                <dl className="mt-2 grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5 text-ink-600 dark:text-ink-300">
                  <dt>Counters</dt>
                  <dd>{v.counters}</dd>
                  <dt>Last reading</dt>
                  <dd>
                    {v.lastReadingAt ? (
                      <>
                        {formatShipTime(v.lastReadingAt, v.timeZone)}{" "}
                        <span className={stale ? "font-semibold text-alarm-600 dark:text-alarm-300" : "text-ink-500"}>
                          ({ageOf(v.lastReadingAt, now)}
                          {stale ? ", overdue" : ""})
                        </span>
                      </>
                    ) : (
                      <span className="font-semibold text-alarm-600">none yet</span>
                    )}
                  </dd>
                  <dt>Ship’s time zone</dt>
                  <dd>{v.timeZone}</dd>
                </dl>
                <div className="mt-3 flex gap-2">
                  <Link href={`/vessels/${v.id}/hour-log`} className="btn-quiet">
                    Hour log
                  </Link>
                  <Link href={`/vessels/${v.id}/register`} className="btn-quiet">
                    Machinery register
                  </Link>
                </div>
              </li>
            );
          })}
        </ul>
      )}
    </main>
  );
}
