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
  | "too-large"
  | "unsupported-media-type"
  | "unavailable"
  | "internal";

const STATUS: Record<ErrorCode, number> = {
  unauthenticated: 401,
  forbidden: 403,
  "not-found": 404,
  "invalid-input": 422,
  conflict: 409,
  "too-large": 413,
  "unsupported-media-type": 415,
  unavailable: 503,
  internal: 500,
};

const TITLE: Record<ErrorCode, string> = {
  unauthenticated: "Sign in required",
  forbidden: "Not allowed",
  "not-found": "Not found",
  "invalid-input": "Some values need correcting",
  conflict: "Conflict",
  "too-large": "Request too large",
  "unsupported-media-type": "Not JSON",
  unavailable: "Not available right now",
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

/** A name or message from the request is cut short before it is echoed back (an unknown 1 MB key). */
function clipped(text: string, max: number): string {
  return text.length > max ? `${text.slice(0, max)}…` : text;
}

export function fieldErrorsFromZod(error: ZodError, prefix = ""): FieldError[] {
  return error.issues.slice(0, 50).map((issue) => {
    const path = [prefix, ...issue.path.map((p) => clipped(String(p), 60))].filter(Boolean);
    const rowIndex = issue.path.findIndex((p) => p === "entries");
    const row = rowIndex >= 0 ? Number(issue.path[rowIndex + 1]) : undefined;
    return {
      field: path.join(".") || "(body)",
      ...(Number.isInteger(row) ? { row } : {}),
      message: clipped(issue.message, 300),
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

/**
 * PostgreSQL's unique constraints are the last word when two people save the same key at the same
 * moment (the domain checks first, under a lock where it can; the loser of a race gets here). Each
 * becomes a 422 on its field, or a 409 where there is no field to correct.
 */
const UNIQUE_CONSTRAINTS: Record<string, FieldError | string> = {
  user_email_unique: { field: "email", message: "That e-mail address already has a Keelson account; use another." },
  vessel_companyId_code_unique: { field: "code", message: "Another vessel of the company already has this code." },
  vessel_companyId_imoNumber_unique: { field: "imoNumber", message: "This IMO number is already registered in the company." },
  component_companyId_vesselId_code_unique: { field: "code", message: "That code is already used on this vessel." },
  counter_companyId_vesselId_name_unique: { field: "name", message: "There is already a counter of that name on this vessel." },
  tolerance_rule_companyId_name_unique: { field: "name", message: "The company already has a rule of that name." },
  reading_counterId_readAt_unique: "A reading of that counter at that time was saved meanwhile; reload the Hour log.",
  completion_workOrderId_unique: "The job was recorded meanwhile by someone else; reload the work order.",
  deferral_one_pending: "A deferral of this work order is already waiting for a decision.",
  part_companyId_number_unique: { field: "number", message: "The catalogue already has a part of that number." },
  store_location_companyId_vesselId_store_rack_bin_unique: { field: "store", message: "That store, rack and bin are already a location on board." },
};

/** The PostgreSQL error behind a failed query (Drizzle wraps it in `cause`), if any. */
function pgErrorOf(error: unknown): { code?: unknown; constraint?: unknown } | null {
  for (let e = error, depth = 0; e && typeof e === "object" && depth < 3; e = (e as { cause?: unknown }).cause, depth++) {
    if ("code" in e && typeof e.code === "string" && /^[0-9A-Z]{5}$/.test(e.code)) return e;
  }
  return null;
}

export function uniqueViolationProblem(error: unknown): AppError | null {
  const pg = pgErrorOf(error);
  if (pg?.code !== "23505") return null;
  const known = typeof pg.constraint === "string" ? UNIQUE_CONSTRAINTS[pg.constraint] : undefined;
  if (typeof known === "object") return invalidInput([known]);
  return new AppError("conflict", known ?? "Someone saved the same thing at the same moment; reload and try again.");
}

/** Node's socket errors and PostgreSQL's connection and shutdown classes (08, 57P, 53300). */
const UNREACHABLE = /^(ECONNREFUSED|ECONNRESET|ETIMEDOUT|EPIPE|08\w{3}|57P0[1-3]|53300)$/;
/**
 * pg's words when a connection is gone without a code. The last one is the rollback a transaction
 * tries after its connection died mid-way (found by the outage test: the request got a 500).
 */
const CONNECTION_GONE = /Connection terminated|connect ECONNREFUSED|terminating connection|not queryable/;

/**
 * The database cannot be reached (stopped, restarting, out of connections): a 503 the client may
 * retry, not a 500 with a stack. pg also says so without a code when a pooled connection is gone.
 */
export function databaseUnavailableProblem(error: unknown): AppError | null {
  for (let e = error, depth = 0; e && typeof e === "object" && depth < 4; e = (e as { cause?: unknown }).cause, depth++) {
    const code = "code" in e ? String(e.code) : "";
    const message = e instanceof Error ? e.message : "";
    if (UNREACHABLE.test(code) || CONNECTION_GONE.test(message)) {
      return new AppError("unavailable", "The database cannot be reached just now. Try again in a moment; if you were saving, check afterwards that it was saved.");
    }
  }
  return null;
}

export function problemResponse(error: unknown): Response {
  const appError =
    error instanceof AppError
      ? error
      : error instanceof ZodError
        ? invalidInput(fieldErrorsFromZod(error))
        : (uniqueViolationProblem(error) ?? databaseUnavailableProblem(error));
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
    headers: {
      "content-type": "application/problem+json",
      ...(e.code === "unavailable" ? { "retry-after": "5" } : {}),
    },
  });
}
