import type { Metadata } from "next";
import { requireCompanyAdmin } from "@/server/admin/page-access";
import { loadCompanySettings } from "@/server/deferrals/settings";
import { loadRankNamesView } from "@/server/admin/rank-names";
import { DeferralSettingForm } from "./_components/deferral-setting-form";
import { RankNamesForm } from "./_components/rank-names-form";

export const metadata: Metadata = { title: "Settings · Company" };

export default async function CompanySettingsPage() {
  const access = await requireCompanyAdmin();
  const [settings, rankNames] = await Promise.all([loadCompanySettings(access), loadRankNamesView(access)]);
  return (
    <main className="grid gap-4">
      <h1 className="sr-only">The company’s settings</h1>
      <DeferralSettingForm initial={settings} />
      <RankNamesForm initial={rankNames} />
    </main>
  );
}
