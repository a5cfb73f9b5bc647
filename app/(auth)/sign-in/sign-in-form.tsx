"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { z } from "zod";
import { AuthAlert } from "../_components/auth-alert";

const SignInInput = z.object({
  email: z.email({ message: "Enter your e-mail address, e.g. name@company.com." }),
  password: z.string().min(1, { message: "Enter your password." }),
});
type SignInInput = z.infer<typeof SignInInput>;

type Demo = { password: string; users: { email: string; label: string }[] } | null;

export function SignInForm({ demo }: { demo: Demo }) {
  const router = useRouter();
  const [failure, setFailure] = useState<string | null>(null);
  const { register, handleSubmit, formState, setValue } = useForm<SignInInput>({ resolver: zodResolver(SignInInput) });
  const { errors, isSubmitting } = formState;

  async function onSubmit(values: SignInInput) {
    setFailure(null);
    // better-auth's client (13 kB compressed) loads on the first press, not with the page.
    const { authClient } = await import("@/app/_components/auth-client");
    const { error } = await authClient.signIn.email(values);
    if (error) {
      setFailure(
        error.status === 401 || error.code === "INVALID_EMAIL_OR_PASSWORD"
          ? "That e-mail and password do not match an account."
          : (error.message ?? "Sign-in failed. Try again."),
      );
      return;
    }
    router.replace("/");
    router.refresh();
  }

  return (
    <>
      <form onSubmit={handleSubmit(onSubmit)} noValidate className="grid gap-4">
        <div>
          <label htmlFor="email" className="label">
            E-mail
          </label>
          <input
            id="email"
            type="email"
            autoComplete="username"
            autoFocus
            className="field"
            aria-invalid={errors.email ? true : undefined}
            aria-describedby={errors.email ? "email-error" : undefined}
            {...register("email")}
          />
          {errors.email && (
            <p id="email-error" className="field-error">
              {errors.email.message}
            </p>
          )}
        </div>
        <div>
          <label htmlFor="password" className="label">
            Password
          </label>
          <input
            id="password"
            type="password"
            autoComplete="current-password"
            className="field"
            aria-invalid={errors.password ? true : undefined}
            aria-describedby={errors.password ? "password-error" : undefined}
            {...register("password")}
          />
          {errors.password && (
            <p id="password-error" className="field-error">
              {errors.password.message}
            </p>
          )}
        </div>
        {failure && <AuthAlert>{failure}</AuthAlert>}
        <button type="submit" className="btn-primary w-full py-2" disabled={isSubmitting}>
          {isSubmitting ? "Signing in…" : "Sign in"}
        </button>
        <p className="text-center">
          <Link href="/forgot-password" className="text-tide-700 underline-offset-2 hover:underline dark:text-tide-300">
            Forgot your password?
          </Link>
        </p>
      </form>
      {demo && (
        <section aria-labelledby="demo-heading" className="mt-6 border-t border-ink-200 pt-4 dark:border-ink-800">
          <h2 id="demo-heading" className="label">
            Demo sign-ins · password <code className="font-mono normal-case">{demo.password}</code>
          </h2>
          <p className="mb-2 text-xs text-ink-500">Pick one to fill in the form.</p>
          <ul className="grid gap-0.5">
            {demo.users.map((u) => (
              <li key={u.email}>
                <button
                  type="button"
                  className="flex w-full justify-between gap-3 rounded px-1 py-0.5 text-left hover:bg-ink-100 dark:hover:bg-ink-800"
                  onClick={() => {
                    setValue("email", u.email, { shouldValidate: true });
                    setValue("password", demo.password, { shouldValidate: true });
                  }}
                >
                  <code className="font-mono">{u.email}</code>
                  <span className="text-ink-600 dark:text-ink-300">{u.label}</span>
                </button>
              </li>
            ))}
          </ul>
        </section>
      )}
    </>
  );
}
