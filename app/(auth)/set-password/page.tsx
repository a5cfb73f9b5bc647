import type { Metadata } from "next";
import Link from "next/link";
import { AuthShell } from "../_components/auth-shell";
import { SetPasswordForm } from "./set-password-form";

export const metadata: Metadata = { title: "Choose a password" };

type Props = { searchParams: Promise<{ token?: string; error?: string }> };

/** Where an invitation or reset link lands (better-auth has checked the token and adds it here). */
export default async function SetPasswordPage({ searchParams }: Props) {
  const { token, error } = await searchParams;
  return (
    <AuthShell>
      <h1 className="mb-1 text-lg font-semibold">Choose your password</h1>
      {!token || error ? (
        <div role="alert" className="grid gap-3">
          <p>
            This link has expired or has already been used. Links from a password reset work for an hour, invitations
            for a week, and each once only.
          </p>
          <p>
            <Link href="/forgot-password" className="btn-primary">
              Send me a new link
            </Link>
          </p>
        </div>
      ) : (
        <>
          <p className="mb-4 text-ink-600 dark:text-ink-300">
            At least 10 characters. A few unrelated words are easier to type on a tablet and hard to guess.
          </p>
          <SetPasswordForm token={token} />
        </>
      )}
    </AuthShell>
  );
}
