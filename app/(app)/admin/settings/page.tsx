import type { Metadata } from "next";
import { requireCompanyAdmin } from "@/server/admin/page-access";
import { loadCompanySettings } from "@/server/deferrals/settings";
import { DeferralSettingForm } from "./_components/deferral-setting-form";

export const metadata: Metadata = { title: "Settings · Company" };

export default async function CompanySettingsPage() {
  const access = await requireCompanyAdmin();
  const settings = await loadCompanySettings(access);
  return (
    <main className="grid gap-4">
      <h1 className="sr-only">The company’s settings</h1>
      <DeferralSettingForm initial={settings} />
    </main>
  );
}
