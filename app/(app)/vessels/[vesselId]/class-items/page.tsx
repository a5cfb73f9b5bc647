import type { Metadata } from "next";
import { ClassItemsSort, ClassItemsTable } from "@/app/_components/class-items-table";
import { PrintButton } from "@/app/_components/print-button";
import { requirePageVessel } from "@/server/auth/access";
import { ClassItemsQuery } from "@/server/class-items/contract";
import { listClassItems } from "@/server/class-items/queries";

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
  const { sort } = ClassItemsQuery.catch({ sort: "reference" }).parse({ sort: typeof raw.sort === "string" ? raw.sort : undefined });
  const items = await listClassItems(access, [vessel.id], sort);
  const base = `/vessels/${vessel.id}/class-items`;
  return (
    <main className="space-y-3">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 id="class-items-heading" className="text-lg font-bold">
            Class items of {vessel.name}
          </h1>
          <p className="max-w-3xl text-sm text-ink-600 dark:text-ink-300">
            The routines marked class-related, as the surveyor goes through them: {items.length}{" "}
            {items.length === 1 ? "item" : "items"}. Days are the ship’s. Class rules, the society’s survey status and
            the surveyor’s findings prevail over this list.
          </p>
        </div>
        <div className="no-print">
          <PrintButton />
        </div>
      </div>
      <ClassItemsSort sort={sort} base={base} />
      <ClassItemsTable items={items} showVessel={false} labelledBy="class-items-heading" />
    </main>
  );
}
