// Sending a fuzz case to the running app and judging the answer: a refusal must be a 4xx
// problem+json (RFC 9457) that names the field or says the body is malformed, in time.
import type { z } from "zod";
import { BASE_URL, type Session } from "../support/http";
import type { FuzzCase } from "./write-cases";

/** A request that takes longer than this is a hang (the app cuts its own work off well before). */
export const REQUEST_TIMEOUT_MS = 15_000;
/** The door's JSON body limit (MAX_JSON_BYTES in server/http/with-access.ts). */
const MAX_JSON_BYTES = 256 * 1024;
/** An answer bigger than this echoes what it was sent (names are cut to 60, messages to 300 characters). */
const MAX_ANSWER_BYTES = 32 * 1024;

export type Answer = { status: number; contentType: string; text: string; body: unknown; ms: number };

export async function send(session: Session | null, method: string, path: string, c: FuzzCase): Promise<Answer> {
  const query = new URLSearchParams(c.query).toString();
  const started = performance.now();
  const response = await fetch(`${BASE_URL}${path}${query ? `?${query}` : ""}`, {
    method,
    redirect: "manual",
    signal: AbortSignal.timeout(REQUEST_TIMEOUT_MS),
    headers: { origin: BASE_URL, "content-type": "application/json", ...(session ? { cookie: session.cookie } : {}) },
    body: c.text,
  }).catch((error: unknown) => {
    const timedOut = error instanceof Error && error.name === "TimeoutError";
    throw new Error(timedOut ? `no answer within ${REQUEST_TIMEOUT_MS / 1000} s` : `request failed: ${String(error)}`);
  });
  const text = await response.text();
  let body: unknown = null;
  try {
    body = JSON.parse(text);
  } catch {
    /* judged below: a problem answer is JSON */
  }
  return {
    status: response.status,
    contentType: response.headers.get("content-type") ?? "",
    text,
    body,
    ms: performance.now() - started,
  };
}

/** The body as the server's door reads it: the bytes decoded (a leading BOM dropped), then JSON. */
export function parsedBody(c: FuzzCase): { ok: true; value: unknown } | { ok: false } {
  if (c.text === undefined || !c.text.trim() || Buffer.byteLength(c.text) > MAX_JSON_BYTES) return { ok: false };
  try {
    return { ok: true, value: JSON.parse(c.text.replace(/^\ufeff/, "")) };
  } catch {
    return { ok: false };
  }
}

function holdsNul(value: unknown, depth = 0): boolean {
  if (typeof value === "string") return value.includes("\u0000");
  if (!value || typeof value !== "object" || depth > 32) return false;
  return Object.values(value).some((v) => holdsNul(v, depth + 1));
}

/**
 * Whether the door would let the case through to the route's handler: the body and the query
 * pass the route's own zod contract (and hold no NUL, which the door refuses for every contract).
 * Only such a case may be answered 2xx; every other one must be refused and write nothing.
 */
export function contractAccepts(c: FuzzCase, body: z.ZodType | null, query: z.ZodType | null): boolean {
  if (body) {
    const parsed = parsedBody(c);
    if (!parsed.ok || holdsNul(parsed.value) || !body.safeParse(parsed.value).success) return false;
  }
  if (query && (holdsNul(c.query) || !query.safeParse({ ...c.query }).success)) return false;
  return true;
}

type ProblemBody = { title?: unknown; status?: unknown; detail?: unknown; errors?: unknown };
type FieldError = { field: string; message: string };

function fieldErrors(problem: ProblemBody): FieldError[] | null {
  if (!Array.isArray(problem.errors) || !problem.errors.length) return null;
  const all = problem.errors.every(
    (e: unknown) =>
      !!e &&
      typeof e === "object" &&
      "field" in e &&
      typeof e.field === "string" &&
      e.field !== "" &&
      "message" in e &&
      typeof e.message === "string",
  );
  return all ? (problem.errors as FieldError[]) : null;
}

/** Whether `field` ("entries.0.value", "query.t", "(body)") is the mutated place, inside it, around it or beside it. */
function namesPlace(field: string, mutated: string[]): boolean {
  if (field === "(body)") return true;
  const parts = field.split(".");
  const n = Math.min(parts.length, mutated.length);
  const common = parts.slice(0, n).every((p, i) => p === mutated[i]!.slice(0, 60));
  // Beside it: a rule between fields names the other one (departure before arrival, an empty patch).
  const sibling = parts.slice(0, -1).join(".") === mutated.slice(0, -1).join(".");
  return common || sibling;
}

/**
 * What is wrong with a refusal, or [] when it is one: 4xx, problem+json with title, status and
 * detail, small; a 422 lists each field it names (one of the body's or the query's, or the body
 * itself, or one of the valid example's when it is missing), and names the place a mutation
 * broke; a 413 says the body is too large.
 */
export type Reading = {
  /** Whether the route's door parses a body or query with a contract. */
  input: boolean;
  /** Whether the test knows the contract refused this case (it could import the schemas). */
  refusedByContract: boolean;
  exampleKeys: string[];
};

export function refusalProblems(answer: Answer, c: FuzzCase, reads: Reading): string[] {
  const problems: string[] = [];
  if (answer.status < 400 || answer.status > 499) problems.push(`status ${answer.status}, not a 4xx refusal`);
  if (!answer.contentType.startsWith("application/problem+json")) problems.push(`content-type "${answer.contentType}"`);
  if (answer.text.length > MAX_ANSWER_BYTES) problems.push(`an answer of ${answer.text.length} bytes echoes the input`);
  const problem = (answer.body && typeof answer.body === "object" ? answer.body : {}) as ProblemBody;
  if (typeof problem.title !== "string" || typeof problem.detail !== "string" || problem.status !== answer.status) {
    problems.push("not a problem body (title, status, detail)");
  }
  if (!reads.input || problems.length) return problems;
  if (answer.status === 413) {
    if (!/body/i.test(String(problem.detail)))
      problems.push(`413 without saying the body is too large: ${String(problem.detail)}`);
    return problems;
  }
  if (answer.status !== 422)
    return [...problems, `status ${answer.status} where the contract refuses the input (422 or 413)`];
  const errors = fieldErrors(problem);
  if (!errors) return [...problems, "a 422 without an errors list of { field, message }"];
  const parsed = parsedBody(c);
  const known = new Set([
    "(body)",
    "query",
    ...reads.exampleKeys,
    ...Object.keys(parsed.ok && parsed.value && typeof parsed.value === "object" ? parsed.value : {}).map((k) =>
      k.slice(0, 60),
    ),
  ]);
  const strangers = errors.filter((e) => !known.has(e.field.split(".")[0]!));
  if (strangers.length)
    problems.push(`errors name fields the request has not: ${strangers.map((e) => e.field).join(", ")}`);
  if (reads.refusedByContract && c.mutated && parsed.ok && !errors.some((e) => namesPlace(e.field, c.mutated!))) {
    problems.push(`no error names ${c.mutated.join(".").slice(0, 80)}: ${errors.map((e) => e.field).join(", ")}`);
  }
  return problems;
}

/** "22× 422, 5× 413; slowest 140 ms": how a set of requests was answered. */
export function answerWords(answers: Answer[]): string {
  const counts = new Map<number, number>();
  for (const a of answers) counts.set(a.status, (counts.get(a.status) ?? 0) + 1);
  const slowest = Math.round(Math.max(0, ...answers.map((a) => a.ms)));
  const byStatus = [...counts].sort(([a], [b]) => a - b).map(([status, n]) => `${n}× ${status}`);
  return `${byStatus.join(", ") || "none sent"}; slowest ${slowest} ms`;
}

export function describeCase(c: FuzzCase): string {
  const text =
    c.text === undefined
      ? "(none)"
      : c.text.length > 160
        ? `${c.text.slice(0, 160)}… (${c.text.length} chars)`
        : c.text;
  return `${c.kind}${c.mutated ? ` at ${c.mutated.join(".").slice(0, 60)}` : ""}; body ${JSON.stringify(text)}; query ${JSON.stringify(c.query).slice(0, 200)}`;
}
