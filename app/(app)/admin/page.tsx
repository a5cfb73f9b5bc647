import type { Metadata } from "next";
import Link from "next/link";
import { requireCompanyAdmin } from "@/server/admin/page-access";
import { listCompanyPeople } from "@/server/admin/people-queries";
import { listCompanyVessels } from "@/server/admin/queries";
import { companyGaps } from "@/server/admin/rules";

export const metadata: Metadata = { title: "Company" };

export default async function CompanyOverviewPage() {
  const access = await requireCompanyAdmin();
  const [vessels, people] = await Promise.all([listCompanyVessels(access), listCompanyPeople(access)]);
  const inService = vessels.filter((v) => !v.retiredAt).length;
  const active = people.filter((p) => !p.disabled);
  const admins = active.filter((p) => p.role === "admin").length;
  const { unstaffedVessels, peopleWithoutVessel, soleAdmin } = companyGaps(vessels, people);
  const nothing = unstaffedVessels.length === 0 && peopleWithoutVessel.length === 0 && !soleAdmin;

  return (
    <main className="grid gap-4">
      <h1 className="sr-only">Company overview</h1>
      <div className="grid gap-3 sm:grid-cols-2">
        <Figure href="/admin/vessels" title="Vessels" value={inService}>
          in service{vessels.length > inService ? ` · ${vessels.length - inService} retired` : ""}
        </Figure>
        <Figure href="/admin/people" title="People" value={active.length}>
          active · {admins} administrator{admins === 1 ? "" : "s"}
          {people.length > active.length ? ` · ${people.length - active.length} disabled` : ""}
        </Figure>
      </div>
      <section className="panel p-4" aria-labelledby="overview-attention">
        <h2 id="overview-attention" className="mb-2 font-semibold">
          Needs a look
        </h2>
        {nothing ? (
          <p className="text-ink-600 dark:text-ink-300">
            Nothing: every vessel has people assigned and everyone on board sees a vessel.
          </p>
        ) : (
          <ul className="grid list-disc gap-1 pl-5 text-ink-700 dark:text-ink-200">
            {unstaffedVessels.map((v) => (
              <li key={v.id}>
                <span className="font-medium">{v.name}</span> has nobody assigned: nobody on board can enter its Hour
                log.
              </li>
            ))}
            {peopleWithoutVessel.map((p) => (
              <li key={p.id}>
                <span className="font-medium">{p.name}</span> is assigned to no vessel and sees none.
              </li>
            ))}
            {soleAdmin && (
              <li>
                {soleAdmin.isYou ? "You are" : `${soleAdmin.name} is`} the only active administrator; a second one can
                stand in during leave.
              </li>
            )}
          </ul>
        )}
      </section>
    </main>
  );
}

function Figure({
  href,
  title,
  value,
  children,
}: {
  href: string;
  title: string;
  value: number;
  children: React.ReactNode;
}) {
  return (
    <section className="panel p-4">
      <h2 className="font-semibold">
        <Link href={href} className="hover:underline">
          {title}
        </Link>
      </h2>
      <p className="mt-1 text-2xl font-bold tabular-nums">{value}</p>
      <p className="text-ink-600 dark:text-ink-300">{children}</p>
    </section>
  );
}
