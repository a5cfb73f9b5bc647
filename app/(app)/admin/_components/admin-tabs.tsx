"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";

const SECTIONS = [
  { href: "/admin", label: "Overview" },
  { href: "/admin/vessels", label: "Vessels" },
  { href: "/admin/people", label: "People" },
] as const;

export function AdminTabs() {
  const pathname = usePathname();
  return (
    <nav aria-label="Company administration" className="-mb-px flex gap-1">
      {SECTIONS.map((s) => {
        const current = s.href === "/admin" ? pathname === "/admin" : pathname.startsWith(s.href);
        return (
          <Link
            key={s.href}
            href={s.href}
            aria-current={current ? "page" : undefined}
            className={`border-b-2 px-3 py-2 font-semibold ${
              current
                ? "border-brass-500 text-ink-900 dark:text-white"
                : "border-transparent text-ink-500 hover:text-ink-800 dark:text-ink-400 dark:hover:text-ink-100"
            }`}
          >
            {s.label}
          </Link>
        );
      })}
    </nav>
  );
}
