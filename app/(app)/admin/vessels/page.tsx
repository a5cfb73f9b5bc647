import type { Metadata } from "next";
import { requireCompanyAdmin } from "@/server/admin/page-access";
import { VesselAdmin } from "../_components/vessel-admin";

export const metadata: Metadata = { title: "Vessels · Company" };

export default async function CompanyVesselsPage() {
  await requireCompanyAdmin();
  return (
    <main>
      <h1 className="sr-only">The company’s vessels</h1>
      <VesselAdmin />
    </main>
  );
}
