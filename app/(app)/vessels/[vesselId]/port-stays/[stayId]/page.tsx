import type { Metadata } from "next";
import { requirePageParams, requirePageVessel } from "@/server/auth/access";
import { PortStayParams } from "@/server/http/params";
import { RecordTrail } from "@/app/_components/record-trail";
import { StayView } from "./_components/stay-view";

export const metadata: Metadata = { title: "Port stay" };

export default async function PortStayPage({ params }: { params: Promise<{ vesselId: string; stayId: string }> }) {
  const { vesselId, ...ids } = await params;
  const { vessel } = await requirePageVessel(vesselId);
  const { stayId } = requirePageParams(PortStayParams, ids);
  return (
    <main className="space-y-4">
      <StayView vesselId={vessel.id} stayId={stayId} />
      <RecordTrail vesselId={vessel.id} table="port_stay" record={stayId} />
    </main>
  );
}
