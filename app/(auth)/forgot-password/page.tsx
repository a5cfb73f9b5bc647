import type { Metadata } from "next";
import { AuthShell } from "../_components/auth-shell";
import { ForgotPasswordForm } from "./forgot-password-form";

export const metadata: Metadata = { title: "Forgot password" };

export default function ForgotPasswordPage() {
  return (
    <AuthShell>
      <h1 className="mb-1 text-lg font-semibold">Forgot your password?</h1>
      <p className="mb-4 text-ink-600 dark:text-ink-300">
        Give the address you sign in with; we e-mail you a link to choose a new password. It works for an hour.
      </p>
      <ForgotPasswordForm />
    </AuthShell>
  );
}
