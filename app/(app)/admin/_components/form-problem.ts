"use client";

import type { FieldValues, Path, UseFormSetError } from "react-hook-form";
import { ProblemError } from "@/app/_components/fetch-json";

/**
 * Puts the server's field errors (problem+json `errors`) beside the fields they name, and gives
 * the sentence for the top of the form. `vesselIds.2` belongs to the `vesselIds` field.
 */
export function showProblem<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  fields: readonly Path<T>[],
  nothingSaved = "Nothing was saved.",
): string {
  if (!(error instanceof ProblemError)) {
    return `The server could not be reached. Check the connection and try again; ${nothingSaved.toLowerCase()}`;
  }
  let unplaced = false;
  for (const e of error.problem.errors ?? []) {
    const field = fields.find((f) => e.field === f || e.field.startsWith(`${f}.`));
    if (field) setError(field, { message: e.message });
    else unplaced = true;
  }
  const placed = (error.problem.errors?.length ?? 0) > 0 && !unplaced;
  return placed
    ? `${error.problem.errors!.length === 1 ? "One value needs" : "Some values need"} correcting. ${nothingSaved}`
    : `${error.problem.detail} ${nothingSaved}`;
}
