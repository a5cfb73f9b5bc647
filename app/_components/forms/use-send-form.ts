"use client";
// One way for every form to send itself: the request, then either what follows a success or the
// server's refusal spread over the form (each named field gets its message and the first takes
// focus; the rest is said once above the buttons).
import { useState } from "react";
import type { FieldValues, Path, UseFormReturn } from "react-hook-form";
import { ProblemError } from "@/app/_components/fetch-json";
import { showProblem } from "./form-problem";

type SendFormOptions<In extends FieldValues, Out> = {
  /** The request and what follows it (a message, closing the panel); a throw is a refusal. */
  send: (values: Out) => Promise<void>;
  /**
   * The fields the server's errors may name. A function is read at the moment of the refusal, for
   * forms whose rows come and go (see `rowFields`).
   */
  fields: readonly Path<In>[] | ((values: In) => readonly Path<In>[]);
  /** What did not happen, for the sentence above the buttons ("nothing was saved" unless said). */
  outcome?: string | ((values: Out) => string);
  /**
   * The form's name for a field the server names otherwise: where the request is not the form's
   * values as they stand (a batch that leaves out the rows left empty).
   */
  fieldOf?: (serverField: string, values: Out) => string;
};

type FormParts<In extends FieldValues, Out> = Pick<
  UseFormReturn<In, unknown, Out>,
  "handleSubmit" | "setError" | "getValues"
>;

export function useSendForm<In extends FieldValues, Out>(
  form: FormParts<In, Out>,
  { send, fields, outcome, fieldOf }: SendFormOptions<In, Out>,
) {
  const [problem, setProblem] = useState<string | null>(null);

  const onSubmit = form.handleSubmit(async (values) => {
    setProblem(null);
    try {
      await send(values);
    } catch (error) {
      const named = typeof fields === "function" ? fields(form.getValues()) : fields;
      const said = typeof outcome === "function" ? outcome(values) : outcome;
      const refusal = fieldOf ? renamed(error, (field) => fieldOf(field, values)) : error;
      setProblem(showProblem(refusal, form.setError, named, said));
    }
  });

  /** `setProblem` for a second action of the same form (its own button, outside the submit). */
  return { onSubmit, problem, setProblem };
}

/** The fields of every row of a field array, for `fields`: `rowFields("crew", 2, ["rank"])`. */
export function rowFields<A extends string, K extends string>(
  array: A,
  rows: number,
  keys: readonly K[],
): `${A}.${number}.${K}`[] {
  return Array.from({ length: rows }, (_, row) => keys.map((key) => `${array}.${row}.${key}` as const)).flat();
}

function renamed(error: unknown, fieldOf: (field: string) => string): unknown {
  if (!(error instanceof ProblemError) || !error.problem.errors) return error;
  return new ProblemError({
    ...error.problem,
    errors: error.problem.errors.map((e) => ({ ...e, field: fieldOf(e.field) })),
  });
}
