import type { Metadata } from "next";
import { Suspense } from "react";
import { requirePageVessel } from "@/server/auth/access";
import { RequisitionsView } from "./_components/requisitions-view";

export const metadata: Metadata = { title: "Requisitions" };

export default async function RequisitionsPage({ params }: { params: Promise<{ vesselId: string }> }) {
  const { vesselId } = await params;
  const { vessel } = await requirePageVessel(vesselId);
  return (
    <main>
      <Suspense>
        <RequisitionsView vesselId={vessel.id} />
      </Suspense>
    </main>
  );
}
