"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useForm } from "react-hook-form";
import { z } from "zod";
import { FormActions } from "@/app/_components/forms/form-actions";
import { problemSentence } from "@/app/_components/forms/form-problem";
import { SidePanel } from "@/app/_components/forms/side-panel";
import { useSendForm } from "@/app/_components/forms/use-send-form";
import { Password, type AdminPerson } from "@/server/admin/contract";
import { PasswordField } from "./password-field";
import { useSendPasswordLink, useUpdatePerson } from "./use-admin";

const PasswordForm = z.object({ newPassword: Password });
type PasswordForm = z.infer<typeof PasswordForm>;

type Props = { person: AdminPerson; onDone: (message: string) => void; onClose: () => void };

/** For a forgotten or shared password: the administrator sets a new one and hands it over. */
export function PasswordPanel({ person, onDone, onClose }: Props) {
  const update = useUpdatePerson();
  const sendLink = useSendPasswordLink();
  const form = useForm<PasswordForm>({
    resolver: zodResolver(PasswordForm),
    defaultValues: { newPassword: "" },
  });

  const { register, formState, setValue } = form;
  const { onSubmit, problem, setProblem } = useSendForm(form, {
    fields: ["newPassword"],
    outcome: "the password was not changed",
    send: async ({ newPassword }) => {
      await update.mutateAsync({ id: person.id, changes: { newPassword } });
      onDone(
        person.isYou
          ? "Your password is changed."
          : `New password set for ${person.name}; they were signed out everywhere. Hand the password over securely.`,
      );
    },
  });

  async function onSendLink() {
    setProblem(null);
    try {
      const { sent } = await sendLink.mutateAsync(person.id);
      onDone(
        sent === "invitation"
          ? `The invitation went again to ${person.email}; its link works for a week.`
          : `A link to choose a new password went to ${person.email}; it works for an hour.`,
      );
    } catch (e) {
      setProblem(problemSentence(e, "no link was sent"));
    }
  }

  return (
    <SidePanel title={`Reset the password of ${person.name}`} subtitle={person.email} onClose={onClose} closeOnBackdrop>
      {!person.isYou && !person.disabled && (
        <section className="mb-5 grid gap-2 border-b border-ink-200 pb-5 dark:border-ink-800">
          <p className="text-ink-700 dark:text-ink-200">
            {person.invitedAt
              ? "They have not chosen a password yet. Send the invitation again:"
              : "Let them choose a new password themselves through a one-time link:"}
          </p>
          <button type="button" className="btn justify-self-start" onClick={onSendLink} disabled={sendLink.isPending}>
            {sendLink.isPending
              ? "Sending…"
              : person.invitedAt
                ? "Send the invitation again"
                : "E-mail a password link"}
          </button>
          <p className="text-xs text-ink-500 dark:text-ink-400">Or set one yourself and hand it over:</p>
        </section>
      )}
      <form onSubmit={onSubmit} noValidate className="grid gap-4">
        <p className="text-ink-700 dark:text-ink-200">
          The old password stops working at once{person.isYou ? "." : ", and every session they have open is ended."}
        </p>
        <PasswordField
          id="reset-newPassword"
          label="New password"
          error={formState.errors.newPassword?.message}
          registration={register("newPassword")}
          onSuggest={(password) => setValue("newPassword", password, { shouldValidate: true })}
        />
        <FormActions
          submitLabel="Set new password"
          busy={formState.isSubmitting}
          problem={problem}
          onCancel={onClose}
        />
      </form>
    </SidePanel>
  );
}
