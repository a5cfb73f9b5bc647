import type { Metadata } from "next";
import { requirePageAccess } from "@/server/auth/access";
import { listAccessibleVessels } from "@/server/vessels/queries";
import { PartsCatalogue } from "./_components/parts-catalogue";

export const metadata: Metadata = { title: "Parts catalogue" };

export default async function PartsPage() {
  const access = await requirePageAccess();
  const vessels = await listAccessibleVessels(access);
  return (
    <main>
      <PartsCatalogue vessels={vessels.map(({ id, name, code }) => ({ id, name, code }))} />
    </main>
  );
}
