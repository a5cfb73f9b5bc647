import { getSessionCookie } from "better-auth/cookies";
import { type NextRequest, NextResponse } from "next/server";
import { env } from "@/server/env";
import { newNonce, pageSecurityPolicy } from "@/server/http/content-security-policy";

// Signed-out pages (sign-in, the password links of invitations and resets, one-click unsubscribe)
// and the route handlers, which answer for themselves: no redirect for these.
const OPEN_PATHS = /^\/(api|sign-in|forgot-password|set-password|unsubscribe)/;

// Two jobs, both cheap: the redirect of anonymous visitors (authorisation happens in the access
// door), and the headers that depend on the request or on the configuration — a page's
// Content-Security-Policy with a fresh nonce, and HSTS over https. The fixed headers are in
// next.config.mjs.
export function proxy(request: NextRequest) {
  const { pathname } = request.nextUrl;
  if (!OPEN_PATHS.test(pathname) && !getSessionCookie(request)) {
    return withTransportSecurity(NextResponse.redirect(new URL("/sign-in", request.url)));
  }
  const policy = pageSecurityPolicy({
    nonce: newNonce(),
    development: process.env.NODE_ENV === "development",
    https: isHttps(),
  });
  // Next finds the nonce in the request's policy and puts it on its scripts; the root layout
  // reads the policy the same way for the theme script.
  const requestHeaders = new Headers(request.headers);
  requestHeaders.set("content-security-policy", policy);
  const response = NextResponse.next({ request: { headers: requestHeaders } });
  response.headers.set("content-security-policy", policy);
  return withTransportSecurity(response);
}

function isHttps(): boolean {
  return env().BETTER_AUTH_URL.startsWith("https://");
}

/** HSTS only when Keelson is served over https: over http a browser ignores it anyway. */
function withTransportSecurity(response: NextResponse): NextResponse {
  if (isHttps()) response.headers.set("strict-transport-security", "max-age=31536000; includeSubDomains");
  return response;
}

export const config = {
  // Pages only: not the build's static files (hashed chunks, fonts, the icon), and not the route
  // handlers, which answer for themselves (their fixed headers, `default-src 'none'` included, are
  // in next.config.mjs) — a request through the proxy has its body cut at 10 MB, and a photo may
  // be up to 10 MB plus its form.
  matcher: ["/((?!api/|_next/static|_next/image|favicon.ico|icon.svg|fonts/).*)"],
};
