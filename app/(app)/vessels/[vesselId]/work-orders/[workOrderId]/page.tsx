import type { Metadata } from "next";
import { requirePageParams, requirePageVessel } from "@/server/auth/access";
import { WorkOrderParams } from "@/server/http/params";
import { RecordTrail } from "@/app/_components/record-trail";
import { WorkOrderView } from "./_components/work-order-view";

export const metadata: Metadata = { title: "Work order" };

export default async function WorkOrderPage({
  params,
}: {
  params: Promise<{ vesselId: string; workOrderId: string }>;
}) {
  const { vesselId, ...ids } = await params;
  const { vessel } = await requirePageVessel(vesselId);
  const { workOrderId } = requirePageParams(WorkOrderParams, ids);
  return (
    <main className="space-y-4">
      <WorkOrderView vesselId={vessel.id} workOrderId={workOrderId} />
      <RecordTrail vesselId={vessel.id} table="work_order" record={workOrderId} />
    </main>
  );
}
