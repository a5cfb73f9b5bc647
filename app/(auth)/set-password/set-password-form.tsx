"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { z } from "zod";
import { authClient } from "@/app/_components/auth-client";
import { AuthAlert } from "../_components/auth-alert";
import { describedBy, Field } from "@/app/_components/forms/field";
import { Password } from "@/server/admin/contract";

const SetPasswordInput = z
  .object({ password: Password, repeat: z.string() })
  .refine((v) => v.password === v.repeat, { path: ["repeat"], message: "The two passwords differ; type it again." });
type SetPasswordInput = z.infer<typeof SetPasswordInput>;

export function SetPasswordForm({ token }: { token: string }) {
  const [done, setDone] = useState(false);
  const [failure, setFailure] = useState<string | null>(null);
  const { register, handleSubmit, formState } = useForm<SetPasswordInput>({ resolver: zodResolver(SetPasswordInput) });
  const { errors, isSubmitting } = formState;

  async function onSubmit({ password }: SetPasswordInput) {
    setFailure(null);
    const { error } = await authClient.resetPassword({ newPassword: password, token });
    if (error) {
      setFailure(
        error.code === "INVALID_TOKEN"
          ? "This link has expired or has already been used; ask for a new one."
          : (error.message ?? "That did not work; try again."),
      );
      return;
    }
    setDone(true);
  }

  if (done)
    return (
      <div role="status" className="grid gap-3">
        <p>Your password is set. Sign in with your e-mail address and the new password.</p>
        <Link href="/sign-in" className="btn-primary justify-self-start">
          Sign in
        </Link>
      </div>
    );

  return (
    <form onSubmit={handleSubmit(onSubmit)} noValidate className="grid gap-4">
      <Field id="new-password" label="New password" error={errors.password?.message}>
        <input
          type="password"
          autoComplete="new-password"
          autoFocus
          className="field"
          {...describedBy("new-password", errors.password?.message)}
          {...register("password")}
        />
      </Field>
      <Field id="repeat-password" label="The same again" error={errors.repeat?.message}>
        <input
          type="password"
          autoComplete="new-password"
          className="field"
          {...describedBy("repeat-password", errors.repeat?.message)}
          {...register("repeat")}
        />
      </Field>
      {failure && (
        <AuthAlert>
          {failure}{" "}
          <Link href="/forgot-password" className="underline">
            Send me a new link
          </Link>
        </AuthAlert>
      )}
      <button type="submit" className="btn-primary w-full py-2" disabled={isSubmitting}>
        {isSubmitting ? "Saving…" : "Set my password"}
      </button>
    </form>
  );
}
