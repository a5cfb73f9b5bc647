// Errors a person can act on: every failure leaves a route handler as application/problem+json
// (RFC 9457) with a title, a status, a detail and, for validation, one entry per field or row.
import { ZodError } from "zod";

export type FieldError = {
  /** Dotted path of the field, e.g. `entries.2.value`. */
  field: string;
  /** Row number in a batch (0-based), where the error belongs to a row. */
  row?: number;
  message: string;
};

export type ErrorCode =
  | "unauthenticated"
  | "forbidden"
  | "not-found"
  | "invalid-input"
  | "conflict"
  | "internal";

const STATUS: Record<ErrorCode, number> = {
  unauthenticated: 401,
  forbidden: 403,
  "not-found": 404,
  "invalid-input": 422,
  conflict: 409,
  internal: 500,
};

const TITLE: Record<ErrorCode, string> = {
  unauthenticated: "Sign in required",
  forbidden: "Not allowed",
  "not-found": "Not found",
  "invalid-input": "Some values need correcting",
  conflict: "Conflict",
  internal: "Something went wrong",
};

export class AppError extends Error {
  constructor(
    readonly code: ErrorCode,
    detail: string,
    readonly errors: FieldError[] = [],
  ) {
    super(detail);
    this.name = "AppError";
  }

  get status(): number {
    return STATUS[this.code];
  }
}

export function invalidInput(errors: FieldError[], detail?: string): AppError {
  const first = errors[0]?.message ?? "Invalid input";
  return new AppError(
    "invalid-input",
    detail ?? (errors.length === 1 ? first : `${errors.length} values need correcting`),
    errors,
  );
}

export function fieldErrorsFromZod(error: ZodError, prefix = ""): FieldError[] {
  return error.issues.map((issue) => {
    const path = [prefix, ...issue.path.map(String)].filter(Boolean);
    const rowIndex = issue.path.findIndex((p) => p === "entries");
    const row = rowIndex >= 0 ? Number(issue.path[rowIndex + 1]) : undefined;
    return {
      field: path.join(".") || "(body)",
      ...(Number.isInteger(row) ? { row } : {}),
      message: issue.message,
    };
  });
}

export type Problem = {
  type: string;
  title: string;
  status: number;
  detail: string;
  errors?: FieldError[];
};

export function problemResponse(error: unknown): Response {
  const appError =
    error instanceof AppError
      ? error
      : error instanceof ZodError
        ? invalidInput(fieldErrorsFromZod(error))
        : null;
  if (!appError) {
    console.error(error);
  }
  const e = appError ?? new AppError("internal", "The server could not complete the request.");
  const body: Problem = {
    type: `https://keelson.invalid/problems/${e.code}`,
    title: TITLE[e.code],
    status: e.status,
    detail: e.message,
    ...(e.errors.length ? { errors: e.errors } : {}),
  };
  return Response.json(body, {
    status: e.status,
    headers: { "content-type": "application/problem+json" },
  });
}
