// Client-side fetch for route handlers: throws the server's problem+json as a typed error.
import type { Problem } from "@/server/http/problem";

export class ProblemError extends Error {
  constructor(readonly problem: Problem) {
    super(problem.detail);
    this.name = "ProblemError";
  }
}

export async function fetchJson<T>(url: string, init?: RequestInit): Promise<T> {
  const response = await fetch(url, {
    ...init,
    headers: {
      accept: "application/json",
      ...(init?.body ? { "content-type": "application/json" } : {}),
      ...init?.headers,
    },
  });
  const text = await response.text();
  const body: unknown = text ? JSON.parse(text) : null;
  if (!response.ok) {
    const problem =
      body && typeof body === "object" && "detail" in body
        ? (body as Problem)
        : {
            type: "about:blank",
            title: response.statusText,
            status: response.status,
            detail: `The server answered ${response.status}.`,
          };
    // A session that ended while the page was open: a full page load drops the ended session's cache.
    // eslint-disable-next-line @next/next/no-location-assign-relative-destination -- outside React, on purpose
    if (response.status === 401 && typeof window !== "undefined") window.location.href = "/sign-in";
    throw new ProblemError(problem);
  }
  return body as T;
}
