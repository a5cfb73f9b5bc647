import type { Metadata } from "next";
import { PartsCatalogue } from "./_components/parts-catalogue";

export const metadata: Metadata = { title: "Parts catalogue" };

export default function PartsPage() {
  return (
    <main>
      <PartsCatalogue />
    </main>
  );
}
