"use client";
// The company's own names for Keelson's ranks: every page, the planner's reasons and the printed
// work package then say "Wiper" where Keelson would say "Oiler". What is stored stays Keelson's rank.
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { fetchJson } from "@/app/_components/fetch-json";
import { describedBy } from "@/app/_components/forms/field";
import { FormActions } from "@/app/_components/forms/form-actions";
import { useSendForm } from "@/app/_components/forms/use-send-form";
import { Notice } from "@/app/_components/notice";
import { RANKS, type Rank } from "@/server/routines/ranks";
import { type RankNames, RankNamesInput, type RankNamesView } from "@/server/routines/rank-names";

type Values = Partial<Record<Rank, string>>;

const valuesOf = (view: RankNamesView) => Object.fromEntries(view.ranks.map((r) => [r.rank, r.name ?? ""])) as Values;

export function RankNamesForm({ initial }: { initial: RankNamesView }) {
  const router = useRouter();
  const [message, setMessage] = useState<string | null>(null);
  const form = useForm<Values, unknown, RankNames>({
    resolver: zodResolver(RankNamesInput),
    defaultValues: valuesOf(initial),
  });
  const { register, formState, reset } = form;
  const { errors, isSubmitting, isDirty } = formState;
  const { onSubmit, problem } = useSendForm(form, {
    fields: RANKS,
    send: async (names) => {
      setMessage(null);
      const saved = await fetchJson<RankNamesView>("/api/admin/rank-names", {
        method: "PUT",
        body: JSON.stringify(names),
      });
      reset(valuesOf(saved));
      const renamed = saved.ranks.filter((r) => r.name).length;
      setMessage(
        renamed
          ? `Saved: ${renamed} rank${renamed === 1 ? "" : "s"} under the company’s own name.`
          : "Saved: every rank under Keelson’s word.",
      );
      router.refresh();
    },
  });

  return (
    <section aria-labelledby="rank-names-heading" className="panel p-4">
      <h2 id="rank-names-heading" className="font-semibold">
        Rank names
      </h2>
      <p className="mt-1 max-w-prose text-ink-600 dark:text-ink-300">
        Keelson plans with the ranks of an engine department. Where your company calls a rank otherwise, give its name
        here: routines, port stays, the Backlog and the printed work package use it. Leave a field empty for Keelson’s
        word.
      </p>
      <form onSubmit={onSubmit} noValidate className="mt-4 grid max-w-xl gap-4">
        <table className="w-full text-sm">
          <thead>
            <tr className="text-left text-ink-600 dark:text-ink-300">
              <th scope="col" className="py-1 pr-4 font-medium">
                Keelson’s rank
              </th>
              <th scope="col" className="py-1 font-medium">
                Your company’s name
              </th>
            </tr>
          </thead>
          <tbody>
            {initial.ranks.map(({ rank, keelson }) => {
              const error = errors[rank]?.message;
              return (
                <tr key={rank} className="align-top">
                  <th scope="row" className="py-1.5 pr-4 text-left font-normal">
                    <label htmlFor={`rank-name-${rank}`}>{keelson}</label>
                  </th>
                  <td className="py-1">
                    <input
                      className="field"
                      autoComplete="off"
                      maxLength={60}
                      placeholder={keelson}
                      {...describedBy(`rank-name-${rank}`, error)}
                      {...register(rank)}
                    />
                    {error && (
                      <p id={`rank-name-${rank}-error`} className="field-error">
                        {error}
                      </p>
                    )}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
        <Notice message={message} />
        <FormActions submitLabel={isDirty ? "Save names" : "Saved"} busy={isSubmitting} problem={problem} />
      </form>
    </section>
  );
}
