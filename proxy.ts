// Keeps signed-out visitors out of /app/**: without a session cookie they go to /sign-in?next=<where they were going>.
// Only a cheap cookie check (no database); pages still verify the session through lib/access.ts.
import { NextResponse, type NextRequest } from "next/server";
import { getSessionCookie } from "better-auth/cookies";

export function proxy(request: NextRequest): NextResponse {
  if (getSessionCookie(request)) return NextResponse.next();
  const signIn = new URL("/sign-in", request.url);
  signIn.searchParams.set("next", `${request.nextUrl.pathname}${request.nextUrl.search}`);
  return NextResponse.redirect(signIn);
}

export const config = { matcher: ["/app", "/app/:path*"] };
