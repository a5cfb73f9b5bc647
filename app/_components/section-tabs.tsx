"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";

export type Section = {
  href: string;
  label: string;
  /** Current only on this very page, not on the pages below it (an overview above its sections). */
  exact?: boolean;
};

/** The row of tabs under a page's heading; the tab of the page shown is marked for screen readers. */
export function SectionTabs({ label, sections }: { label: string; sections: readonly Section[] }) {
  const pathname = usePathname();
  return (
    <nav aria-label={label} className="-mb-px flex gap-1">
      {sections.map((s) => {
        const current = pathname === s.href || (!s.exact && pathname.startsWith(`${s.href}/`));
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
