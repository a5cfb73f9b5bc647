import { SectionTabs } from "@/app/_components/section-tabs";

const SECTIONS = [
  { slug: "hour-log", label: "Hour log" },
  { slug: "backlog", label: "Backlog" },
  { slug: "defects", label: "Defects" },
  { slug: "calendar", label: "Calendar" },
  { slug: "port-stays", label: "Port stays" },
  { slug: "routines", label: "Routines" },
  { slug: "register", label: "Machinery register" },
  { slug: "class-items", label: "Class items" },
  { slug: "stores", label: "Stores" },
  { slug: "requisitions", label: "Requisitions" },
] as const;

export function VesselTabs({ vesselId }: { vesselId: string }) {
  return (
    <SectionTabs
      label="Vessel sections"
      sections={SECTIONS.map((s) => ({ href: `/vessels/${vesselId}/${s.slug}`, label: s.label }))}
    />
  );
}
