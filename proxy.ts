import { getSessionCookie } from "better-auth/cookies";
import { type NextRequest, NextResponse } from "next/server";

// Only the cheap redirect of anonymous visitors; authorisation happens in the access door.
export function proxy(request: NextRequest) {
  if (!getSessionCookie(request)) {
    const url = new URL("/sign-in", request.url);
    return NextResponse.redirect(url);
  }
  return NextResponse.next();
}

export const config = {
  // Signed-out pages: sign-in, the password links of invitations and resets, one-click unsubscribe.
  matcher: ["/((?!api|_next|sign-in|forgot-password|set-password|unsubscribe|favicon.ico|icon.svg|fonts).*)"],
};
