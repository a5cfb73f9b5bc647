"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { z } from "zod";
import { authClient } from "@/app/_components/auth-client";
import { AuthAlert } from "../_components/auth-alert";
import { describedBy, Field } from "@/app/_components/forms/field";

const ForgotInput = z.object({ email: z.email({ message: "Enter your e-mail address, e.g. name@company.com." }) });
type ForgotInput = z.infer<typeof ForgotInput>;

export function ForgotPasswordForm() {
  const [sentTo, setSentTo] = useState<string | null>(null);
  const [failure, setFailure] = useState<string | null>(null);
  const { register, handleSubmit, formState } = useForm<ForgotInput>({ resolver: zodResolver(ForgotInput) });
  const { errors, isSubmitting } = formState;

  async function onSubmit({ email }: ForgotInput) {
    setFailure(null);
    const { error } = await authClient.requestPasswordReset({ email, redirectTo: "/set-password" });
    if (error) {
      // The server's own words when it limited this e-mail (they say for how long); ours otherwise.
      setFailure(
        error.status !== 429
          ? "That did not work; try again."
          : error.code === "TOO_MANY_RESET_REQUESTS" && error.message
            ? error.message
            : "Too many requests from here; wait a few minutes and try again.",
      );
      return;
    }
    setSentTo(email);
  }

  if (sentTo)
    return (
      <div role="status" className="grid gap-3">
        <p>
          If <strong>{sentTo}</strong> has a Keelson account, a link to choose a new password is on its way. Check the
          inbox (and the junk folder) in a few minutes.
        </p>
        <Link href="/sign-in" className="btn-quiet justify-self-start">
          Back to sign-in
        </Link>
      </div>
    );

  return (
    <form onSubmit={handleSubmit(onSubmit)} noValidate className="grid gap-4">
      <Field id="forgot-email" label="E-mail" error={errors.email?.message}>
        <input
          type="email"
          autoComplete="username"
          autoFocus
          className="field"
          {...describedBy("forgot-email", errors.email?.message)}
          {...register("email")}
        />
      </Field>
      {failure && <AuthAlert>{failure}</AuthAlert>}
      <button type="submit" className="btn-primary w-full py-2" disabled={isSubmitting}>
        {isSubmitting ? "Sending…" : "E-mail me a link"}
      </button>
      <p className="text-center">
        <Link href="/sign-in" className="text-tide-700 underline-offset-2 hover:underline dark:text-tide-300">
          Back to sign-in
        </Link>
      </p>
    </form>
  );
}
