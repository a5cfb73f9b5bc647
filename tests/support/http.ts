// Talking to the running app the way a browser does: sign in, keep the cookie, send Origin.
export const BASE_URL = process.env.KEELSON_TEST_URL ?? "http://127.0.0.1:3000";

export type Session = { cookie: string };

export async function signIn(email: string, password: string): Promise<Session> {
  const response = await fetch(`${BASE_URL}/api/auth/sign-in/email`, {
    method: "POST",
    headers: { "content-type": "application/json", origin: BASE_URL },
    body: JSON.stringify({ email, password }),
  });
  if (!response.ok) throw new Error(`sign-in of ${email} failed: ${response.status} ${await response.text()}`);
  const cookie = response.headers
    .getSetCookie()
    .map((c) => c.split(";")[0])
    .join("; ");
  return { cookie };
}

export type ApiResult<T = unknown> = { status: number; body: T; contentType: string | null };

export async function api<T = unknown>(
  session: Session | null,
  method: string,
  path: string,
  body?: unknown,
): Promise<ApiResult<T>> {
  const response = await fetch(`${BASE_URL}${path}`, {
    method,
    redirect: "manual",
    headers: {
      origin: BASE_URL,
      ...(session ? { cookie: session.cookie } : {}),
      ...(body !== undefined ? { "content-type": "application/json" } : {}),
    },
    body: body === undefined ? undefined : typeof body === "string" ? body : JSON.stringify(body),
  });
  const text = await response.text();
  let parsed: unknown = text;
  try {
    parsed = text ? JSON.parse(text) : null;
  } catch {
    /* not JSON: keep the text */
  }
  return { status: response.status, body: parsed as T, contentType: response.headers.get("content-type") };
}
