import type { Metadata } from "next";
import { requirePageParams, requirePageVessel } from "@/server/auth/access";
import { PortStayParams } from "@/server/http/params";
import { StayView } from "./_components/stay-view";

export const metadata: Metadata = { title: "Port stay" };

export default async function PortStayPage({ params }: { params: Promise<{ vesselId: string; stayId: string }> }) {
  const { vesselId, ...ids } = await params;
  const { vessel } = await requirePageVessel(vesselId);
  const { stayId } = requirePageParams(PortStayParams, ids);
  return (
    <main>
      <StayView vesselId={vessel.id} stayId={stayId} />
    </main>
  );
}
