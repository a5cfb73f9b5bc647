"use client";

import { useState } from "react";
import { fetchJson } from "@/app/_components/fetch-json";
import { FormActions } from "@/app/_components/forms/form-actions";
import { problemSentence } from "@/app/_components/forms/form-problem";
import { Notice } from "@/app/_components/notice";
import type { MailPreferences, ReminderKind } from "@/server/reminders/preferences";

type Choice = Partial<Record<ReminderKind, boolean>>;

const capitalise = (words: string) => words.charAt(0).toUpperCase() + words.slice(1);

const choiceOf = (p: MailPreferences): Choice => Object.fromEntries(p.kinds.map((k) => [k.kind, k.receive]));

/** Which reminder e-mails the signed-in user gets; account messages are listed as always sent. */
export function MailPreferencesForm({ initial }: { initial: MailPreferences }) {
  const [saved, setSaved] = useState(initial);
  const [receive, setReceive] = useState<Choice>(choiceOf(initial));
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const [message, setMessage] = useState<string | null>(null);
  const unchanged = saved.kinds.every((k) => receive[k.kind] === k.receive);

  async function onSubmit(event: React.FormEvent) {
    event.preventDefault();
    setProblem(null);
    setMessage(null);
    setBusy(true);
    try {
      const next = await fetchJson<MailPreferences>("/api/account/mail-preferences", {
        method: "PUT",
        body: JSON.stringify({ receive }),
      });
      setSaved(next);
      setReceive(choiceOf(next));
      const off = next.kinds.filter((k) => !k.receive).length;
      setMessage(
        off === 0
          ? "Saved: you get every reminder listed."
          : `Saved: ${off} of ${next.kinds.length} reminders switched off.`,
      );
    } catch (error) {
      setProblem(problemSentence(error));
    } finally {
      setBusy(false);
    }
  }

  return (
    <section aria-labelledby="mail-heading" className="max-w-3xl panel p-4">
      <h2 id="mail-heading" className="font-semibold">
        Reminder e-mail
      </h2>
      <p className="mt-1 max-w-prose text-ink-600 dark:text-ink-300">
        Keelson writes to <strong className="font-medium text-ink-800 dark:text-ink-100">{saved.email}</strong>. Every
        reminder also carries a one-click unsubscribe link; you can switch it back on here.
      </p>
      {saved.kinds.length === 0 ? (
        <p className="mt-4 max-w-prose">
          Your role gets no reminder e-mail: digests and reminders go to the vessels’ engineers, chief engineers and the
          technical superintendents.
        </p>
      ) : (
        <form onSubmit={onSubmit} className="mt-4 grid max-w-prose gap-4">
          <fieldset className="grid gap-3">
            <legend className="sr-only">Reminders you get</legend>
            {saved.kinds.map((k) => (
              <label key={k.kind} className="flex items-start gap-2">
                <input
                  type="checkbox"
                  className="mt-1 accent-tide-600"
                  checked={receive[k.kind] ?? true}
                  onChange={(e) => setReceive((r) => ({ ...r, [k.kind]: e.target.checked }))}
                  aria-describedby={`mail-${k.kind}-hint`}
                />
                <span>
                  <span className="font-medium">{capitalise(k.label)}</span>
                  <span id={`mail-${k.kind}-hint`} className="block text-sm text-ink-500 dark:text-ink-400">
                    {capitalise(k.effect)}.
                  </span>
                </span>
              </label>
            ))}
          </fieldset>
          <Notice message={message} />
          <FormActions submitLabel={unchanged ? "Saved" : "Save"} busy={busy} problem={problem} />
        </form>
      )}
      <div className="mt-6 border-t border-ink-200 pt-4 dark:border-ink-800">
        <h3 className="font-medium">Always sent</h3>
        <ul className="mt-2 grid gap-1 text-sm text-ink-600 dark:text-ink-300">
          {saved.accountKinds.map((k) => (
            <li key={k.label}>
              <span className="font-medium text-ink-800 dark:text-ink-100">{capitalise(k.label)}</span>: {k.effect}.
            </li>
          ))}
        </ul>
      </div>
    </section>
  );
}
