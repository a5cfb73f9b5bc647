// The server's answer to a refused form, spread over the form: each named field gets its message,
// the rest is said once above the buttons.
import type { FieldValues, Path, UseFormSetError } from "react-hook-form";
import { ProblemError } from "@/app/_components/fetch-json";

export function showProblem<F extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<F>,
  fields: readonly Path<F>[],
): string {
  if (!(error instanceof ProblemError)) {
    return "The change could not be sent. Check the connection and try again; nothing was saved.";
  }
  const errors = error.problem.errors ?? [];
  let shown = 0;
  for (const e of errors) {
    const field = fields.find((f) => f === e.field);
    if (!field) continue;
    setError(field, { message: e.message });
    shown++;
  }
  // Said beside the field already: above the buttons only what to do next.
  if (errors.length && shown === errors.length) {
    return `Nothing was saved: correct the marked field${shown === 1 ? "" : "s"} and save again.`;
  }
  return `${error.problem.detail} Nothing was saved.`;
}
