"use client";

import type { UseFormRegisterReturn } from "react-hook-form";
import { describedBy, Field } from "@/app/_components/forms/field";
import { randomPassword } from "./person-form-schema";

type Props = {
  id: string;
  label: string;
  error?: string;
  registration: UseFormRegisterReturn;
  /** Puts a suggested password in the field. */
  onSuggest: (password: string) => void;
};

/** A password the administrator sets and hands over: shown in clear, with a suggestion at hand. */
export function PasswordField({ id, label, error, registration, onSuggest }: Props) {
  return (
    <Field id={id} label={label} error={error}>
      <div className="flex gap-2">
        <input
          type="text"
          spellCheck={false}
          autoComplete="new-password"
          className="field font-mono"
          {...describedBy(id, error)}
          {...registration}
        />
        <button type="button" className="btn-quiet shrink-0" onClick={() => onSuggest(randomPassword())}>
          Suggest
        </button>
      </div>
      <PasswordNote />
    </Field>
  );
}

function PasswordNote() {
  return (
    <p className="mt-1.5 rounded-md border border-brass-300 bg-brass-100/60 px-2.5 py-1.5 text-xs text-ink-800 dark:border-brass-700 dark:bg-brass-700/20 dark:text-ink-100">
      At least 10 characters. Hand it over securely: in person, by phone or through the ship’s master, never in an
      e-mail to the same address. Keelson does not show it again.
    </p>
  );
}
