// The server's answer to a refused form, spread over the form: each named field gets its message,
// the rest is said once above the buttons.
import type { FieldValues, Path, UseFormSetError } from "react-hook-form";
import { ProblemError } from "@/app/_components/fetch-json";

export function showProblem<F extends FieldValues>(error: unknown, setError: UseFormSetError<F>, fields: readonly Path<F>[]): string {
  if (!(error instanceof ProblemError)) {
    return "The change could not be sent. Check the connection and try again; nothing was saved.";
  }
  for (const e of error.problem.errors ?? []) {
    const field = fields.find((f) => f === e.field);
    if (field) setError(field, { message: e.message });
  }
  return `${error.problem.detail} Nothing was saved.`;
}
