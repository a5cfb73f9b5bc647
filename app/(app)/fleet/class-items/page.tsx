import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { ClassItemsView } from "@/app/_components/class-items-table";
import { requirePageAccess } from "@/server/auth/access";
import { can } from "@/server/auth/roles";
import { ClassItemsQuery } from "@/server/class-items/contract";
import { listClassItems } from "@/server/class-items/queries";

export const metadata: Metadata = { title: "Class items — fleet" };

export default async function FleetClassItemsPage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const access = await requirePageAccess();
  if (!can(access.role, "fleet:read")) notFound();
  const raw = await searchParams;
  const { sort } = ClassItemsQuery.catch({ sort: "reference" }).parse({
    sort: typeof raw.sort === "string" ? raw.sort : undefined,
  });
  const items = await listClassItems(access, null, sort);
  return (
    <main className="space-y-3">
      <ClassItemsView
        heading="Class items across the fleet"
        intro={`Every class-related routine of ${access.company.name}’s vessels, with its last completion, due point, window, state and any deferral: ${items.length} ${
          items.length === 1 ? "item" : "items"
        }. Days are each ship’s own.`}
        items={items}
        sort={sort}
        base="/fleet/class-items"
        showVessel
      />
    </main>
  );
}
