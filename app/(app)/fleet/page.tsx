import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { requirePageAccess } from "@/server/auth/access";
import { can } from "@/server/auth/roles";
import { FleetBoardView } from "./_components/fleet-board-view";

export const metadata: Metadata = { title: "Fleet board" };

export default async function FleetBoardPage() {
  const access = await requirePageAccess();
  // A page the role may not use is not there for it, as for another company's vessel.
  if (!can(access.role, "fleet:read")) notFound();
  return (
    <main>
      <div className="mb-1 flex flex-wrap items-baseline justify-between gap-2">
        <h1 className="text-lg font-bold">Fleet board</h1>
        <span className="flex gap-2">
          <Link className="btn-quiet" href="/fleet/class-items">
            Class items, every vessel
          </Link>
          <Link className="btn-quiet" href="/fleet/overdue">
            Overdue list, every vessel
          </Link>
        </span>
      </div>
      <p className="mb-4 text-ink-600 dark:text-ink-300">
        Every vessel of {access.company.name} at a glance: critical and class-related work gone out of tolerance or late
        comes first. Figures are the worker’s, taken after each recompute and once a day.
      </p>
      <FleetBoardView />
    </main>
  );
}
