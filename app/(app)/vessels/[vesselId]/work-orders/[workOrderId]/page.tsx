import type { Metadata } from "next";
import { requirePageVessel } from "@/server/auth/access";
import { WorkOrderView } from "./_components/work-order-view";

export const metadata: Metadata = { title: "Work order" };

export default async function WorkOrderPage({
  params,
}: {
  params: Promise<{ vesselId: string; workOrderId: string }>;
}) {
  const { vesselId, workOrderId } = await params;
  const { vessel } = await requirePageVessel(vesselId);
  return (
    <main>
      <WorkOrderView vesselId={vessel.id} workOrderId={workOrderId} />
    </main>
  );
}
