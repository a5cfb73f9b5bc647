import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { KeelsonMark } from "@/app/_components/keelson-mark";
import { getAccess } from "@/server/auth/access";
import { demoSignIns } from "@/server/auth/demo";
import { SignInForm } from "./sign-in-form";

export const metadata: Metadata = { title: "Sign in" };

export default async function SignInPage() {
  if (await getAccess()) redirect("/");
  const demo = demoSignIns();
  return (
    <main className="mx-auto flex min-h-screen max-w-md flex-col justify-center px-4 py-10">
      <div className="mb-6 flex items-center gap-2">
        <KeelsonMark className="h-9 w-9" />
        <div>
          <h1 className="text-xl font-bold tracking-tight">Keelson</h1>
          <p className="text-ink-500 dark:text-ink-400">Planned maintenance for the engine department</p>
        </div>
      </div>
      <div className="panel p-6">
        <SignInForm demo={demo} />
      </div>
    </main>
  );
}
