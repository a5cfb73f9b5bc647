import type { Metadata } from "next";
import { requirePageAccess } from "@/server/auth/access";
import { ROLE_LABEL } from "@/server/auth/roles";
import { loadMailPreferences } from "@/server/reminders/preferences-queries";
import { MailPreferencesForm } from "./_components/mail-preferences-form";

export const metadata: Metadata = { title: "My e-mail" };

export default async function AccountPage() {
  const access = await requirePageAccess();
  const preferences = await loadMailPreferences(access);
  return (
    <main className="grid gap-4">
      <div>
        <h1 className="text-lg font-semibold">My e-mail</h1>
        <p className="text-ink-600 dark:text-ink-300">
          {access.user.name} · {ROLE_LABEL[access.role]} · {access.company.name}
        </p>
      </div>
      <MailPreferencesForm initial={preferences} />
    </main>
  );
}
