import type { Metadata } from "next";
import { requireCompanyAdmin } from "@/server/admin/page-access";
import { PeopleAdmin } from "../_components/people-admin";

export const metadata: Metadata = { title: "People · Company" };

export default async function CompanyPeoplePage() {
  await requireCompanyAdmin();
  return (
    <main>
      <h1 className="sr-only">The company’s people</h1>
      <PeopleAdmin />
    </main>
  );
}
