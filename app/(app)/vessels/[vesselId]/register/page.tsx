import type { Metadata } from "next";
import { requirePageVessel } from "@/server/auth/access";
import { MachineryRegister } from "./_components/machinery-register";

export const metadata: Metadata = { title: "Machinery register" };

export default async function RegisterPage({ params }: { params: Promise<{ vesselId: string }> }) {
  const { vesselId } = await params;
  const { vessel } = await requirePageVessel(vesselId);
  return (
    <main>
      <h1 className="sr-only">Machinery register of {vessel.name}</h1>
      <MachineryRegister vesselId={vessel.id} />
    </main>
  );
}
