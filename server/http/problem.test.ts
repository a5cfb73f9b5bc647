// Errors leave as application/problem+json (RFC 9457); a unique violation that won a race past
// the domain's own checks is a 422 on its field or a 409, decided here and nowhere else.
import { describe, expect, it, vi } from "vitest";
import { type Problem, problemResponse } from "./problem";

/** What Drizzle throws for a failed statement: its own error, the driver's error as `cause`. */
function drizzleError(cause: object): Error {
  return Object.assign(new Error("Failed query: insert into …"), { cause });
}

async function answer(error: unknown): Promise<{ status: number; body: Problem; type: string | null }> {
  const response = problemResponse(error);
  return { status: response.status, body: (await response.json()) as Problem, type: response.headers.get("content-type") };
}

describe("problemResponse and PostgreSQL unique violations", () => {
  it("a known constraint becomes a 422 naming its field", async () => {
    const r = await answer(drizzleError({ code: "23505", constraint: "vessel_companyId_code_unique" }));
    expect(r.status).toBe(422);
    expect(r.type).toBe("application/problem+json");
    expect(r.body.errors).toEqual([{ field: "code", message: "Another vessel of the company already has this code." }]);
  });

  it("a known constraint with nothing to correct becomes a 409 saying what happened", async () => {
    const r = await answer(drizzleError({ code: "23505", constraint: "deferral_one_pending" }));
    expect(r.status).toBe(409);
    expect(r.body.detail).toMatch(/already waiting for a decision/);
  });

  it("an unknown unique constraint is still a 409, not a 500", async () => {
    const r = await answer(drizzleError({ code: "23505", constraint: "something_new_unique" }));
    expect(r.status).toBe(409);
    expect(r.body.detail).toMatch(/same moment/);
  });

  it("another database error stays a 500 and is logged", async () => {
    const log = vi.spyOn(console, "error").mockImplementation(() => undefined);
    const r = await answer(drizzleError({ code: "57014", message: "canceling statement due to statement timeout" }));
    expect(r.status).toBe(500);
    expect(log).toHaveBeenCalledOnce();
    log.mockRestore();
  });
});

describe("problemResponse when the database cannot be reached", () => {
  it.each([
    ["the server refuses connections", Object.assign(new Error("connect ECONNREFUSED 127.0.0.1:5432"), { code: "ECONNREFUSED" })],
    ["the server is shutting down (57P01)", drizzleError({ code: "57P01", message: "terminating connection due to administrator command" })],
    ["a pooled connection ended", drizzleError(new Error("Connection terminated unexpectedly"))],
    [
      "the rollback after the connection died inside a transaction",
      Object.assign(new Error("Failed query: rollback\nparams: "), {
        cause: new Error("Client has encountered a connection error and is not queryable"),
      }),
    ],
  ])("is a 503 to retry, not a 500: %s", async (_label, error) => {
    const response = problemResponse(error);
    expect(response.status).toBe(503);
    expect(response.headers.get("retry-after")).toBe("5");
    expect(((await response.json()) as Problem).detail).toMatch(/cannot be reached/);
  });
});
