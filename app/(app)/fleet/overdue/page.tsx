import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { requirePageAccess } from "@/server/auth/access";
import { can } from "@/server/auth/roles";
import { OverdueView } from "./_components/overdue-view";

export const metadata: Metadata = { title: "Overdue work — fleet" };

export default async function FleetOverduePage() {
  const access = await requirePageAccess();
  if (!can(access.role, "fleet:read")) notFound();
  return (
    <main>
      <h1 className="mb-1 text-lg font-bold">Overdue work across the fleet</h1>
      <p className="mb-4 text-ink-600 dark:text-ink-300">
        Every work order of {access.company.name} that is late or out of tolerance, the worst first: out of tolerance
        before late, critical and class-related work first, then the longest overdue.
      </p>
      <OverdueView />
    </main>
  );
}
