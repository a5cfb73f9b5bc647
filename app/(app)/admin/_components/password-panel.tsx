"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { z } from "zod";
import { Password, type AdminPerson } from "@/server/admin/contract";
import { SidePanel } from "./dialog";
import { describedBy, Field } from "./field";
import { showProblem } from "./form-problem";
import { PasswordNote } from "./person-form";
import { randomPassword } from "./person-form-schema";
import { useUpdatePerson } from "./use-admin";

const PasswordForm = z.object({ newPassword: Password });
type PasswordForm = z.infer<typeof PasswordForm>;

type Props = { person: AdminPerson; onDone: (message: string) => void; onClose: () => void };

/** For a forgotten or shared password: the administrator sets a new one and hands it over. */
export function PasswordPanel({ person, onDone, onClose }: Props) {
  const update = useUpdatePerson();
  const [problem, setProblem] = useState<string | null>(null);
  const { register, handleSubmit, formState, setError, setValue } = useForm<PasswordForm>({
    resolver: zodResolver(PasswordForm),
    defaultValues: { newPassword: "" },
  });
  const error = formState.errors.newPassword?.message;

  async function onSubmit({ newPassword }: PasswordForm) {
    setProblem(null);
    try {
      await update.mutateAsync({ id: person.id, changes: { newPassword } });
      onDone(
        person.isYou
          ? "Your password is changed."
          : `New password set for ${person.name}; they were signed out everywhere. Hand the password over securely.`,
      );
    } catch (e) {
      setProblem(showProblem(e, setError, ["newPassword"], "The password was not changed."));
    }
  }

  return (
    <SidePanel title={`Reset the password of ${person.name}`} subtitle={person.email} onClose={onClose}>
      <form onSubmit={handleSubmit(onSubmit)} noValidate className="grid gap-4">
        <p className="text-ink-700 dark:text-ink-200">
          The old password stops working at once{person.isYou ? "." : ", and every session they have open is ended."}
        </p>
        <Field id="reset-newPassword" label="New password" error={error}>
          <div className="flex gap-2">
            <input
              id="reset-newPassword"
              type="text"
              spellCheck={false}
              autoComplete="new-password"
              className="field font-mono"
              {...describedBy("reset-newPassword", error)}
              {...register("newPassword")}
            />
            <button
              type="button"
              className="btn-quiet shrink-0"
              onClick={() => setValue("newPassword", randomPassword(), { shouldValidate: true })}
            >
              Suggest
            </button>
          </div>
          <PasswordNote />
        </Field>
        {problem && (
          <p
            role="alert"
            className="rounded-md bg-alarm-50 px-3 py-2 font-medium text-alarm-700 dark:bg-alarm-700/20 dark:text-alarm-300"
          >
            {problem}
          </p>
        )}
        <div className="flex gap-2">
          <button type="submit" className="btn-primary" disabled={formState.isSubmitting}>
            {formState.isSubmitting ? "Saving…" : "Set new password"}
          </button>
          <button type="button" className="btn-quiet" onClick={onClose}>
            Cancel
          </button>
        </div>
      </form>
    </SidePanel>
  );
}
