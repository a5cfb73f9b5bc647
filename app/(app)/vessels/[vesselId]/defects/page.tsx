import type { Metadata } from "next";
import { requirePageVessel } from "@/server/auth/access";
import { DefectsView } from "./_components/defects-view";

export const metadata: Metadata = { title: "Defects" };

export default async function DefectsPage({ params }: { params: Promise<{ vesselId: string }> }) {
  const { vesselId } = await params;
  const { vessel } = await requirePageVessel(vesselId);
  return (
    <main>
      <DefectsView vesselId={vessel.id} />
    </main>
  );
}
