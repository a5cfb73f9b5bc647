import Link from "next/link";
import { KeelsonMark } from "@/app/_components/keelson-mark";
import { QueryProvider } from "@/app/_components/query-provider";
import { RankWordsProvider } from "@/app/_components/rank-words-provider";
import { loadRankNames } from "@/server/admin/rank-names";
import { ThemeToggle } from "@/app/_components/theme-toggle";
import { requirePageAccess } from "@/server/auth/access";
import { can, ROLE_LABEL } from "@/server/auth/roles";
import { listAccessibleVessels } from "@/server/vessels/queries";
import { SignOutButton } from "./_components/sign-out-button";
import { VesselSwitcher } from "./_components/vessel-switcher";

export default async function AppLayout({ children }: { children: React.ReactNode }) {
  const access = await requirePageAccess();
  const [vessels, rankNames] = await Promise.all([listAccessibleVessels(access), loadRankNames(access.company.id)]);
  return (
    <QueryProvider>
      <RankWordsProvider names={rankNames}>
        <a
          href="#main"
          className="sr-only focus:not-sr-only focus:absolute focus:top-2 focus:left-2 focus:z-50 focus:rounded focus:bg-white focus:px-3 focus:py-2"
        >
          Skip to content
        </a>
        <header className="no-print sticky top-0 z-30 border-b border-ink-200 bg-white/95 backdrop-blur dark:border-ink-800 dark:bg-ink-900/95">
          <div className="mx-auto flex max-w-7xl flex-wrap items-center gap-x-4 gap-y-2 px-4 py-2">
            <Link href="/" className="flex items-center gap-2 font-bold tracking-tight">
              <KeelsonMark />
              <span className="text-base">Keelson</span>
            </Link>
            <span className="hidden text-ink-400 sm:inline" aria-hidden="true">
              /
            </span>
            <span className="hidden text-ink-600 sm:inline dark:text-ink-300">{access.company.name}</span>
            <VesselSwitcher vessels={vessels.map(({ id, name, code }) => ({ id, name, code }))} />
            <nav aria-label="Company" className="flex items-center gap-1">
              <Link
                href="/"
                className="rounded px-2 py-1 font-medium text-ink-700 hover:bg-ink-100 dark:text-ink-200 dark:hover:bg-ink-800"
              >
                Vessels
              </Link>
              <Link
                href="/parts"
                className="rounded px-2 py-1 font-medium text-ink-700 hover:bg-ink-100 dark:text-ink-200 dark:hover:bg-ink-800"
              >
                Parts
              </Link>
              <Link
                href="/requisitions"
                className="rounded px-2 py-1 font-medium text-ink-700 hover:bg-ink-100 dark:text-ink-200 dark:hover:bg-ink-800"
              >
                Requisitions
              </Link>
              {can(access.role, "fleet:read") && (
                <Link
                  href="/fleet"
                  className="rounded px-2 py-1 font-medium text-ink-700 hover:bg-ink-100 dark:text-ink-200 dark:hover:bg-ink-800"
                >
                  Fleet board
                </Link>
              )}
              {can(access.role, "company:manage") && (
                <Link
                  href="/admin"
                  className="rounded px-2 py-1 font-medium text-ink-700 hover:bg-ink-100 dark:text-ink-200 dark:hover:bg-ink-800"
                >
                  Company
                </Link>
              )}
            </nav>
            <div className="ml-auto flex items-center gap-2">
              <span className="hidden text-right leading-tight md:block">
                <span className="block font-medium">{access.user.name}</span>
                <span className="block text-xs text-ink-500 dark:text-ink-400">{ROLE_LABEL[access.role]}</span>
              </span>
              <Link
                href="/account"
                className="rounded px-2 py-1 font-medium text-ink-700 hover:bg-ink-100 dark:text-ink-200 dark:hover:bg-ink-800"
              >
                My e-mail
              </Link>
              <ThemeToggle />
              <SignOutButton />
            </div>
          </div>
        </header>
        <div id="main" className="mx-auto max-w-7xl px-4 py-4">
          {children}
        </div>
      </RankWordsProvider>
    </QueryProvider>
  );
}
