"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";

const SECTIONS = [
  { slug: "hour-log", label: "Hour log" },
  { slug: "register", label: "Machinery register" },
] as const;

export function VesselTabs({ vesselId }: { vesselId: string }) {
  const pathname = usePathname();
  return (
    <nav aria-label="Vessel sections" className="-mb-px flex gap-1">
      {SECTIONS.map((s) => {
        const href = `/vessels/${vesselId}/${s.slug}`;
        const current = pathname.startsWith(href);
        return (
          <Link
            key={s.slug}
            href={href}
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
