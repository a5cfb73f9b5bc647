import type { Metadata } from "next";
import { requirePageVessel } from "@/server/auth/access";
import { HourLog } from "./_components/hour-log";
import { ShipClock } from "./_components/ship-clock";

export const metadata: Metadata = { title: "Hour log" };

export default async function HourLogPage({ params }: { params: Promise<{ vesselId: string }> }) {
  const { vesselId } = await params;
  const { vessel } = await requirePageVessel(vesselId);
  return (
    <main className="space-y-4">
      <h1 className="sr-only">Hour log of {vessel.name}</h1>
      <HourLog vesselId={vessel.id} />
      <ShipClock vesselId={vessel.id} />
    </main>
  );
}
