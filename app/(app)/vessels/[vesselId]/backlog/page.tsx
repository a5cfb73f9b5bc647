import type { Metadata } from "next";
import { Suspense } from "react";
import { requirePageVessel } from "@/server/auth/access";
import { SurveyReportForm } from "../_components/survey-report-form";
import { BacklogView } from "./_components/backlog-view";

export const metadata: Metadata = { title: "Backlog" };

export default async function BacklogPage({ params }: { params: Promise<{ vesselId: string }> }) {
  const { vesselId } = await params;
  const { vessel } = await requirePageVessel(vesselId);
  return (
    <main>
      <h1 className="sr-only">Backlog of {vessel.name}</h1>
      {/* The filters live in the URL: useSearchParams needs a Suspense boundary. */}
      <Suspense fallback={<div className="h-96 animate-pulse panel" aria-busy="true" />}>
        <BacklogView vesselId={vessel.id} timeZone={vessel.timeZone} />
      </Suspense>
      <SurveyReportForm vesselId={vessel.id} timeZone={vessel.timeZone} />
    </main>
  );
}
