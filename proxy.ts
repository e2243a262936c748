/**
 * Two jobs on every request: (1) the Content-Security-Policy, with a fresh nonce for pages
 * (lib/security-headers.ts; nosniff and no-framing headers are in next.config.mjs); (2) a convenience redirect of signed-out visitors of workspace pages to
 * the sign-in page. The redirect is not the permission check: every page, route handler and server
 * action asks the access module (lib/access) itself.
 */
import { NextResponse, type NextFetchEvent, type NextRequest } from "next/server";
import { withAuth, type NextRequestWithAuth } from "next-auth/middleware";
import { API_CSP, contentSecurityPolicy, newNonce } from "@/lib/security-headers";

/** Paths open without a session: the landing page, sign-in, invitation links (a new reviewer has no account yet), the API (handlers answer 401 themselves). */
const OPEN = /^\/($|sign-in(\/|$)|invitations\/|api\/)/;

function withSecurityHeaders(request: NextRequest): NextResponse {
  if (request.nextUrl.pathname.startsWith("/api/")) {
    const response = NextResponse.next();
    response.headers.set("Content-Security-Policy", API_CSP);
    return response;
  }
  const csp = contentSecurityPolicy(newNonce(), { dev: process.env.NODE_ENV === "development" });
  const headers = new Headers(request.headers);
  headers.set("Content-Security-Policy", csp); // Next.js reads the nonce from here and puts it on its scripts
  const response = NextResponse.next({ request: { headers } });
  response.headers.set("Content-Security-Policy", csp);
  return response;
}

const signedInOnly = withAuth((request: NextRequestWithAuth) => withSecurityHeaders(request), { pages: { signIn: "/sign-in" } });

export default function proxy(request: NextRequest, event: NextFetchEvent) {
  if (OPEN.test(request.nextUrl.pathname)) return withSecurityHeaders(request);
  return signedInOnly(request as NextRequestWithAuth, event);
}

export const config = {
  // Everything but Next's static files and our fonts and icons.
  matcher: ["/((?!_next/static|_next/image|favicon|fonts/|.*\\.(?:svg|png|ico|woff2|css|js)$).*)"],
};
