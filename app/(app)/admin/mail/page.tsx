import type { Metadata } from "next";
import { requireCompanyAdmin } from "@/server/admin/page-access";
import { MailAdmin } from "./_components/mail-admin";

export const metadata: Metadata = { title: "Mail · Company" };

export default async function CompanyMailPage() {
  await requireCompanyAdmin();
  return (
    <main>
      <h1 className="sr-only">The company’s mail</h1>
      <MailAdmin />
    </main>
  );
}
