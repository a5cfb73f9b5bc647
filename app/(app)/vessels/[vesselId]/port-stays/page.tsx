import type { Metadata } from "next";
import { requirePageVessel } from "@/server/auth/access";
import { PortStaysView } from "./_components/port-stays-view";

export const metadata: Metadata = { title: "Port stays" };

export default async function PortStaysPage({ params }: { params: Promise<{ vesselId: string }> }) {
  const { vesselId } = await params;
  const { vessel } = await requirePageVessel(vesselId);
  return (
    <main>
      <PortStaysView vesselId={vessel.id} timeZone={vessel.timeZone} />
    </main>
  );
}
