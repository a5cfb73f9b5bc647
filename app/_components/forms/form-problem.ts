// The server's answer to a refused form, spread over the form: each field it names gets its
// message, the rest is said once above the buttons.
import type { FieldValues, Path, UseFormSetError } from "react-hook-form";
import { ProblemError } from "@/app/_components/fetch-json";

/**
 * Puts the server's field errors (problem+json `errors`) beside the fields they name and returns
 * the sentence for above the buttons. An error on `vesselIds.2` belongs to the `vesselIds` field
 * unless the form has a field of that very name. `outcome` says what did not happen.
 */
export function showProblem<F extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<F>,
  fields: readonly Path<F>[],
  outcome = "nothing was saved",
): string {
  if (!(error instanceof ProblemError)) return problemSentence(error, outcome);
  const errors = error.problem.errors ?? [];
  const marked = new Set<Path<F>>();
  let unplaced = false;
  for (const e of errors) {
    const field = fields.find((f) => f === e.field) ?? fields.find((f) => e.field.startsWith(`${f}.`));
    if (field) {
      // The first refused field takes focus, so the keyboard lands where the correction goes.
      setError(field, { message: e.message }, { shouldFocus: marked.size === 0 });
      marked.add(field);
    } else {
      unplaced = true;
    }
  }
  // Said beside the field already: above the buttons only what to do next.
  if (errors.length && !unplaced) {
    return `${sentence(outcome)}: correct the marked field${marked.size === 1 ? "" : "s"} and save again.`;
  }
  return problemSentence(error, outcome);
}

/** The sentence for a refused change that names no field of a form (or has none to name). */
export function problemSentence(error: unknown, outcome = "nothing was saved"): string {
  if (!(error instanceof ProblemError)) {
    return `The change could not be sent. Check the connection and try again; ${outcome}.`;
  }
  return `${error.problem.detail} ${sentence(outcome)}.`;
}

function sentence(words: string): string {
  return words.charAt(0).toUpperCase() + words.slice(1);
}
