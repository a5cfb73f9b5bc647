import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { getAccess } from "@/server/auth/access";
import { demoSignIns } from "@/server/auth/demo";
import { AuthShell } from "../_components/auth-shell";
import { SignInForm } from "./sign-in-form";

export const metadata: Metadata = { title: "Sign in" };

export default async function SignInPage() {
  if (await getAccess()) redirect("/");
  return (
    <AuthShell>
      <h1 className="sr-only">Sign in to Keelson</h1>
      <SignInForm demo={await demoSignIns()} />
    </AuthShell>
  );
}
