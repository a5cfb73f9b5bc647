import type { Metadata } from "next";
import { requireCompanyAdmin } from "@/server/admin/page-access";
import { ToleranceRulesAdmin } from "./_components/tolerance-rules-admin";

export const metadata: Metadata = { title: "Tolerance rules · Company" };

export default async function CompanyToleranceRulesPage() {
  await requireCompanyAdmin();
  return (
    <main>
      <h1 className="sr-only">The company’s tolerance rules</h1>
      <ToleranceRulesAdmin />
    </main>
  );
}
