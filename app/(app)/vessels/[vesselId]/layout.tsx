import { requirePageVessel } from "@/server/auth/access";
import { formatShipDate } from "@/server/format/hours";
import { VesselTabs } from "./_components/vessel-tabs";

export default async function VesselLayout({
  children,
  params,
}: {
  children: React.ReactNode;
  params: Promise<{ vesselId: string }>;
}) {
  const { vesselId } = await params;
  const { vessel } = await requirePageVessel(vesselId);
  return (
    <div>
      <div className="no-print mb-4 flex flex-wrap items-end justify-between gap-3 border-b border-ink-200 dark:border-ink-800">
        <div className="pb-2">
          <p className="font-mono text-xs text-ink-500">
            {vessel.code} · IMO {vessel.imoNumber} · {vessel.timeZone}
          </p>
          <p className="text-lg font-bold">{vessel.name}</p>
        </div>
        <VesselTabs vesselId={vessel.id} />
      </div>
      {vessel.retiredAt && (
        <p className="no-print mb-4 rounded-md border border-brass-300 bg-brass-50 px-3 py-2 text-sm font-medium text-brass-900 dark:border-brass-700 dark:bg-brass-950 dark:text-brass-100">
          Retired on {formatShipDate(vessel.retiredAt, vessel.timeZone)}: {vessel.name}’s records can be read but
          not changed. An administrator can return it to service under Company → Vessels.
        </p>
      )}
      {children}
    </div>
  );
}
