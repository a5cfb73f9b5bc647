import { SectionTabs } from "@/app/_components/section-tabs";

const SECTIONS = [
  { href: "/admin", label: "Overview", exact: true },
  { href: "/admin/vessels", label: "Vessels" },
  { href: "/admin/people", label: "People" },
  { href: "/admin/tolerance-rules", label: "Tolerance rules" },
  { href: "/admin/mail", label: "Mail" },
  { href: "/admin/settings", label: "Settings" },
  { href: "/admin/audit", label: "Audit trail" },
] as const;

export function AdminTabs() {
  return <SectionTabs label="Company administration" sections={SECTIONS} />;
}
