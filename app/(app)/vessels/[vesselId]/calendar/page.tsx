import type { Metadata } from "next";
import { requirePageVessel } from "@/server/auth/access";
import { can } from "@/server/auth/roles";
import { CalendarView } from "./_components/calendar-view";

export const metadata: Metadata = { title: "Calendar" };

export default async function CalendarPage({ params }: { params: Promise<{ vesselId: string }> }) {
  const { vesselId } = await params;
  const { access, vessel } = await requirePageVessel(vesselId);
  return (
    <main>
      <h1 className="sr-only">Calendar of {vessel.name}</h1>
      <CalendarView vesselId={vessel.id} timeZone={vessel.timeZone} canPlan={can(access.role, "work:plan")} />
    </main>
  );
}
