import type { Metadata } from "next";
import { requirePageVessel } from "@/server/auth/access";
import { StayView } from "./_components/stay-view";

export const metadata: Metadata = { title: "Port stay" };

export default async function PortStayPage({ params }: { params: Promise<{ vesselId: string; stayId: string }> }) {
  const { vesselId, stayId } = await params;
  const { vessel } = await requirePageVessel(vesselId);
  return (
    <main>
      <StayView vesselId={vessel.id} stayId={stayId} />
    </main>
  );
}
