// Free-text fields of the contracts, with messages that name the field.
import { z } from "zod";

export function requiredText(what: string, max: number) {
  return z
    .string({ message: `Enter the ${what}.` })
    .trim()
    .min(1, { message: `Enter the ${what}.` })
    .max(max, { message: `Keep the ${what} to ${max} characters or fewer.` });
}

export function optionalText(what: string, max: number) {
  return z
    .string({ message: `The ${what} must be text.` })
    .trim()
    .max(max, { message: `Keep the ${what} to ${max} characters or fewer.` })
    .nullish();
}
