import type { Metadata } from "next";
import { requirePageVessel } from "@/server/auth/access";
import { RoutinesView } from "./_components/routines-view";

export const metadata: Metadata = { title: "Routines" };

export default async function RoutinesPage({ params }: { params: Promise<{ vesselId: string }> }) {
  const { vesselId } = await params;
  const { vessel } = await requirePageVessel(vesselId);
  return (
    <main>
      <h1 className="sr-only">Routines of {vessel.name}</h1>
      <RoutinesView vesselId={vessel.id} />
    </main>
  );
}
