import { requireCompanyAdmin } from "@/server/admin/page-access";
import { AdminTabs } from "./_components/admin-tabs";

export default async function CompanyAdminLayout({ children }: { children: React.ReactNode }) {
  const access = await requireCompanyAdmin();
  return (
    <div>
      <div className="no-print mb-4 flex flex-wrap items-end justify-between gap-3 border-b border-ink-200 dark:border-ink-800">
        <div className="pb-2">
          <p className="text-xs text-ink-500 dark:text-ink-400">Company administration</p>
          <p className="text-lg font-bold">{access.company.name}</p>
        </div>
        <AdminTabs />
      </div>
      {children}
    </div>
  );
}
