import type { Metadata } from "next";
import Link from "next/link";
import { listCompanyPeople } from "@/server/admin/people-queries";
import { listCompanyVessels } from "@/server/admin/queries";
import { requireCompanyAdmin } from "@/server/admin/page-access";
import { seesWholeFleet } from "@/server/auth/roles";

export const metadata: Metadata = { title: "Company" };

export default async function CompanyOverviewPage() {
  const access = await requireCompanyAdmin();
  const [vessels, people] = await Promise.all([listCompanyVessels(access), listCompanyPeople(access)]);
  const inService = vessels.filter((v) => !v.retiredAt);
  const active = people.filter((p) => !p.disabled);
  const admins = active.filter((p) => p.role === "admin");
  // What an administrator usually comes to fix: ships nobody can log hours for, people who see nothing.
  const unstaffed = inService.filter((v) => v.assignedPeople === 0);
  const unassigned = active.filter((p) => !seesWholeFleet(p.role) && p.vessels.length === 0);

  return (
    <main className="grid gap-4">
      <h1 className="sr-only">Company overview</h1>
      <div className="grid gap-3 sm:grid-cols-2">
        <section className="panel p-4" aria-labelledby="overview-vessels">
          <h2 id="overview-vessels" className="font-semibold">
            <Link href="/admin/vessels" className="hover:underline">
              Vessels
            </Link>
          </h2>
          <p className="mt-1 text-2xl font-bold tabular-nums">{inService.length}</p>
          <p className="text-ink-600 dark:text-ink-300">
            in service{vessels.length > inService.length ? ` · ${vessels.length - inService.length} retired` : ""}
          </p>
        </section>
        <section className="panel p-4" aria-labelledby="overview-people">
          <h2 id="overview-people" className="font-semibold">
            <Link href="/admin/people" className="hover:underline">
              People
            </Link>
          </h2>
          <p className="mt-1 text-2xl font-bold tabular-nums">{active.length}</p>
          <p className="text-ink-600 dark:text-ink-300">
            active · {admins.length} administrator{admins.length === 1 ? "" : "s"}
            {people.length > active.length ? ` · ${people.length - active.length} disabled` : ""}
          </p>
        </section>
      </div>
      <section className="panel p-4" aria-labelledby="overview-attention">
        <h2 id="overview-attention" className="mb-2 font-semibold">
          Needs a look
        </h2>
        {unstaffed.length === 0 && unassigned.length === 0 && admins.length > 1 ? (
          <p className="text-ink-600 dark:text-ink-300">Nothing: every vessel has people assigned and everyone on board sees a vessel.</p>
        ) : (
          <ul className="grid list-disc gap-1 pl-5 text-ink-700 dark:text-ink-200">
            {unstaffed.map((v) => (
              <li key={v.id}>
                <span className="font-medium">{v.name}</span> has nobody assigned: nobody on board can enter its Hour log.
              </li>
            ))}
            {unassigned.map((p) => (
              <li key={p.id}>
                <span className="font-medium">{p.name}</span> is assigned to no vessel and sees none.
              </li>
            ))}
            {admins.length === 1 && (
              <li>
                {admins[0]!.isYou ? "You are" : `${admins[0]!.name} is`} the only active administrator; a second one can stand in
                during leave.
              </li>
            )}
          </ul>
        )}
      </section>
    </main>
  );
}
