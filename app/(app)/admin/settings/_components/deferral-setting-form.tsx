"use client";

import { useState } from "react";
import { fetchJson } from "@/app/_components/fetch-json";
import { FormActions } from "@/app/_components/forms/form-actions";
import { problemSentence } from "@/app/_components/forms/form-problem";
import { Notice } from "@/app/_components/notice";
import type { CompanySettings } from "@/server/deferrals/contract";

/** Who decides deferrals of plain work: the chief engineer on board, or always the office. */
export function DeferralSettingForm({ initial }: { initial: CompanySettings }) {
  const [saved, setSaved] = useState(initial);
  const [chiefDecides, setChiefDecides] = useState(initial.chiefDecidesDeferrals);
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const [message, setMessage] = useState<string | null>(null);

  async function onSubmit(event: React.FormEvent) {
    event.preventDefault();
    setProblem(null);
    setMessage(null);
    setBusy(true);
    try {
      const next = await fetchJson<CompanySettings>("/api/admin/settings", {
        method: "PATCH",
        body: JSON.stringify({ chiefDecidesDeferrals: chiefDecides }),
      });
      setSaved(next);
      setMessage(
        next.chiefDecidesDeferrals
          ? "Saved: chief engineers decide deferrals of work that is neither critical nor class-related."
          : "Saved: the technical superintendent decides every deferral.",
      );
    } catch (error) {
      setProblem(problemSentence(error));
    } finally {
      setBusy(false);
    }
  }

  return (
    <section aria-labelledby="deferral-setting-heading" className="panel p-4">
      <h2 id="deferral-setting-heading" className="font-semibold">
        Deferrals
      </h2>
      <p className="mt-1 max-w-prose text-ink-600 dark:text-ink-300">
        A chief engineer requests a deferral with a reason and a new limit. Deferrals of critical equipment and
        class-related work are always decided by the technical superintendent. For other work, the company chooses.
      </p>
      <form onSubmit={onSubmit} className="mt-4 grid max-w-prose gap-4">
        <label className="flex items-start gap-2">
          <input
            type="checkbox"
            className="mt-1 accent-tide-600"
            checked={chiefDecides}
            onChange={(e) => setChiefDecides(e.target.checked)}
            aria-describedby="chief-decides-hint"
          />
          <span>
            <span className="font-medium">
              The chief engineer may decide deferrals of work neither critical nor class-related
            </span>
            <span id="chief-decides-hint" className="block text-sm text-ink-500 dark:text-ink-400">
              Off: every deferral waits for the technical superintendent. Requests already waiting keep the rule they
              were asked under, unless you turn it off: then the office decides them too.
            </span>
          </span>
        </label>
        <Notice message={message} />
        <FormActions
          submitLabel={saved.chiefDecidesDeferrals === chiefDecides ? "Saved" : "Save"}
          busy={busy}
          problem={problem}
        />
      </form>
    </section>
  );
}
