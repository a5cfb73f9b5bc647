import type { Metadata } from "next";
import { ClassItemsView } from "@/app/_components/class-items-table";
import { requirePageVessel } from "@/server/auth/access";
import { ClassItemsQuery } from "@/server/class-items/contract";
import { listClassItems } from "@/server/class-items/queries";
import { SurveyReportForm } from "../_components/survey-report-form";

export const metadata: Metadata = { title: "Class items" };

export default async function VesselClassItemsPage({
  params,
  searchParams,
}: {
  params: Promise<{ vesselId: string }>;
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const { vesselId } = await params;
  const { access, vessel } = await requirePageVessel(vesselId);
  const raw = await searchParams;
  const { sort } = ClassItemsQuery.catch({ sort: "reference" }).parse({
    sort: typeof raw.sort === "string" ? raw.sort : undefined,
  });
  const items = await listClassItems(access, [vessel.id], sort);
  return (
    <main className="space-y-3">
      <ClassItemsView
        heading={`Class items of ${vessel.name}`}
        intro={`The routines marked class-related, as the surveyor goes through them: ${items.length} ${
          items.length === 1 ? "item" : "items"
        }. Days are the ship’s. Class rules, the society’s survey status and the surveyor’s findings prevail over this list.`}
        items={items}
        sort={sort}
        base={`/vessels/${vessel.id}/class-items`}
        showVessel={false}
      />
      <SurveyReportForm vesselId={vessel.id} timeZone={vessel.timeZone} />
    </main>
  );
}
