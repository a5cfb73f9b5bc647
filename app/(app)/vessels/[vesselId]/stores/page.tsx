import type { Metadata } from "next";
import { requirePageVessel } from "@/server/auth/access";
import { StoresView } from "./_components/stores-view";

export const metadata: Metadata = { title: "Stores" };

export default async function StoresPage({ params }: { params: Promise<{ vesselId: string }> }) {
  const { vesselId } = await params;
  const { vessel } = await requirePageVessel(vesselId);
  return (
    <main>
      <StoresView vesselId={vessel.id} />
    </main>
  );
}
