import type { Metadata } from "next";
import { Suspense } from "react";
import { FleetRequisitions } from "./_components/fleet-requisitions";

export const metadata: Metadata = { title: "Requisitions" };

export default function RequisitionsPage() {
  return (
    <main>
      <Suspense>
        <FleetRequisitions />
      </Suspense>
    </main>
  );
}
