import { requirePageVessel } from "@/server/auth/access";
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
      {children}
    </div>
  );
}
